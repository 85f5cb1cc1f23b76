/**
 * Vega-Lite specifications for a trial's charts, built from its analysis. Pure: the Results tab
 * draws them in the browser and the report bundle renders the same specs to SVG and PNG on the
 * server, so a chart in a student's report is the chart they saw.
 */
import { cumulativePoints, type TrialAnalysis } from '../analysis/trial-analysis';
import { enT, type Translate } from '../i18n/translate';
import { toDisplay, unitLabel, type UnitSystem } from '../units';

/** Seepwise's two treatment colours, the same in every chart (always with a legend or label too). */
export const treatmentColours: Record<string, string> = { olla: '#4a7642', surface: '#3b5f8a' };
const extraColours = ['#b5562f', '#8a6f48', '#7c3820', '#5d83ae'];

export function treatmentScale(treatments: string[]) {
  let i = 0;
  return { domain: treatments, range: treatments.map((t) => treatmentColours[t] ?? (extraColours[i++ % extraColours.length] as string)) };
}

export const chartConfig = {
  font: 'IBM Plex Sans',
  background: '#ffffff',
  axis: { labelColor: '#2b241d', titleColor: '#2b241d', gridColor: '#ede1cd', domainColor: '#8a7d6e', tickColor: '#8a7d6e', labelFontSize: 12, titleFontSize: 12 },
  legend: { labelColor: '#2b241d', titleColor: '#2b241d', labelFontSize: 12, titleFontSize: 12 },
  view: { stroke: null },
};

const SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';

export interface ChartOptions {
  units: UnitSystem;
  /** 'container' in the browser; a number of pixels when rendering files. */
  width: number | 'container';
  /** Titles, axis and legend labels in the reader's language (shared/i18n/translate.ts); English when left out. */
  t?: Translate;
}

export type Spec = Record<string, unknown>;

export interface TrialChart {
  id: string;
  title: string;
  spec: Spec;
}

/** A treatment as a reader names it: the stored names 'olla' and 'surface' translated, a grower's own name as typed. */
export function treatmentName(name: string, t: Translate = enT): string {
  return name === 'olla' || name === 'surface' || name === 'unassigned' ? t(`charts.treatments.${name}`) : name;
}

/**
 * A legend that shows translated treatment names while the data keep the stored ones (so colours,
 * tooltips and the data mapping stay language-free). A Vega expression, read by vega-interpreter too.
 */
export function treatmentLegendLabels(t: Translate = enT): { labelExpr: string } | Record<string, never> {
  const pairs = (['olla', 'surface', 'unassigned'] as const).filter((n) => treatmentName(n, t) !== n);
  if (!pairs.length) return {};
  const expr = pairs.reduceRight((rest, n) => `datum.label === ${JSON.stringify(n)} ? ${JSON.stringify(treatmentName(n, t))} : ${rest}`, 'datum.label');
  return { labelExpr: expr };
}

/**
 * A date axis with an explicit day format in the reader's language ("May 17" / "17 may"): Vega's own
 * multi-scale format puts the month first in every language.
 */
export function dayAxis(t: Translate): { format: string; labelOverlap: boolean } {
  return { format: t('charts.timeFormat.day'), labelOverlap: true };
}

/** A soil-moisture method code ("probe_index") as a reader names it; an unknown code stays as is. */
export function moistureMethodLabel(method: string, t: Translate = enT): string {
  return method === 'vwc' || method === 'tensiometer' || method === 'probe_index' ? t(`charts.moistureMethods.${method}`) : method;
}

function base(o: ChartOptions, height: number): Spec {
  return { $schema: SCHEMA, width: o.width, height, config: chartConfig };
}

export function cumulativeWaterSpec(a: TrialAnalysis, treatments: string[], o: ChartOptions): Spec {
  const vol = unitLabel('volume', o.units);
  const t = o.t ?? enT;
  return {
    ...base(o, 260),
    data: { values: a.waterDays.flatMap((s) => cumulativePoints(s).map(([day, litres]) => ({ plot: s.label, treatment: s.treatment ?? 'unassigned', day, value: toDisplay(litres, 'volume', o.units) }))) },
    mark: { type: 'line', interpolate: 'step-after' },
    encoding: {
      x: { field: 'day', type: 'temporal', title: t('charts.trial.date'), axis: dayAxis(t) },
      y: { field: 'value', type: 'quantitative', title: t('charts.trial.waterSoFar', { unit: vol }) },
      color: { field: 'treatment', type: 'nominal', title: t('charts.trial.treatment'), scale: treatmentScale(treatments), legend: treatmentLegendLabels(t) },
      detail: { field: 'plot' },
      tooltip: [{ field: 'plot', title: t('charts.trial.plot') }, { field: 'day', type: 'temporal', title: t('charts.trial.date'), format: t('charts.timeFormat.dayYear') }, { field: 'value', format: '.1f', title: vol }],
    },
  };
}

