import { useTranslation } from 'react-i18next';
import { trialLabels } from '@shared/charts/cohort-charts';
import type { CohortResults, CohortTrialRow, EffectKey } from '@shared/schemas/cohort-results';
import { Button } from '@/components/ui/button';
import { formatDate } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { measureLabel, num, sharedT } from './format';
import { flagWords, soilLabel, whyNotPooled } from './labels';

export interface TrialActions {
  onExclude: (trial: { trialId: string; label: string }) => void;
  onInclude: (trialId: string) => void;
  /** The trial being put back, while it is. */
  includingId: string | null;
}

function Flags({ t }: { t: CohortTrialRow }) {
  const { t: tr } = useTranslation('cohortResults');
  if (!t.flags.length) return <span className="text-ink-muted">{tr(($) => $.table.none)}</span>;
  return (
    <ul className="space-y-1">
      {t.flags.map((f, i) => {
        const w = flagWords(f);
        return (
          <li key={`${f.kind}-${f.effect ?? ''}-${i}`}>
            <details>
              <summary className="cursor-pointer font-medium text-terracotta-800">{w.title}</summary>
              <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-muted">
                {w.details.map((d) => (
                  <li key={d}>{d}</li>
                ))}
              </ul>
            </details>
          </li>
        );
      })}
    </ul>
  );
}

function Pooled({ t, measure, options }: { t: CohortTrialRow; measure: EffectKey; options: CohortResults['options'] }) {
  const { t: tr } = useTranslation('cohortResults');
  const why = whyNotPooled(t, measure, options);
  if (t.exclusion) {
    return (
      <span>
        <span className="font-medium text-red-800">{tr(($) => $.table.leftOut)}</span>
        <span className="block text-ink-muted">“{t.exclusion.reason}”</span>
      </span>
    );
  }
  return why ? (
    <span className="text-ink-muted">{why}</span>
  ) : (
    <span className="font-medium text-sage-800">
      {tr(($) => $.table.yes)}
      {t.effects[measure].source === 'season-totals' ? tr(($) => $.table.singlePair) : ''}
    </span>
  );
}

function Action({ t, label, actions }: { t: CohortTrialRow; label: string; actions: TrialActions }) {
  // One button whose words change, so focus stays on it after leaving out or putting back.
  const { t: tr } = useTranslation('cohortResults');
  const excluded = t.exclusion !== null;
  const busy = actions.includingId === t.trialId;
  return (
    <Button
      variant="secondary"
      size="md"
      className="min-w-28 whitespace-nowrap"
      aria-label={excluded ? tr(($) => $.table.putBackLabel, { label }) : tr(($) => $.table.leaveOutLabel, { label })}
      disabled={busy}
      onClick={() => (excluded ? actions.onInclude(t.trialId) : actions.onExclude({ trialId: t.trialId, label }))}
    >
      {busy ? tr(($) => $.table.puttingBack) : excluded ? tr(($) => $.table.putBack) : tr(($) => $.table.leaveOut)}
    </Button>
  );
}

/**
 * Every shared trial: who (pseudonym), crop, coarse region, pots, pairs, how complete the records
 * are, quality flags in words, and whether it counts. A table on wide screens, one card per trial
 * on a phone. The lead leaves trials out (with a reason) and puts them back here.
 */
