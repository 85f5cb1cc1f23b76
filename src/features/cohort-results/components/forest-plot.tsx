import type { VisualizationSpec } from 'vega-embed';
import { effectAxis, forestPlotSpec, forestTitle, trialLabels } from '@shared/charts/cohort-charts';
import type { CohortResults, EffectKey, PooledEstimate } from '@shared/schemas/cohort-results';
import { Chart } from '@/components/charts/chart';
import { useUnits } from '@/lib/units';
import { useElementWidth } from '../hooks/use-element-width';
import { heterogeneitySentence, measureLabels, num, pValue, plural } from './format';

const th = 'px-3 py-2 text-right font-medium';
const td = 'num whitespace-nowrap px-3 py-2';

function Heterogeneity({ p, effect, unit, convert }: { p: PooledEstimate; effect: EffectKey; unit: string; convert: (v: number) => number }) {
  const logScale = effect !== 'harvestPerPlantDiff';
  const tau = Math.sqrt(p.tau2);
  // On the log scale τ reads as a typical factor between gardens' true ratios; on the kg scale it is kg per plant.
  const tauWords = logScale
    ? `τ = ${num(tau, 3)}: a typical garden’s true ratio sits within a factor of about ${num(Math.exp(tau), 2)} of the pooled one.`
    : `τ = ${num(convert(tau), 3)} ${unit} per plant: the typical spread of gardens’ true differences around the pooled one.`;
  return (
    <div className="space-y-2 rounded-lg border border-sand-200 bg-sand-50 p-4" role="group" aria-labelledby="heterogeneity-heading">
      <h4 id="heterogeneity-heading" className="font-semibold">
        How much the gardens differ
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
          <dd className="font-medium tabular-nums">{num(p.i2, 1)} %</dd>
        </div>
        <div>
          <dt className="text-ink-muted">τ² {logScale ? '(log scale)' : `(${unit}²)`}</dt>
          <dd className="font-medium tabular-nums">{num(logScale ? p.tau2 : convert(tau) ** 2, 4)}</dd>
        </div>
      </dl>
      <p className="text-sm text-ink-muted">
        {tauWords} τ² by {p.method === 'DL' ? 'DerSimonian-Laird' : 'REML'}
        {p.method === 'REML' && !p.converged ? ' — REML did not converge, so read τ² with care or switch to DerSimonian-Laird' : ''}.
        {p.k < 10 ? ` With only ${p.k} trials, I² and τ² are themselves uncertain.` : ''}
      </p>
    </div>
  );
}

/** The forest plot of one measure with its table alternative and the heterogeneity in words. */
export function ForestPlot({ results, effect }: { results: CohortResults; effect: EffectKey }) {
  const units = useUnits();
  const e = results.effects[effect];
  const axis = effectAxis(effect, { units: units.system });
  const [ref, width] = useElementWidth<HTMLDivElement>();
  // Below about 560 px the row labels go on two lines so the intervals keep some width.
  const compact = width !== null && width < 560;
  const spec = forestPlotSpec(results, effect, { units: units.system, width: 'container', compact });
  const labels = trialLabels(results);
  const conf = Math.round(results.options.confidence * 100);
  const digits = axis.unit === '%' ? 0 : 2;
  const v = (x: number) => `${num(axis.convert(x), digits)}${axis.unit === '%' ? ' %' : ` ${axis.unit}`}`;
  const iv = (ci: readonly [number, number]) => `${num(axis.convert(ci[0]), digits)} to ${num(axis.convert(ci[1]), digits)}`;
  const p = e.pooled;

  if (!spec) {
    return (
      <div ref={ref}>
        <p className="text-ink-muted">
          No trial has a {measureLabels[effect].toLowerCase()} result yet: it needs at least two pairs with records on both beds.
        </p>
      </div>
    );
  }
  const takeaway = p
    ? `Each square is one trial (bigger = more weight) with its ${conf} % confidence interval; the diamond is the pooled estimate, ${v(p.display.estimate)} (${iv(p.display.ci)})${
        p.display.predictionInterval ? `; the dashed line is where one new garden would likely fall, ${iv(p.display.predictionInterval)}` : ''
      }.`
    : `Each square is one trial with its ${conf} % confidence interval. ${e.reason ?? ''}`;
  // The same order as the chart: largest effect first.
  const forestRows = [...e.forest].sort((a, b) => b.display.estimate - a.display.estimate);

  return (
    <div ref={ref} className="space-y-4">
      <Chart
        title={forestTitle(effect)}
        takeaway={takeaway}
        spec={spec as VisualizationSpec}
        fileName={`cohort-forest-${effect}`}
        alternative={
          <table className="w-full text-sm">
            <caption className="sr-only">
              {measureLabels[effect]} per trial and pooled ({axis.unit === '%' ? '%' : axis.unit})
            </caption>
            <thead className="text-ink-muted">
              <tr>
                <th scope="col" className="px-3 py-2 text-left font-medium">
                  Trial
                </th>
                <th scope="col" className={th}>
                  Pairs
                </th>
                <th scope="col" className={th}>
                  Estimate
                </th>
                <th scope="col" className={th}>
                  {conf} % CI
                </th>
                <th scope="col" className={th}>
                  Weight
                </th>
                <th scope="col" className="px-3 py-2 text-left font-medium">
                  Note
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
                  <td className={td}>{f.weightPercent === null ? '—' : `${num(f.weightPercent, 1)} %`}</td>
                  <td className="min-w-44 px-3 py-2 text-ink-muted">
                    {[f.flagged ? 'quality flag' : null, f.source === 'season-totals' ? 'single pair, borrowed variance' : null].filter(Boolean).join('; ') ||
                      '—'}
                  </td>
                </tr>
              ))}
              {p ? (
                <tr className="border-t-2 border-sand-300 font-semibold">
                  <th scope="row" className="px-3 py-2 text-left">
                    Pooled estimate ({plural(p.k, 'trial')})
                  </th>
                  <td className={td}>—</td>
                  <td className={td}>{v(p.display.estimate)}</td>
                  <td className={td}>{iv(p.display.ci)}</td>
                  <td className={td}>100 %</td>
                  <td className="px-3 py-2 font-normal text-ink-muted">random effects, {p.method}</td>
                </tr>
              ) : null}
              {p?.display.predictionInterval ? (
                <tr className="border-t border-sand-100">
                  <th scope="row" className="px-3 py-2 text-left font-medium">
                    Prediction interval
                  </th>
                  <td className={td}>—</td>
                  <td className={td}>—</td>
                  <td className={td}>{iv(p.display.predictionInterval)}</td>
                  <td className={td}>—</td>
                  <td className="min-w-44 px-3 py-2 text-ink-muted">where one new garden would likely fall</td>
                </tr>
              ) : null}
            </tbody>
          </table>
        }
      />
      {p ? <Heterogeneity p={p} effect={effect} unit={axis.unit} convert={axis.convert} /> : <p className="text-ink-muted">{e.reason}</p>}
    </div>
  );
}