export function pairedDifferenceSpec(a: TrialAnalysis, o: ChartOptions, comparisonIndex = 0): Spec | null {
  const c = a.comparisons[comparisonIndex];
  if (!c || !c.pairs.length) return null;
  const unit = unitLabel('length-small', o.units);
  const t = o.t ?? enT;
  const d = (mm: number) => toDisplay(mm, 'length-small', o.units);
  const m = c.metrics.waterMm;
  const ci = m.kind === 'test' && !m.result.constantDifferences ? [{ lo: d(m.result.ci[0]), hi: d(m.result.ci[1]), mean: d(m.result.meanDifference) }] : [];
  return {
    ...base(o, Math.max(120, 40 * c.pairs.length)),
    layer: [
      {
        data: { values: c.pairs.map((p) => ({ pair: p.blockKey, difference: d(p.waterMm[0] - p.waterMm[1]) })) },
        mark: { type: 'point', filled: true, size: 80, color: treatmentColours.olla },
        encoding: {
          y: { field: 'pair', type: 'nominal', title: t('charts.trial.pair') },
          x: {
            field: 'difference',
            type: 'quantitative',
            title: t('charts.trial.waterDifference', { treatment: treatmentName(c.treatment, t), control: treatmentName(c.control, t), unit }),
          },
          tooltip: [
            { field: 'pair', title: t('charts.trial.pair') },
            { field: 'difference', format: '.1f', title: t('charts.trial.difference', { unit }) },
          ],
        },
      },
      { data: { values: [{ x: 0 }] }, mark: { type: 'rule', color: '#8a7d6e', strokeDash: [4, 4] }, encoding: { x: { field: 'x', type: 'quantitative' } } },
      ...(ci.length
        ? [
            { data: { values: ci }, mark: { type: 'rect', color: '#b5562f', opacity: 0.15 }, encoding: { x: { field: 'lo', type: 'quantitative' }, x2: { field: 'hi' } } },
            { data: { values: ci }, mark: { type: 'rule', color: '#9a4525', strokeWidth: 2 }, encoding: { x: { field: 'mean', type: 'quantitative' } } },
          ]
        : []),
    ],
  };
}

export function harvestVsWaterSpec(a: TrialAnalysis, treatments: string[], o: ChartOptions): Spec {
  const points = a.plots.map((p) => ({ plot: p.label, treatment: p.treatment ?? 'unassigned', waterM3: p.waterL / 1000, harvestKg: p.harvestKg }));
  const maxW = Math.max(0.001, ...points.map((p) => p.waterM3));
  const t = o.t ?? enT;
  const lines = [5, 10, 20].flatMap((w) => [
    { wue: t('charts.trial.wueLine', { value: w }), waterM3: 0, harvestKg: 0 },
    { wue: t('charts.trial.wueLine', { value: w }), waterM3: maxW, harvestKg: w * maxW },
  ]);
  return {
    ...base(o, 260),
    layer: [
      {
        data: { values: lines },
        mark: { type: 'line', strokeDash: [3, 3], color: '#c9ab7f' },
        encoding: {
          x: { field: 'waterM3', type: 'quantitative', title: t('charts.trial.waterAppliedM3') },
          y: { field: 'harvestKg', type: 'quantitative', title: t('charts.trial.harvestKg') },
          detail: { field: 'wue' },
        },
      },
      {
        data: { values: points },
        mark: { type: 'point', filled: true, size: 90 },
        encoding: {
          x: { field: 'waterM3', type: 'quantitative' },
          y: { field: 'harvestKg', type: 'quantitative' },
          color: { field: 'treatment', type: 'nominal', title: t('charts.trial.treatment'), scale: treatmentScale(treatments), legend: treatmentLegendLabels(t) },
          shape: { field: 'treatment', type: 'nominal', title: t('charts.trial.treatment'), legend: treatmentLegendLabels(t) },
          tooltip: [
            { field: 'plot', title: t('charts.trial.plot') },
            { field: 'waterM3', format: '.3f', title: t('charts.trial.waterAppliedM3') },
            { field: 'harvestKg', format: '.2f', title: t('charts.trial.harvestKg') },
          ],
        },
      },
    ],
  };
}

