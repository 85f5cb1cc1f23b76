import { useTranslation } from 'react-i18next';
import type { VisualizationSpec } from 'vega-embed';
import { describeComparison } from '@shared/analysis/narrative';
import { pairedSampleSize } from '@shared/analysis/power';
import type { Comparison, PairedMetric } from '@shared/analysis/trial-analysis';
import { cumulativeWaterSpec, harvestVsWaterSpec, moistureSpec, pairedDifferenceSpec, treatmentName, weeklyNeedSpec } from '@shared/charts/trial-charts';
import { toLang, translator, type Translate } from '@shared/i18n/translate';
import { Chart } from '@/components/charts/chart';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { formatDate, formatNumber } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { useTrialAnalysis, type TrialAnalysisResponse } from '../api/get-trial-analysis';

const fmt = (v: number | null | undefined, digits = 2) => formatNumber(v, digits);
const pFmt = (p: number) => (!Number.isFinite(p) ? '—' : p < 0.001 ? `< ${formatNumber(0.001, 3, 3)}` : formatNumber(p, 3, 3));

/** The shared translator (chart labels, analysis notices) in the language the screen shows. */
function useSharedT(): Translate {
  const { i18n } = useTranslation();
  return translator(toLang(i18n.resolvedLanguage));
}

