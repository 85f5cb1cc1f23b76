/**
 * Vega-Lite specifications for a trial's charts, built from its analysis. Pure: the Results tab
 * draws them in the browser and the report bundle renders the same specs to SVG and PNG on the
 * server, so a chart in a student's report is the chart they saw.
 */
import type { TrialAnalysis } from '../analysis/trial-analysis';
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
}

export type Spec = Record<string, unknown>;

export interface TrialChart {
  id: string;
  title: string;
  spec: Spec;
}

function base(o: ChartOptions, height: number): Spec {
  return { $schema: SCHEMA, width: o.width, height, config: chartConfig };
}

export function cumulativeWaterSpec(a: TrialAnalysis, treatments: string[], o: ChartOptions): Spec {
  const vol = unitLabel('volume', o.units);
  return {
    ...base(o, 260),
    data: { values: a.cumulative.flatMap((s) => s.points.map(([day, litres]) => ({ plot: s.label, treatment: s.treatment ?? 'unassigned', day, value: toDisplay(litres, 'volume', o.units) }))) },
    mark: { type: 'line', interpolate: 'step-after' },
    encoding: {
      x: { field: 'day', type: 'temporal', title: 'Date' },
      y: { field: 'value', type: 'quantitative', title: `Water applied so far (${vol})` },
      color: { field: 'treatment', type: 'nominal', title: 'Treatment', scale: treatmentScale(treatments) },
      detail: { field: 'plot' },
      tooltip: [{ field: 'plot', title: 'Plot' }, { field: 'day', type: 'temporal' }, { field: 'value', format: '.1f', title: vol }],
    },
  };
}

export function pairedDifferenceSpec(a: TrialAnalysis, o: ChartOptions, comparisonIndex = 0): Spec | null {
  const c = a.comparisons[comparisonIndex];
  if (!c || !c.pairs.length) return null;
  const unit = unitLabel('length-small', o.units);
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
          y: { field: 'pair', type: 'nominal', title: 'Pair' },
          x: { field: 'difference', type: 'quantitative', title: `Water difference, ${c.treatment} − ${c.control} (${unit})` },
          tooltip: [{ field: 'pair' }, { field: 'difference', format: '.1f' }],
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
  const lines = [5, 10, 20].flatMap((w) => [
    { wue: `${w} kg/m³`, waterM3: 0, harvestKg: 0 },
    { wue: `${w} kg/m³`, waterM3: maxW, harvestKg: w * maxW },
  ]);
  return {
    ...base(o, 260),
    layer: [
      {
        data: { values: lines },
        mark: { type: 'line', strokeDash: [3, 3], color: '#c9ab7f' },
        encoding: { x: { field: 'waterM3', type: 'quantitative', title: 'Water applied (m³)' }, y: { field: 'harvestKg', type: 'quantitative', title: 'Harvest (kg)' }, detail: { field: 'wue' } },
      },
      {
        data: { values: points },
        mark: { type: 'point', filled: true, size: 90 },
        encoding: {
          x: { field: 'waterM3', type: 'quantitative' },
          y: { field: 'harvestKg', type: 'quantitative' },
          color: { field: 'treatment', type: 'nominal', title: 'Treatment', scale: treatmentScale(treatments) },
          shape: { field: 'treatment', type: 'nominal', title: 'Treatment' },
          tooltip: [{ field: 'plot', title: 'Plot' }, { field: 'waterM3', format: '.3f' }, { field: 'harvestKg', format: '.2f' }],
        },
      },
    ],
  };
}

export function weeklyNeedSpec(a: TrialAnalysis, treatments: string[], o: ChartOptions): Spec | null {
  const unit = unitLabel('length-small', o.units);
  const d = (mm: number) => toDisplay(mm, 'length-small', o.units);
  const values = a.cropWater.weekly.flatMap((w) => [
    ...Object.entries(w.appliedMm).map(([t, mm]) => ({ week: w.weekStart, series: `applied: ${t}`, value: d(mm) })),
    ...(w.etcMm !== null ? [{ week: w.weekStart, series: 'crop need (ETc)', value: d(w.etcMm) }] : []),
  ]);
  if (!values.length) return null;
  const colour = treatmentScale(treatments);
  return {
    ...base(o, 240),
    data: { values },
    mark: { type: 'line', point: true },
    encoding: {
      x: { field: 'week', type: 'temporal', title: 'Week starting' },
      y: { field: 'value', type: 'quantitative', title: `Per week (${unit})` },
      color: { field: 'series', type: 'nominal', title: null, scale: { domain: [...treatments.map((t) => `applied: ${t}`), 'crop need (ETc)'], range: [...colour.range, '#b5562f'] } },
      strokeDash: { field: 'series', type: 'nominal', legend: null },
    },
  };
}

export function moistureSpec(a: TrialAnalysis, treatments: string[], o: ChartOptions): Spec | null {
  if (!a.moisture.series.length) return null;
  return {
    $schema: SCHEMA,
    config: chartConfig,
    data: { values: a.moisture.series },
    facet: { row: { field: 'method', type: 'nominal', title: 'Method (each on its own scale)' } },
    resolve: { scale: { y: 'independent' } },
    spec: {
      width: o.width === 'container' ? 600 : o.width,
      height: 140,
      mark: { type: 'line', point: true },
      encoding: {
        x: { field: 'day', type: 'temporal', title: 'Date' },
        y: { field: 'value', type: 'quantitative', title: 'Daily mean' },
        color: { field: 'treatment', type: 'nominal', title: 'Treatment', scale: treatmentScale(treatments) },
      },
    },
  };
}

/** Every chart of a trial that has data, with a file-friendly id. */
export function trialCharts(a: TrialAnalysis, treatments: string[], o: ChartOptions): TrialChart[] {
  const out: TrialChart[] = [{ id: 'cumulative-water', title: 'Water applied over the season, per plot', spec: cumulativeWaterSpec(a, treatments, o) }];
  const diff = pairedDifferenceSpec(a, o);
  if (diff) out.push({ id: 'paired-differences', title: 'Water difference in each pair', spec: diff });
  out.push({ id: 'harvest-vs-water', title: 'Harvest against water', spec: harvestVsWaterSpec(a, treatments, o) });
  const weekly = weeklyNeedSpec(a, treatments, o);
  if (weekly) out.push({ id: 'weekly-water-need', title: 'Weekly crop water need against water applied', spec: weekly });
  const moisture = moistureSpec(a, treatments, o);
  if (moisture) out.push({ id: 'soil-moisture', title: 'Soil moisture per treatment', spec: moisture });
  return out;
}
