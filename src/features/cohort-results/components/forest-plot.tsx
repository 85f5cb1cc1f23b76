import { useTranslation } from 'react-i18next';
import type { VisualizationSpec } from 'vega-embed';
import { effectAxis, forestPlotSpec, forestTitle, forestTrials, trialLabels } from '@shared/charts/cohort-charts';
import { noPooledReason } from '@shared/analysis/cohort-words';
import type { CohortResults, EffectKey, PooledEstimate } from '@shared/schemas/cohort-results';
import { Chart } from '@/components/charts/chart';
import { useUnits } from '@/lib/units';
import { useElementWidth } from '../hooks/use-element-width';
import { heterogeneitySentence, measureLabel, num, pValue, sharedT, trials } from './format';

const th = 'px-3 py-2 text-right font-medium';
const td = 'num whitespace-nowrap px-3 py-2';

function Heterogeneity({ p, effect, unit, convert }: { p: PooledEstimate; effect: EffectKey; unit: string; convert: (v: number) => number }) {
  const { t } = useTranslation('cohortResults');
  const logScale = effect !== 'harvestPerPlantDiff';
  const tau = Math.sqrt(p.tau2);
  // On the log scale τ reads as a typical factor between gardens' true ratios; on the kg scale it is kg per plant.
  const tauWords = logScale
    ? t(($) => $.forest.tauLog, { tau: num(tau, 3), factor: num(Math.exp(tau), 2) })
    : t(($) => $.forest.tauKg, { tau: num(convert(tau), 3), unit });
  return (
    <div className="space-y-2 rounded-lg border border-sand-200 bg-sand-50 p-4" role="group" aria-labelledby="heterogeneity-heading">
      <h4 id="heterogeneity-heading" className="font-semibold">
        {t(($) => $.forest.hetHeading)}
      </h4>
      <p>{heterogeneitySentence(p)}</p>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-5">
        <div>
          <dt className="text-ink-muted">Cochran’s Q</dt>
          <dd className="font-medium tabular-nums">{num(p.q, 2)}</dd>
        </div>
        <div>
          <dt className="text-ink-muted">df</dt>
          <dd className="font-medium tabular-nums">{p.df}</dd>
        </div>
        <div>
          <dt className="text-ink-muted">p (Q)</dt>
          <dd className="font-medium tabular-nums">{pValue(p.pQ)}</dd>
        </div>
        <div>
          <dt className="text-ink-muted">I²</dt>
          <dd className="font-medium tabular-nums">{num(p.i2, 1)}&nbsp;%</dd>
        </div>
        <div>
          <dt className="text-ink-muted">τ² {logScale ? t(($) => $.forest.logScale) : `(${unit}²)`}</dt>
          <dd className="font-medium tabular-nums">{num(logScale ? p.tau2 : convert(tau) ** 2, 4)}</dd>
        </div>
      </dl>
      <p className="text-sm text-ink-muted">
        {tauWords} {t(($) => $.forest.tauBy, { method: p.method === 'DL' ? 'DerSimonian-Laird' : 'REML' })}
        {p.method === 'REML' && !p.converged ? t(($) => $.forest.remlNotConverged) : ''}.
        {p.k < 10 ? t(($) => $.forest.fewK, { k: String(p.k) }) : ''}
      </p>
    </div>
  );
}