export function TrialsTable({ results, measure, actions }: { results: CohortResults; measure: EffectKey; actions: TrialActions | null }) {
  const units = useUnits();
  const { t: tr } = useTranslation('cohortResults');
  const labels = trialLabels(results, sharedT());
  // Capacities as a range ("6–8 L"): a list of near-equal sizes reads as noise, and rounding could repeat one.
  const pots = (t: CohortTrialRow) => {
    if (t.potCount === 0 || t.potCapacitiesL.length === 0) return tr(($) => $.table.noPots);
    const digits = units.system === 'us' ? 1 : 0;
    const lo = units.show(Math.min(...t.potCapacitiesL), 'volume');
    const hi = units.show(Math.max(...t.potCapacitiesL), 'volume');
    const size = num(lo, digits) === num(hi, digits) ? num(lo, digits) : `${num(lo, digits)}–${num(hi, digits)}`;
    return `${tr(($) => $.table.pots, { count: t.potCount })} · ${size}\u00a0${units.label('volume')}`;
  };
  const records = (t: CohortTrialRow) => {
    const c = t.completeness;
    return {
      water: `${tr(($) => $.table.waterDays, { days: num(c.daysWithWater), expected: num(c.expectedDays) })}${c.share === null ? '' : `\u00a0(${num(c.share * 100)}\u00a0%)`}`,
      harvest: `${tr(($) => $.table.harvestRecords, { count: c.harvestRecords })}${c.pairsMissingHarvest ? tr(($) => $.table.pairsMissing, { count: c.pairsMissingHarvest }) : ''}`,
    };
  };
  const pooledHeading = tr(($) => $.table.inEstimate, { measure: measureLabel(measure, true) });

  return (
    <>
      <div className="hidden overflow-x-auto rounded-card border border-sand-200 bg-white md:block">
        <table className="w-full text-sm">
          <caption className="sr-only">{tr(($) => $.table.caption)}</caption>
          <thead className="bg-sand-100 text-left">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">
                {tr(($) => $.table.trial)}
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                {tr(($) => $.table.regionSoil)}
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                {tr(($) => $.table.potsHeading)}
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                {tr(($) => $.table.pairs)}
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                {tr(($) => $.table.daysWithWater)}
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                {tr(($) => $.table.flags)}
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                {pooledHeading}
              </th>
              {actions ? (
                <th scope="col" className="px-3 py-2 font-medium">
                  <span className="sr-only">{tr(($) => $.table.leadAction)}</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {results.trials.map((t) => {
              const r = records(t);
              return (
                <tr key={t.trialId} className="border-t border-sand-100 align-top">
                  <th scope="row" className="px-3 py-2 text-left font-medium">
                    {labels[t.trialId]}
                    {t.mine ? <span className="ml-2 rounded bg-terracotta-50 px-1.5 py-0.5 text-xs font-medium text-terracotta-800">{tr(($) => $.table.yours)}</span> : null}
                    <span className="block font-normal text-ink-muted">
                      {tr(($) => $.table.planted, { date: formatDate(t.plantingDate) })}
                      {t.status === 'closed' ? tr(($) => $.table.closed) : ''}
                    </span>
                  </th>
                  <td className="px-3 py-2">
                    <span className="whitespace-nowrap">{t.region.label}</span>
                    <span className="block text-ink-muted">{soilLabel(t.soilTexture)}</span>
                  </td>
                  <td className="whitespace-nowrap px-3 py-2">{pots(t)}</td>
                  <td className="num px-3 py-2">{t.pairs}</td>
                  <td className="px-3 py-2">
                    {r.water}
                    <span className="block text-ink-muted">{r.harvest}</span>
                  </td>
                  <td className="px-3 py-2">
                    <Flags t={t} />
                  </td>
                  <td className="px-3 py-2">
                    <Pooled t={t} measure={measure} options={results.options} />
                  </td>
                  {actions ? (
                    <td className="px-3 py-2">
                      <Action t={t} label={labels[t.trialId]!} actions={actions} />
                    </td>
                  ) : null}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>

      <ul className="space-y-3 md:hidden" aria-label={tr(($) => $.table.caption)}>
        {results.trials.map((t) => {
          const r = records(t);
          return (
            <li key={t.trialId} className="space-y-2 rounded-card border border-sand-200 bg-white p-4">
              <p className="font-semibold">
                {labels[t.trialId]}
                {t.mine ? <span className="ml-2 rounded bg-terracotta-50 px-1.5 py-0.5 text-xs font-medium text-terracotta-800">{tr(($) => $.table.yours)}</span> : null}
              </p>
              <dl className="grid grid-cols-[minmax(0,2fr)_minmax(0,3fr)] gap-x-3 gap-y-1.5 text-sm">
                <dt className="text-ink-muted">{tr(($) => $.table.plantedHeading)}</dt>
                <dd>
                  {formatDate(t.plantingDate)}
                  {t.status === 'closed' ? tr(($) => $.table.closed) : ''}
                </dd>
                <dt className="text-ink-muted">{tr(($) => $.table.regionSoil)}</dt>
                <dd>
                  {t.region.label} · {soilLabel(t.soilTexture)}
                </dd>
                <dt className="text-ink-muted">{tr(($) => $.table.potsHeading)}</dt>
                <dd>{pots(t)}</dd>
                <dt className="text-ink-muted">{tr(($) => $.table.pairs)}</dt>
                <dd>{t.pairs}</dd>
                <dt className="text-ink-muted">{tr(($) => $.table.waterLogged)}</dt>
                <dd>
                  {r.water}
                  <span className="block text-ink-muted">{r.harvest}</span>
                </dd>
                <dt className="text-ink-muted">{tr(($) => $.table.flags)}</dt>
                <dd>
                  <Flags t={t} />
                </dd>
                <dt className="text-ink-muted">{pooledHeading}</dt>
                <dd>
                  <Pooled t={t} measure={measure} options={results.options} />
                </dd>
              </dl>
              {actions ? <Action t={t} label={labels[t.trialId]!} actions={actions} /> : null}
            </li>
          );
        })}
      </ul>
    </>
  );
}

/** The lead's exclusions with their reasons, for everyone in the cohort. */
export function ExclusionsList({ results }: { results: CohortResults }) {
  const { t: tr } = useTranslation('cohortResults');
  const labels = trialLabels(results, sharedT());
  if (!results.exclusions.length) return <p className="text-sm text-ink-muted">{tr(($) => $.table.noExclusions)}</p>;
  return (
    <ul className="space-y-2">
      {results.exclusions.map((x) => (
        <li key={x.trialId} className="rounded-lg border border-sand-200 bg-white px-3 py-2 text-sm">
          <span className="font-medium">{labels[x.trialId] ?? x.pseudonym}</span>,{' '}
          {x.excludedByMe ? tr(($) => $.table.excludedByYou, { date: formatDate(x.createdAt) }) : tr(($) => $.table.excludedByLead, { date: formatDate(x.createdAt) })}: <q>{x.reason}</q>
        </li>
      ))}
    </ul>
  );
}