function MetricRow({ label, m, show }: { label: string; m: PairedMetric; show: (v: number) => string }) {
  const { t } = useTranslation('analysis');
  const st = useSharedT();
  if (m.kind === 'descriptive') {
    return (
      <tr className="border-t border-sand-100">
        <th scope="row" className="px-3 py-2 text-left font-medium">
          {label}
        </th>
        <td className="num px-3 py-2">{m.n}</td>
        <td className="px-3 py-2 text-ink-muted" colSpan={5}>
          {m.description ? t(($) => $.paired.difference, { value: show(m.description.meanDifference) }) : ''}
          {m.reasonKey ? st(`analysis.reasons.${m.reasonKey}`) : m.reason}
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
          {t(($) => $.paired.constant)}
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
        {t(($) => $.paired.range, { lo: show(r.ci[0]), hi: show(r.ci[1]) })}
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
  const { t } = useTranslation('analysis');
  const st = useSharedT();
  const sentences = describeComparison(c, { lang: st.lang, units: units.system });
  const depth = (mm: number) => units.fmt(mm, 'length-small', units.system === 'us' ? 2 : 0);
  const [treatment, control] = [treatmentName(c.treatment, st), treatmentName(c.control, st)];
  const perArea = (kg: number) => (units.system === 'us' ? `${fmt((kg / 0.45359237) * 0.09290304, 3)} lb/ft²` : `${fmt(kg, 2)} kg/m²`);
  const water = c.metrics.waterMm;
  const sdForPlan = water.kind === 'test' && !water.result.constantDifferences && water.result.sdDifference > 0 ? water.result.sdDifference : null;
  const controlDepth = data.treatments.find((t) => t.treatment === c.control)?.depthMm ?? 0;
  const pairsFor20 = sdForPlan && controlDepth > 0 ? pairedSampleSize({ meanDifference: 0.2 * controlDepth, sdDifference: sdForPlan }) : null;

  const diffSpec = pairedDifferenceSpec(data, { units: units.system, width: 'container', t: st }, data.comparisons.indexOf(c));
  const [planBefore, planAfter] = t(($) => $.planning, { count: pairsFor20 ?? 0 }).split(/<strong>.*<\/strong>/);
  const planPairs = /<strong>(.*)<\/strong>/.exec(t(($) => $.planning, { count: pairsFor20 ?? 0 }))?.[1] ?? '';

  return (
    <section className="space-y-4" aria-label={t(($) => $.comparisonLabel, { treatment, control })}>
      <Card className="space-y-2 border-terracotta-200 bg-terracotta-50/40">
        <h2>
          {t(($) => $.comparisonHeading, {
            treatment: c.treatment === 'olla' ? t(($) => $.potsHeading) : treatment,
            control: c.control === 'surface' ? t(($) => $.surfaceHeading) : control,
          })}
        </h2>
        {sentences.map((s) => (
          <p key={s}>{s}</p>
        ))}
      </Card>
      <div className="grid gap-3 sm:grid-cols-3">
        <Card>
          <p className="text-sm text-ink-muted">{t(($) => $.cards.waterSaved)}</p>
          <p className="text-3xl font-semibold">{c.waterSavingPercent === null ? '—' : `${fmt(c.waterSavingPercent, 0)}\u00a0%`}</p>
        </Card>
        <Card>
          <p className="text-sm text-ink-muted">{t(($) => $.cards.harvestRatio, { treatment, control })}</p>
          <p className="text-3xl font-semibold">{c.harvestRatio === null ? '—' : fmt(c.harvestRatio, 2)}</p>
        </Card>
        <Card>
          <p className="text-sm text-ink-muted">{t(($) => $.cards.wueRatio)}</p>
          <p className="text-3xl font-semibold">{c.wueRatio === null ? '—' : fmt(c.wueRatio, 2)}</p>
        </Card>
      </div>
      <div className="overflow-x-auto rounded-card border border-sand-200 bg-white" tabIndex={0} role="region" aria-label={t(($) => $.paired.scrollRegion, { treatment, control })}>
        <table className="w-full text-sm">
          <caption className="px-3 pt-3 text-left font-semibold">{t(($) => $.paired.caption, { treatment, control })}</caption>
          <thead className="text-left text-ink-muted">
            <tr>
              <th scope="col" className="px-3 py-2">
                {t(($) => $.paired.measure)}
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                {t(($) => $.paired.pairs)}
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                {t(($) => $.paired.meanDifference)}
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                {t(($) => $.paired.ci)}
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                {t(($) => $.paired.tP)}
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                {t(($) => $.paired.wilcoxonP)}
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                {t(($) => $.paired.dz)}
              </th>
            </tr>
          </thead>
          <tbody>
            <MetricRow label={t(($) => $.paired.waterDepth)} m={c.metrics.waterMm} show={depth} />
            <MetricRow label={t(($) => $.paired.harvestPerArea)} m={c.metrics.harvestKgPerM2} show={perArea} />
            <MetricRow label={t(($) => $.paired.wue)} m={c.metrics.wueKgPerM3} show={(v) => fmt(v, 1)} />
          </tbody>
        </table>
        <p className="px-3 pb-3 text-xs text-ink-muted">
          {t(($) => $.paired.approx)}
        </p>
      </div>
      {diffSpec ? (
        <Chart
          title={st('charts.trial.titles.pairedDifferences')}
          takeaway={
            water.kind === 'test' && !water.result.constantDifferences
              ? t(($) => $.diffChart.takeaway, { lo: depth(water.result.ci[0]), hi: depth(water.result.ci[1]) })
              : t(($) => $.diffChart.takeawayNoInterval)
          }
          spec={diffSpec as VisualizationSpec}
          fileName="paired-differences"
          alternative={
            <table className="text-sm">
              <thead>
                <tr>
                  <th className="pr-4 text-left">{t(($) => $.diffChart.pair)}</th>
                  <th className="pr-4 text-right">{treatment}</th>
                  <th className="pr-4 text-right">{control}</th>
                  <th className="text-right">{t(($) => $.diffChart.difference)}</th>
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
          {planBefore}
          <strong>{planPairs}</strong>
          {planAfter}
        </p>
      ) : null}
    </section>
  );
}

export function ResultsTab({ trialId, treatments }: { trialId: string; treatments: string[] }) {
  const analysis = useTrialAnalysis(trialId);
  const units = useUnits();
  const { t } = useTranslation('analysis');
  const st = useSharedT();
  if (analysis.isPending) return <p role="status">{t(($) => $.computing)}</p>;
  if (analysis.isError) return <Alert tone="error">{analysis.error.message}</Alert>;
  const data = analysis.data;
  const o = { units: units.system, width: 'container' as const, t: st };
  const tn = (name: string | null) => (name === null ? '—' : treatmentName(name, st));
  const cumulativeSpec = cumulativeWaterSpec(data, treatments, o) as VisualizationSpec;
  const harvestSpec = harvestVsWaterSpec(data, treatments, o) as VisualizationSpec;
  const weeklySpec = weeklyNeedSpec(data, treatments, o) as VisualizationSpec | null;
  const moistureChart = moistureSpec(data, treatments, o) as VisualizationSpec | null;
  const cw = data.cropWater;
  const methodName = (m: string) => (m === 'vwc' || m === 'tensiometer' || m === 'probe_index' ? t(($) => $.moisture.methods[m]) : m);
  return (
    <div className="space-y-6">
      {(data.notices ?? []).map((w) => (
        <Alert key={w.key} tone="warning">
          {st(`analysis.warnings.${w.key}`, w.params)}
        </Alert>
      ))}
      {data.comparisons.map((c) => (
        <ComparisonBlock key={c.treatment} c={c} data={data} />
      ))}

      <section className="space-y-3" aria-labelledby="totals-heading">
        <h2 id="totals-heading">{t(($) => $.totals.heading)}</h2>
        <div className="overflow-x-auto rounded-card border border-sand-200 bg-white" tabIndex={0} role="region" aria-label={t(($) => $.totals.scrollRegion)}>
          <table className="w-full text-sm">
            <thead className="bg-sand-100 text-left">
              <tr>
                <th scope="col" className="px-3 py-2">
                  {t(($) => $.totals.treatment)}
                </th>
                <th scope="col" className="px-3 py-2 text-right">
                  {t(($) => $.totals.plots)}
                </th>
                <th scope="col" className="px-3 py-2 text-right">
                  {t(($) => $.totals.area)}
                </th>
                <th scope="col" className="px-3 py-2 text-right">
                  {t(($) => $.totals.water)}
                </th>
                <th scope="col" className="px-3 py-2 text-right">
                  {t(($) => $.totals.depth)}
                </th>
                <th scope="col" className="px-3 py-2 text-right">
                  {t(($) => $.totals.harvest)}
                </th>
                <th scope="col" className="px-3 py-2 text-right">
                  {t(($) => $.totals.wue)}
                </th>
              </tr>
            </thead>
            <tbody>
              {data.treatments.map((t) => (
                <tr key={t.treatment} className="border-t border-sand-100">
                  <th scope="row" className="px-3 py-2 text-left font-medium">
                    {tn(t.treatment)}
                  </th>
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
        title={st('charts.trial.titles.cumulativeWater')}
        takeaway={t(($) => $.cumulative.takeaway)}
        spec={cumulativeSpec}
        fileName="cumulative-water"
        alternative={
          <table className="text-sm">
            <thead>
              <tr>
                <th className="pr-4 text-left">{t(($) => $.cumulative.plot)}</th>
                <th className="pr-4 text-left">{t(($) => $.cumulative.treatment)}</th>
                <th className="text-right">{t(($) => $.cumulative.seasonTotal)}</th>
              </tr>
            </thead>
            <tbody>
              {data.plots.map((p) => (
                <tr key={p.id}>
                  <td className="pr-4">{p.label}</td>
                  <td className="pr-4">{tn(p.treatment)}</td>
                  <td className="num">{units.fmt(p.waterL, 'volume', 1)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        }
      />

      <Chart
        title={st('charts.trial.titles.harvestVsWater')}
        takeaway={t(($) => $.harvest.takeaway)}
        spec={harvestSpec}
        fileName="harvest-vs-water"
        alternative={
          <table className="text-sm">
            <thead>
              <tr>
                <th className="pr-4 text-left">{t(($) => $.harvest.plot)}</th>
                <th className="pr-4 text-right">{t(($) => $.harvest.water)}</th>
                <th className="pr-4 text-right">{t(($) => $.harvest.harvest)}</th>
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
        <h2 id="need-heading">{t(($) => $.need.heading)}</h2>
        <p className="text-sm text-ink-muted">
          {t(($) => $.need.et0, { count: cw.weatherDays, pm: formatNumber(cw.methods['penman-monteith'], 0), hg: formatNumber(cw.methods.hargreaves, 0) })}{' '}
          {cw.kc ? t(($) => $.need.kc, { ini: fmt(cw.kc.ini, 2), mid: fmt(cw.kc.mid, 2), end: fmt(cw.kc.end, 2) }) : ''}
        </p>
        <div className="grid gap-3 sm:grid-cols-4">
          <Card>
            <p className="text-sm text-ink-muted">{t(($) => $.need.et0Total)}</p>
            <p className="text-2xl font-semibold">{cw.weatherDays ? units.fmt(cw.totalEt0Mm, 'length-small', units.system === 'us' ? 1 : 0) : '—'}</p>
          </Card>
          <Card>
            <p className="text-sm text-ink-muted">{t(($) => $.need.etc)}</p>
            <p className="text-2xl font-semibold">{cw.totalEtcMm === null || !cw.weatherDays ? '—' : units.fmt(cw.totalEtcMm, 'length-small', units.system === 'us' ? 1 : 0)}</p>
          </Card>
          <Card>
            <p className="text-sm text-ink-muted">{t(($) => $.need.rain)}</p>
            <p className="text-2xl font-semibold">{units.fmt(cw.totalRainMm, 'length-small', units.system === 'us' ? 1 : 0)}</p>
          </Card>
          <Card>
            <p className="text-sm text-ink-muted">{t(($) => $.need.share)}</p>
            <p className="text-lg font-semibold">
              {Object.entries(cw.appliedShareOfEtc)
                .map(([name, s]) => `${tn(name)}: ${s === null ? '—' : `${fmt(s * 100, 0)}\u00a0%`}`)
                .join(' · ')}
            </p>
          </Card>
        </div>
        {weeklySpec ? (
          <Chart
            title={st('charts.trial.titles.weeklyNeed')}
            takeaway={t(($) => $.need.takeaway)}
            spec={weeklySpec}
            fileName="weekly-water-need"
            alternative={
              <table className="text-sm">
                <thead>
                  <tr>
                    <th className="pr-4 text-left">{t(($) => $.need.week)}</th>
                    <th className="pr-4 text-right">ET0</th>
                    <th className="pr-4 text-right">ETc</th>
                    {treatments.map((name) => (
                      <th key={name} className="pr-4 text-right">
                        {tn(name)}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {cw.weekly.map((w) => (
                    <tr key={w.weekStart}>
                      <td className="pr-4">{formatDate(w.weekStart)}</td>
                      <td className="num pr-4">{units.fmt(w.et0Mm, 'length-small')}</td>
                      <td className="num pr-4">{w.etcMm === null ? '—' : units.fmt(w.etcMm, 'length-small')}</td>
                      {treatments.map((name) => (
                        <td key={name} className="num pr-4">
                          {units.fmt(w.appliedMm[name] ?? 0, 'length-small')}
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
          <h2 id="moisture-heading">{t(($) => $.moisture.heading)}</h2>
          {data.moisture.stress.length ? (
            <ul className="text-sm">
              {data.moisture.stress.map((s) => (
                <li key={`${s.treatment}-${s.method}`}>
                  {t(($) => $.moisture.stress, {
                    treatment: tn(s.treatment),
                    method: methodName(s.method),
                    below: formatNumber(s.daysBelow, 0),
                    measured: formatNumber(s.daysMeasured, 0),
                    threshold: formatNumber(s.threshold, 1),
                  })}
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-ink-muted">{t(($) => $.moisture.noThreshold)}</p>
          )}
          <Chart
            title={st('charts.trial.titles.moisture')}
            takeaway={t(($) => $.moisture.takeaway)}
            spec={moistureChart!}
            fileName="soil-moisture"
            alternative={
              <table className="text-sm">
                <thead>
                  <tr>
                    <th className="pr-4 text-left">{t(($) => $.moisture.day)}</th>
                    <th className="pr-4 text-left">{t(($) => $.moisture.treatment)}</th>
                    <th className="pr-4 text-left">{t(($) => $.moisture.method)}</th>
                    <th className="text-right">{t(($) => $.moisture.mean)}</th>
                  </tr>
                </thead>
                <tbody>
                  {data.moisture.series.map((m) => (
                    <tr key={`${m.day}-${m.treatment}-${m.method}`}>
                      <td className="pr-4">{formatDate(m.day)}</td>
                      <td className="pr-4">{tn(m.treatment)}</td>
                      <td className="pr-4">{methodName(m.method)}</td>
                      <td className="num">{fmt(m.value, 1)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            }
          />
        </section>
      ) : null}
      <p className="text-xs text-ink-muted">{t(($) => $.asOf, { date: formatDate(data.asOf) })}</p>
    </div>
  );
}
