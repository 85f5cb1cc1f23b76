import type { ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { effectKeys, type CohortResults, type CohortResultsQuery, type EffectKey } from '@shared/schemas/cohort-results';
import { Choice, ChoiceGroup } from '@/components/ui/choice-group';
import type { ResultsOptionsPatch } from '../hooks/use-results-options';
import { measureHint, measureLabel } from './format';

function Toggle({ label, hint, checked, onChange }: { label: string; hint: ReactNode; checked: boolean; onChange: (v: boolean) => void }) {
  return (
    <label className="flex min-h-12 cursor-pointer items-start gap-3 rounded-lg border border-sand-300 bg-white px-3 py-2.5 hover:bg-sand-50 has-[:checked]:border-terracotta-500 has-[:checked]:bg-terracotta-50 has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-terracotta-300">
      <input type="checkbox" className="mt-1 size-4 shrink-0 accent-terracotta-600" checked={checked} onChange={(e) => onChange(e.target.checked)} />
      <span>
        <span className="block font-medium text-ink">{label}</span>
        <span className="block text-sm text-ink-muted">{hint}</span>
      </span>
    </label>
  );
}

/** How the trials are pooled (method, which trials) and which measure the details below show. */
export function ResultsOptions({
  query,
  measure,
  results,
  onChange,
}: {
  query: CohortResultsQuery;
  measure: EffectKey;
  results: CohortResults | undefined;
  onChange: (patch: ResultsOptionsPatch) => void;
}) {
  const { t } = useTranslation('cohortResults');
  const singles = results?.effects.waterLogRatio.singlePairs.eligible ?? 0;
  const flagged = results?.counts.flagged ?? 0;
  return (
    <div className="grid gap-4 lg:grid-cols-3">
      <ChoiceGroup legend={t(($) => $.options.tau)}>
        <Choice
          name="method"
          value="DL"
          label="DerSimonian-Laird"
          hint={t(($) => $.options.dlHint)}
          checked={query.method === 'DL'}
          onChange={() => onChange({ method: 'DL' })}
        />
        <Choice
          name="method"
          value="REML"
          label="REML"
          hint={t(($) => $.options.remlHint)}
          checked={query.method === 'REML'}
          onChange={() => onChange({ method: 'REML' })}
        />
      </ChoiceGroup>
      <fieldset className="space-y-2">
        <legend className="mb-1 block text-sm font-medium text-ink">{t(($) => $.options.which)}</legend>
        <Toggle
          label={t(($) => $.options.singles)}
          hint={`${singles ? t(($) => $.options.singlesHas, { count: singles }) : t(($) => $.options.singlesNone)} ${t(($) => $.options.singlesHint)}`}
          checked={query.includeSinglePairs}
          onChange={(v) => onChange({ includeSinglePairs: v })}
        />
        <Toggle
          label={t(($) => $.options.flagged)}
          hint={`${flagged ? t(($) => $.options.flaggedHas, { count: flagged }) : t(($) => $.options.flaggedNone)} ${t(($) => $.options.flaggedHint)}`}
          checked={query.excludeFlagged}
          onChange={(v) => onChange({ excludeFlagged: v })}
        />
      </fieldset>
      <ChoiceGroup legend={t(($) => $.options.details)}>
        {effectKeys.map((k) => (
          <Choice
            key={k}
            name="measure"
            value={k}
            label={measureLabel(k)}
            hint={measureHint(k)}
            checked={measure === k}
            onChange={() => onChange({ measure: k })}
          />
        ))}
      </ChoiceGroup>
    </div>
  );
}
