import { useState, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { cohortNotes } from '@shared/analysis/cohort-words';
import { useCohortResults } from '../api/get-cohort-results';
import { useDeleteExclusion } from '../api/delete-exclusion';
import { useResultsOptions } from '../hooks/use-results-options';
import { ExcludeDialog, type ExcludeTarget } from './exclude-dialog';
import { ExportLinks } from './export-links';
import { ForestPlot } from './forest-plot';
import { measureLabel, sharedT } from './format';
import { Headline } from './headline';
import { ProgressChart } from './progress-chart';
import { ResultsOptions } from './results-options';
import { Sensitivity } from './sensitivity';
import { Subgroups } from './subgroups';
import { ExclusionsList, TrialsTable } from './trials-table';

const parts = [
  { id: 'results-forest', label: 'forest' },
  { id: 'results-trials', label: 'trials' },
  { id: 'results-subgroups', label: 'subgroups' },
  { id: 'results-sensitivity', label: 'sensitivity' },
  { id: 'results-progress', label: 'progress' },
  { id: 'results-downloads', label: 'downloads' },
] as const;

function Part({ id, title, intro, children }: { id: string; title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-heading`} className="space-y-3">
      <h3 id={`${id}-heading`} className="scroll-mt-4" tabIndex={-1}>
        {title}
      </h3>
      {intro ? <div className="max-w-3xl text-sm text-ink-muted">{intro}</div> : null}
      {children}
    </section>
  );
}

/**
 * The cohort's pooled results, for every member: the answer in words, the forest plot, the
 * trials with their quality flags (and, for the lead, exclusions with reasons), what changes the
 * outcome, sensitivity, the season's water, and the CSV downloads. Pseudonyms only.
 */
export function CohortResultsSection({ cohortId, canExclude }: { cohortId: string; canExclude: boolean }) {
  const { t } = useTranslation('cohortResults');
  const { query, measure, set } = useResultsOptions();
  const results = useCohortResults(cohortId, query);
  const include = useDeleteExclusion(cohortId);
  const [excluding, setExcluding] = useState<ExcludeTarget | null>(null);
  const data = results.data;
  const updating = results.isFetching && results.isPlaceholderData;

  // Until a trial is shared there is nothing to pool: a line saying so, no empty section with headings.
  if (results.isPending) {
    return (
      <p role="status" className="text-ink-muted">
        {t(($) => $.loading)}
      </p>
    );
  }
  if (results.isSuccess && results.data.trials.length === 0) {
    return (
      <Card className="bg-sand-50">
        <p className="text-ink-muted">
          <strong className="font-semibold text-ink">{t(($) => $.noneShared)}</strong> {t(($) => $.noneSharedBody)}
        </p>
      </Card>
    );
  }

  let body: ReactNode;
  if (results.isError) {
    body = <Alert tone="error">{t(($) => $.loadError, { message: results.error.message })}</Alert>;
  } else {
    const r = data!;
    body = (
      <div className="space-y-8">
        {/* The answer first; the switches that change it right below. */}
        <Headline results={r} />
        <Card role="group" aria-label={t(($) => $.howPooled)} className="bg-sand-50">
          <ResultsOptions query={query} measure={measure} results={r} onChange={set} />
        </Card>

        <nav aria-label={t(($) => $.partsNav)} className="text-sm">
          <ul className="flex flex-wrap gap-x-4 gap-y-1">
            {parts.map((p) => (
              <li key={p.id}>
                <a className="inline-flex min-h-10 items-center font-medium text-terracotta-700 underline" href={`#${p.id}-heading`}>
                  {t(($) => $.parts[p.label])}
                </a>
              </li>
            ))}
          </ul>
        </nav>

        <Part id="results-forest" title={t(($) => $.forestTitle, { measure: measureLabel(measure) })}>
          <ForestPlot results={r} effect={measure} />
        </Part>

        <Part
          id="results-trials"
          title={t(($) => $.trialsTitle)}
          intro={
            <>
              {t(($) => $.trialsIntro)} {canExclude ? t(($) => $.trialsIntroLead) : ''}
            </>
          }
        >
          <TrialsTable
            results={r}
            measure={measure}
            actions={
              canExclude
                ? {
                    onExclude: setExcluding,
                    onInclude: (trialId) => include.mutate(trialId),
                    includingId: include.isPending ? (include.variables ?? null) : null,
                  }
                : null
            }
          />
          {include.isError ? <Alert tone="error">{t(($) => $.includeError, { message: include.error.message })}</Alert> : null}
          <h4 className="pt-2 font-semibold">{t(($) => $.leftOutHeading)}</h4>
          <ExclusionsList results={r} />
        </Part>

        <Part id="results-subgroups" title={t(($) => $.subgroupsTitle, { measure: measureLabel(measure, true) })}>
          <Subgroups results={r} effect={measure} />
        </Part>

        <Part id="results-sensitivity" title={t(($) => $.sensitivityTitle)}>
          <Sensitivity results={r} effect={measure} />
        </Part>

        <Part
          id="results-progress"
          title={t(($) => $.progressTitle)}
          intro={t(($) => $.progressIntro)}
        >
          <ProgressChart results={r} />
        </Part>

        <Part id="results-downloads" title={t(($) => $.downloadsTitle)}>
          <ExportLinks cohortId={cohortId} />
        </Part>

        <details className="rounded-card border border-sand-200 bg-white p-4 text-sm">
          <summary className="cursor-pointer font-medium text-terracotta-700">{t(($) => $.howMade)}</summary>
          <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-muted">
            {cohortNotes(r, sharedT()).map((n) => (
              <li key={n}>{n}</li>
            ))}
            <li>{t(($) => $.howMadeNotes.singlePairs)}</li>
            <li>{t(($) => $.howMadeNotes.subgroups)}</li>
            <li>{t(($) => $.howMadeNotes.flags)}</li>
          </ul>
        </details>
      </div>
    );
  }

  return (
    <section aria-labelledby="pooled-heading" aria-busy={updating || undefined} className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="pooled-heading">{t(($) => $.heading)}</h2>
        {updating ? (
          <p role="status" className="text-sm text-ink-muted">
            {t(($) => $.updating)}
          </p>
        ) : null}
      </div>
      {body}
      {canExclude ? <ExcludeDialog cohortId={cohortId} target={excluding} onClose={() => setExcluding(null)} /> : null}
    </section>
  );
}