export function weeklyNeedSpec(a: TrialAnalysis, treatments: string[], o: ChartOptions): Spec | null {
  const unit = unitLabel('length-small', o.units);
  const t = o.t ?? enT;
  const applied = (name: string) => t('charts.trial.applied', { treatment: treatmentName(name, t) });
  const need = t('charts.trial.cropNeed');
  const d = (mm: number) => toDisplay(mm, 'length-small', o.units);
  const values = a.cropWater.weekly.flatMap((w) => [
    ...Object.entries(w.appliedMm).map(([name, mm]) => ({ week: w.weekStart, series: applied(name), value: d(mm) })),
    ...(w.etcMm !== null ? [{ week: w.weekStart, series: need, value: d(w.etcMm) }] : []),
  ]);
  if (!values.length) return null;
  const colour = treatmentScale(treatments);
  const domain = [...treatments.map(applied), need];
  return {
    ...base(o, 240),
    data: { values },
    mark: { type: 'line', point: true },
    encoding: {
      x: { field: 'week', type: 'temporal', title: t('charts.trial.weekStarting'), axis: dayAxis(t) },
      y: { field: 'value', type: 'quantitative', title: t('charts.trial.perWeek', { unit }) },
      // Colour and dash share one legend (Vega-Lite merges encodings of the same field; `legend: null`
      // on either would drop the merged legend, leaving three unnamed lines): the crop need is dotted,
      // the applied water solid, so the lines differ without colour too.
      color: { field: 'series', type: 'nominal', title: null, scale: { domain, range: [...colour.range, '#b5562f'] } },
      strokeDash: { field: 'series', type: 'nominal', title: null, scale: { domain, range: [...treatments.map(() => [1, 0]), [2, 3]] } },
    },
  };
}

export function moistureSpec(a: TrialAnalysis, treatments: string[], o: ChartOptions): Spec | null {
  if (!a.moisture.series.length) return null;
  const t = o.t ?? enT;
  return {
    $schema: SCHEMA,
    config: chartConfig,
    // The facet shows each method's name in the reader's language, not its code.
    data: { values: a.moisture.series.map((m) => ({ ...m, method: moistureMethodLabel(m.method, t) })) },
    facet: { row: { field: 'method', type: 'nominal', title: t('charts.trial.moistureMethod') } },
    resolve: { scale: { y: 'independent' } },
    spec: {
      width: o.width === 'container' ? 600 : o.width,
      height: 140,
      mark: { type: 'line', point: true },
      encoding: {
        x: { field: 'day', type: 'temporal', title: t('charts.trial.date'), axis: dayAxis(t) },
        y: { field: 'value', type: 'quantitative', title: t('charts.trial.dailyMean') },
        color: { field: 'treatment', type: 'nominal', title: t('charts.trial.treatment'), scale: treatmentScale(treatments), legend: treatmentLegendLabels(t) },
      },
    },
  };
}

/** Every chart of a trial that has data, with a file-friendly id. */
export function trialCharts(a: TrialAnalysis, treatments: string[], o: ChartOptions): TrialChart[] {
  const t = o.t ?? enT;
  const out: TrialChart[] = [{ id: 'cumulative-water', title: t('charts.trial.titles.cumulativeWater'), spec: cumulativeWaterSpec(a, treatments, o) }];
  const diff = pairedDifferenceSpec(a, o);
  if (diff) out.push({ id: 'paired-differences', title: t('charts.trial.titles.pairedDifferences'), spec: diff });
  out.push({ id: 'harvest-vs-water', title: t('charts.trial.titles.harvestVsWater'), spec: harvestVsWaterSpec(a, treatments, o) });
  const weekly = weeklyNeedSpec(a, treatments, o);
  if (weekly) out.push({ id: 'weekly-water-need', title: t('charts.trial.titles.weeklyNeed'), spec: weekly });
  const moisture = moistureSpec(a, treatments, o);
  if (moisture) out.push({ id: 'soil-moisture', title: t('charts.trial.titles.moisture'), spec: moisture });
  return out;
}
