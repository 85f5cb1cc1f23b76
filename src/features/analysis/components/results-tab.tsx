import type { VisualizationSpec } from 'vega-embed';
import { describeComparison } from '@shared/analysis/narrative';
import { pairedSampleSize } from '@shared/analysis/power';
import type { Comparison, PairedMetric } from '@shared/analysis/trial-analysis';
import { cumulativeWaterSpec, harvestVsWaterSpec, moistureSpec, pairedDifferenceSpec, weeklyNeedSpec } from '@shared/charts/trial-charts';
import { Chart } from '@/components/charts/chart';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { useUnits } from '@/lib/units';
import { useTrialAnalysis, type TrialAnalysisResponse } from '../api/get-trial-analysis';

const fmt = (v: number | null | undefined, digits = 2) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : new Intl.NumberFormat(undefined, { maximumFractionDigits: digits }).format(v));
const pFmt = (p: number) => (!Number.isFinite(p) ? '—' : p < 0.001 ? '< 0.001' : p.toFixed(3));

function MetricRow({ label, m, show }: { label: string; m: PairedMetric; show: (v: number) => string }) {
  if (m.kind === 'descriptive') {
    return (
      <tr className="border-t border-sand-100">
        <th scope="row" className="px-3 py-2 text-left font-medium">
          {label}
        </th>
        <td className="num px-3 py-2">{m.n}</td>
        <td className="px-3 py-2 text-ink-muted" colSpan={5}>
          {m.description ? `Difference ${show(m.description.meanDifference)}. ` : ''}
          {m.reason}
        </td>
      </tr>
    );
  }
  const r = m.result;
  if (r.constantDifferences) {
    return (
      <tr className="border-t border-sand-100">
        <th scope="row" className="px-3 py-2 text-left font-medium">
          {label}
        </th>
        <td className="num px-3 py-2">{r.n}</td>
        <td className="num px-3 py-2">{show(r.meanDifference)}</td>
        <td className="px-3 py-2 text-ink-muted" colSpan={4}>
          Every pair differs by the same amount: no spread between pairs, so no test or interval.
        </td>
      </tr>
    );
  }
  return (
    <tr className="border-t border-sand-100">
      <th scope="row" className="px-3 py-2 text-left font-medium">
        {label}
      </th>
      <td className="num px-3 py-2">{r.n}</td>
      <td className="num px-3 py-2">{show(r.meanDifference)}</td>
      <td className="num px-3 py-2">
        {show(r.ci[0])} … {show(r.ci[1])}
      </td>
      <td className="num px-3 py-2">{pFmt(r.pValue)}</td>
      <td className="num px-3 py-2">
        {pFmt(r.wilcoxon.pValue)}
        {r.wilcoxon.exact ? '' : ' ≈'}
      </td>
      <td className="num px-3 py-2">{fmt(r.effectSizeDz)}</td>
    </tr>
  );
}