/** The forest plot of one measure with its table alternative and the heterogeneity in words. */
export function ForestPlot({ results, effect }: { results: CohortResults; effect: EffectKey }) {
  const units = useUnits();
  const { t } = useTranslation('cohortResults');
  const st = sharedT();
  const e = results.effects[effect];
  const axis = effectAxis(effect, { units: units.system, t: st });
  const [ref, width] = useElementWidth<HTMLDivElement>();
  // Below about 560 px the row labels go on two lines so the intervals keep some width.
  const compact = width !== null && width < 560;
  const spec = forestPlotSpec(results, effect, { units: units.system, width: 'container', compact, t: st });
  const labels = trialLabels(results, st);
  const conf = Math.round(results.options.confidence * 100);
  const digits = axis.unit === '%' ? 0 : 2;
  const v = (x: number) => `${num(axis.convert(x), digits)}\u00a0${axis.unit}`;
  const iv = (ci: readonly [number, number]) => t(($) => $.range, { lo: num(axis.convert(ci[0]), digits), hi: num(axis.convert(ci[1]), digits) });
  const p = e.pooled;

  if (!spec) {
    return (
      <div ref={ref}>
        <p className="text-ink-muted">
          {t(($) => $.forest.none, { measure: measureLabel(effect, true) })}
        </p>
      </div>
    );
  }
  const takeaway = p
    ? p.display.predictionInterval
      ? t(($) => $.forest.takeawayPi, { confidence: conf, estimate: v(p.display.estimate), ci: iv(p.display.ci), pi: iv(p.display.predictionInterval) })
      : t(($) => $.forest.takeaway, { confidence: conf, estimate: v(p.display.estimate), ci: iv(p.display.ci) })
    : `${t(($) => $.forest.takeawayNone, { confidence: conf })} ${noPooledReason(e, st) ?? ''}`;
  // The same order as the chart: largest effect first.
  const forestRows = forestTrials(results, effect).sort((a, b) => b.display.estimate - a.display.estimate);

  return (
    <div ref={ref} className="space-y-4">
      <Chart
        title={forestTitle(effect, st)}
        takeaway={takeaway}
        spec={spec as VisualizationSpec}
        fileName={`cohort-forest-${effect}`}
        alternative={
          <table className="w-full text-sm">
            <caption className="sr-only">
              {t(($) => $.forest.caption, { measure: measureLabel(effect), unit: axis.unit })}
            </caption>
            <thead className="text-ink-muted">
              <tr>
                <th scope="col" className="px-3 py-2 text-left font-medium">
                  {t(($) => $.forest.trial)}
                </th>
                <th scope="col" className={th}>
                  {t(($) => $.forest.pairs)}
                </th>
                <th scope="col" className={th}>
                  {t(($) => $.forest.estimate)}
                </th>
                <th scope="col" className={th}>
                  {t(($) => $.forest.ci, { confidence: conf })}
                </th>
                <th scope="col" className={th}>
                  {t(($) => $.forest.weight)}
                </th>
                <th scope="col" className="px-3 py-2 text-left font-medium">
                  {t(($) => $.forest.note)}
                </th>
              </tr>
            </thead>
            <tbody>
              {forestRows.map((f) => (
                <tr key={f.trialId} className="border-t border-sand-100">
                  <th scope="row" className="px-3 py-2 text-left font-medium">
                    {labels[f.trialId] ?? f.pseudonym}
                  </th>
                  <td className={td}>{f.pairs}</td>
                  <td className={td}>{v(f.display.estimate)}</td>
                  <td className={td}>{iv(f.display.ci)}</td>
                  <td className={td}>{f.weightPercent === null ? '—' : `${num(f.weightPercent, 1)}\u00a0%`}</td>
                  <td className="min-w-44 px-3 py-2 text-ink-muted">
                    {[f.flagged ? t(($) => $.forest.flag) : null, f.source === 'season-totals' ? t(($) => $.forest.borrowed) : null].filter(Boolean).join('; ') ||
                      '—'}
                  </td>
                </tr>
              ))}
              {p ? (
                <tr className="border-t-2 border-sand-300 font-semibold">
                  <th scope="row" className="px-3 py-2 text-left">
                    {t(($) => $.forest.pooled, { trials: trials(p.k) })}
                  </th>
                  <td className={td}>—</td>
                  <td className={td}>{v(p.display.estimate)}</td>
                  <td className={td}>{iv(p.display.ci)}</td>
                  <td className={td}>{num(100)}&nbsp;%</td>
                  <td className="px-3 py-2 font-normal text-ink-muted">{t(($) => $.forest.randomEffects, { method: p.method })}</td>
                </tr>
              ) : null}
              {p?.display.predictionInterval ? (
                <tr className="border-t border-sand-100">
                  <th scope="row" className="px-3 py-2 text-left font-medium">
                    {t(($) => $.forest.prediction)}
                  </th>
                  <td className={td}>—</td>
                  <td className={td}>—</td>
                  <td className={td}>{iv(p.display.predictionInterval)}</td>
                  <td className={td}>—</td>
                  <td className="min-w-44 px-3 py-2 text-ink-muted">{t(($) => $.forest.predictionNote)}</td>
                </tr>
              ) : null}
            </tbody>
          </table>
        }
      />
      {p ? <Heterogeneity p={p} effect={effect} unit={axis.unit} convert={axis.convert} /> : <p className="text-ink-muted">{noPooledReason(e, st)}</p>}
    </div>
  );
}