function ComparisonBlock({ c, data }: { c: Comparison; data: TrialAnalysisResponse }) {
  const units = useUnits();
  const lang = 'en';
  const sentences = describeComparison(c, { lang, units: units.system });
  const depth = (mm: number) => units.fmt(mm, 'length-small', units.system === 'us' ? 2 : 0);
  const perArea = (kg: number) => (units.system === 'us' ? `${fmt((kg / 0.45359237) * 0.09290304, 3)} lb/ft²` : `${fmt(kg, 2)} kg/m²`);
  const water = c.metrics.waterMm;
  const sdForPlan = water.kind === 'test' && !water.result.constantDifferences && water.result.sdDifference > 0 ? water.result.sdDifference : null;
  const controlDepth = data.treatments.find((t) => t.treatment === c.control)?.depthMm ?? 0;
  const pairsFor20 = sdForPlan && controlDepth > 0 ? pairedSampleSize({ meanDifference: 0.2 * controlDepth, sdDifference: sdForPlan }) : null;

  const diffSpec = pairedDifferenceSpec(data, { units: units.system, width: 'container' }, data.comparisons.indexOf(c));

  return (
    <section className="space-y-4" aria-label={`${c.treatment} against ${c.control}`}>
      <Card className="space-y-2 border-terracotta-200 bg-terracotta-50/40">
        <h2>
          {c.treatment === 'olla' ? 'Pots' : c.treatment} against {c.control === 'surface' ? 'surface watering' : c.control}
        </h2>
        {sentences.map((s) => (
          <p key={s}>{s}</p>
        ))}
      </Card>
      <div className="grid gap-3 sm:grid-cols-3">
        <Card>
          <p className="text-sm text-ink-muted">Water saved (season, by depth)</p>
          <p className="text-3xl font-semibold">{c.waterSavingPercent === null ? '—' : `${fmt(c.waterSavingPercent, 0)} %`}</p>
        </Card>
        <Card>
          <p className="text-sm text-ink-muted">Harvest ratio ({c.treatment} / {c.control}, per area)</p>
          <p className="text-3xl font-semibold">{c.harvestRatio === null ? '—' : fmt(c.harvestRatio, 2)}</p>
        </Card>
        <Card>
          <p className="text-sm text-ink-muted">Water-use efficiency ratio</p>
          <p className="text-3xl font-semibold">{c.wueRatio === null ? '—' : fmt(c.wueRatio, 2)}</p>
        </Card>
      </div>
      <div className="overflow-x-auto rounded-card border border-sand-200 bg-white" tabIndex={0} role="region" aria-label={`Paired comparison, ${c.treatment} − ${c.control} (scrolls sideways)`}>
        <table className="w-full text-sm">
          <caption className="px-3 pt-3 text-left font-semibold">Paired comparison across pairs (differences are {c.treatment} − {c.control})</caption>
          <thead className="text-left text-ink-muted">
            <tr>
              <th scope="col" className="px-3 py-2">Measure</th>
              <th scope="col" className="px-3 py-2 text-right">Pairs</th>
              <th scope="col" className="px-3 py-2 text-right">Mean difference</th>
              <th scope="col" className="px-3 py-2 text-right">95% confidence interval</th>
              <th scope="col" className="px-3 py-2 text-right">Paired t-test p</th>
              <th scope="col" className="px-3 py-2 text-right">Wilcoxon p</th>
              <th scope="col" className="px-3 py-2 text-right">Effect size dz</th>
            </tr>
          </thead>
          <tbody>
            <MetricRow label="Water depth" m={c.metrics.waterMm} show={depth} />
            <MetricRow label="Harvest per area" m={c.metrics.harvestKgPerM2} show={perArea} />
            <MetricRow label="Water-use efficiency (kg/m³)" m={c.metrics.wueKgPerM3} show={(v) => fmt(v, 1)} />
          </tbody>
        </table>
        <p className="px-3 pb-3 text-xs text-ink-muted">
          ≈ marks a Wilcoxon p-value from the normal approximation (ties or zero differences), as R does by default.
        </p>
      </div>
      {diffSpec ? (
        <Chart
          title="Water difference in each pair"
          takeaway={
            water.kind === 'test' && !water.result.constantDifferences
              ? `Each dot is a pair; the shaded band is the 95% confidence interval of the mean difference (${depth(water.result.ci[0])} to ${depth(water.result.ci[1])}).`
              : 'Each dot is a pair. With fewer than two pairs there is no interval.'
          }
          spec={diffSpec as VisualizationSpec}
          fileName="paired-differences"
          alternative={
            <table className="text-sm">
              <thead>
                <tr>
                  <th className="pr-4 text-left">Pair</th>
                  <th className="pr-4 text-right">{c.treatment}</th>
                  <th className="pr-4 text-right">{c.control}</th>
                  <th className="text-right">Difference</th>
                </tr>
              </thead>
              <tbody>
                {c.pairs.map((p) => (
                  <tr key={p.blockKey}>
                    <td className="pr-4">{p.blockKey}</td>
                    <td className="num pr-4">{depth(p.waterMm[0])}</td>
                    <td className="num pr-4">{depth(p.waterMm[1])}</td>
                    <td className="num">{depth(p.waterMm[0] - p.waterMm[1])}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          }
        />
      ) : null}
      {pairsFor20 ? (
        <p className="text-sm text-ink-muted">
          Planning next season: with the spread between pairs seen here, about <strong>{pairsFor20} pairs</strong> would detect a 20% water saving 8 times out of 10
          (two-sided paired t-test at 5%).
        </p>
      ) : null}
    </section>
  );
}

export function ResultsTab({ trialId, treatments }: { trialId: string; treatments: string[] }) {
  const analysis = useTrialAnalysis(trialId);
  const units = useUnits();
  if (analysis.isPending) return <p role="status">Computing the results…</p>;
  if (analysis.isError) return <Alert tone="error">{analysis.error.message}</Alert>;
  const data = analysis.data;
  const o = { units: units.system, width: 'container' as const };
  const cumulativeSpec = cumulativeWaterSpec(data, treatments, o) as VisualizationSpec;
  const harvestSpec = harvestVsWaterSpec(data, treatments, o) as VisualizationSpec;
  const weeklySpec = weeklyNeedSpec(data, treatments, o) as VisualizationSpec | null;
  const moistureChart = moistureSpec(data, treatments, o) as VisualizationSpec | null;
  const cw = data.cropWater;
  return (
    <div className="space-y-6">
      {data.warnings.map((w) => (
        <Alert key={w} tone="warning">
          {w}
        </Alert>
      ))}
      {data.comparisons.map((c) => (
        <ComparisonBlock key={c.treatment} c={c} data={data} />
      ))}

      <section className="space-y-3" aria-labelledby="totals-heading">
        <h2 id="totals-heading">Totals by treatment</h2>
        <div className="overflow-x-auto rounded-card border border-sand-200 bg-white" tabIndex={0} role="region" aria-label="Totals by treatment (scrolls sideways)">
          <table className="w-full text-sm">
            <thead className="bg-sand-100 text-left">
              <tr>
                <th scope="col" className="px-3 py-2">Treatment</th>
                <th scope="col" className="px-3 py-2 text-right">Plots</th>
                <th scope="col" className="px-3 py-2 text-right">Area</th>
                <th scope="col" className="px-3 py-2 text-right">Water</th>
                <th scope="col" className="px-3 py-2 text-right">Depth</th>
                <th scope="col" className="px-3 py-2 text-right">Harvest</th>
                <th scope="col" className="px-3 py-2 text-right">Water-use efficiency</th>
              </tr>
            </thead>
            <tbody>
              {data.treatments.map((t) => (
                <tr key={t.treatment} className="border-t border-sand-100">
                  <th scope="row" className="px-3 py-2 text-left font-medium">{t.treatment}</th>
                  <td className="num px-3 py-2">{t.plotCount}</td>
                  <td className="num px-3 py-2">{units.fmt(t.areaM2, 'area', 1)}</td>
                  <td className="num px-3 py-2">{units.fmt(t.waterL, 'volume', 0)}</td>
                  <td className="num px-3 py-2">{units.fmt(t.depthMm, 'length-small', units.system === 'us' ? 1 : 0)}</td>
                  <td className="num px-3 py-2">{units.fmt(t.harvestKg, 'mass', 1)}</td>
                  <td className="num px-3 py-2">{t.wueKgPerM3 === null ? '—' : `${fmt(t.wueKgPerM3, 1)} kg/m³`}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>

      <Chart
        title="Water applied over the season, per plot"
        takeaway="Each line is one plot; the steeper the line, the more water it took."
        spec={cumulativeSpec}
        fileName="cumulative-water"
        alternative={
          <table className="text-sm">
            <thead>
              <tr>
                <th className="pr-4 text-left">Plot</th>
                <th className="pr-4 text-left">Treatment</th>
                <th className="text-right">Season total</th>
              </tr>
            </thead>
            <tbody>
              {data.plots.map((p) => (
                <tr key={p.id}>
                  <td className="pr-4">{p.label}</td>
                  <td className="pr-4">{p.treatment ?? '—'}</td>
                  <td className="num">{units.fmt(p.waterL, 'volume', 1)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        }
      />

      <Chart
        title="Harvest against water"
        takeaway="Dashed lines join points of equal water-use efficiency (5, 10 and 20 kg of harvest per m³ of water); plots above-left are more efficient."
        spec={harvestSpec}
        fileName="harvest-vs-water"
        alternative={
          <table className="text-sm">
            <thead>
              <tr>
                <th className="pr-4 text-left">Plot</th>
                <th className="pr-4 text-right">Water (m³)</th>
                <th className="pr-4 text-right">Harvest (kg)</th>
                <th className="text-right">kg/m³</th>
              </tr>
            </thead>
            <tbody>
              {data.plots.map((p) => (
                <tr key={p.id}>
                  <td className="pr-4">{p.label}</td>
                  <td className="num pr-4">{fmt(p.waterL / 1000, 3)}</td>
                  <td className="num pr-4">{fmt(p.harvestKg, 2)}</td>
                  <td className="num">{fmt(p.wueKgPerM3, 1)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        }
      />

      <section className="space-y-3" aria-labelledby="need-heading">
        <h2 id="need-heading">Crop water need</h2>
        <p className="text-sm text-ink-muted">
          Reference evapotranspiration (ET0) from {cw.weatherDays} weather day{cw.weatherDays === 1 ? '' : 's'}: FAO-56 Penman-Monteith on {cw.methods['penman-monteith']},
          Hargreaves (temperatures only) on {cw.methods.hargreaves}.{' '}
          {cw.kc ? `Crop coefficients (FAO-56 Table 12): Kc ini ${cw.kc.ini}, mid ${cw.kc.mid}, end ${fmt(cw.kc.end, 2)}.` : ''}
        </p>
        <div className="grid gap-3 sm:grid-cols-4">
          <Card>
            <p className="text-sm text-ink-muted">ET0 total</p>
            <p className="text-2xl font-semibold">{cw.weatherDays ? units.fmt(cw.totalEt0Mm, 'length-small', units.system === 'us' ? 1 : 0) : '—'}</p>
          </Card>
          <Card>
            <p className="text-sm text-ink-muted">Crop need (ETc)</p>
            <p className="text-2xl font-semibold">{cw.totalEtcMm === null || !cw.weatherDays ? '—' : units.fmt(cw.totalEtcMm, 'length-small', units.system === 'us' ? 1 : 0)}</p>
          </Card>
          <Card>
            <p className="text-sm text-ink-muted">Rain</p>
            <p className="text-2xl font-semibold">{units.fmt(cw.totalRainMm, 'length-small', units.system === 'us' ? 1 : 0)}</p>
          </Card>
          <Card>
            <p className="text-sm text-ink-muted">Applied as share of ETc</p>
            <p className="text-lg font-semibold">
              {Object.entries(cw.appliedShareOfEtc)
                .map(([t, s]) => `${t}: ${s === null ? '—' : `${fmt(s * 100, 0)} %`}`)
                .join(' · ')}
            </p>
          </Card>
        </div>
        {weeklySpec ? (
          <Chart
            title="Weekly crop water need against water applied"
            takeaway="Lines below the crop-need line mean less water went on than the crop used at reference conditions; the pots feed roots directly, so less is expected."
            spec={weeklySpec}
            fileName="weekly-water-need"
            alternative={
              <table className="text-sm">
                <thead>
                  <tr>
                    <th className="pr-4 text-left">Week</th>
                    <th className="pr-4 text-right">ET0</th>
                    <th className="pr-4 text-right">ETc</th>
                    {treatments.map((t) => (
                      <th key={t} className="pr-4 text-right">
                        {t}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {cw.weekly.map((w) => (
                    <tr key={w.weekStart}>
                      <td className="pr-4">{w.weekStart}</td>
                      <td className="num pr-4">{units.fmt(w.et0Mm, 'length-small')}</td>
                      <td className="num pr-4">{w.etcMm === null ? '—' : units.fmt(w.etcMm, 'length-small')}</td>
                      {treatments.map((t) => (
                        <td key={t} className="num pr-4">
                          {units.fmt(w.appliedMm[t] ?? 0, 'length-small')}
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            }
          />
        ) : null}
      </section>

      {data.moisture.series.length ? (
        <section className="space-y-3" aria-labelledby="moisture-heading">
          <h2 id="moisture-heading">Soil moisture</h2>
          {data.moisture.stress.length ? (
            <ul className="text-sm">
              {data.moisture.stress.map((s) => (
                <li key={`${s.treatment}-${s.method}`}>
                  {s.treatment}, {s.method}: {s.daysBelow} of {s.daysMeasured} measured days past the stress threshold ({s.threshold}).
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-ink-muted">Set a stress threshold in the trial setup to count dry days.</p>
          )}
          <Chart
            title="Soil moisture per treatment"
            takeaway="Daily means per treatment; each method keeps its own scale and is never mixed with another."
            spec={moistureChart!}
            fileName="soil-moisture"
            alternative={
              <table className="text-sm">
                <thead>
                  <tr>
                    <th className="pr-4 text-left">Day</th>
                    <th className="pr-4 text-left">Treatment</th>
                    <th className="pr-4 text-left">Method</th>
                    <th className="text-right">Mean</th>
                  </tr>
                </thead>
                <tbody>
                  {data.moisture.series.map((m) => (
                    <tr key={`${m.day}-${m.treatment}-${m.method}`}>
                      <td className="pr-4">{m.day}</td>
                      <td className="pr-4">{m.treatment}</td>
                      <td className="pr-4">{m.method}</td>
                      <td className="num">{fmt(m.value, 1)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            }
          />
        </section>
      ) : null}
      <p className="text-xs text-ink-muted">Computed from the records up to {data.asOf}. Days are counted in UTC.</p>
    </div>
  );
}
