/**
 * Vega-Lite specifications for a cohort's pooled results, built from GET /api/cohorts/:id/results.
 * Pure, like trial-charts.ts: the cohort page draws them in the browser and the report bundle can
 * render the same specs on the server, so a student's report shows the chart the class saw.
 *
 * Trials appear by their member's pseudonym and crop only (the results never carry names).
 */
import type { CohortResults, EffectKey, EffectResult, ForestRow } from '../schemas/cohort-results';
import { enT, type Translate } from '../i18n/translate';
import { cropIds, type Crop } from '../schemas/trials';
import { toDisplay, unitLabel } from '../units';
import { chartConfig, treatmentLegendLabels, treatmentName, treatmentScale, type ChartOptions, type Spec } from './trial-charts';

const SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';

/** Ink, terracotta and sand of the Seepwise palette; sage and slate stay reserved for olla and surface. */
const INK = '#2b241d';
const MUTED = '#8a7d6e';
const POOLED = '#7c3820';
const FLAGGED = '#b5562f';

/** Row names of the pooled estimate and the prediction interval in the forest plot, in the reader's language. */
export const pooledRow = (t: Translate = enT) => t('charts.cohort.pooledRow');
export const predictionRow = (t: Translate = enT) => t('charts.cohort.predictionRow');
/** The English row names (kept for callers that predate translation). */
export const POOLED_ROW = pooledRow();
export const PREDICTION_ROW = predictionRow();

/** A crop id as a reader names it; a grower's own crop name (not an id) stays as typed. */
export function cropLabel(crop: string, t: Translate = enT): string {
  return (cropIds as readonly string[]).includes(crop) ? t(`charts.crops.${crop as Crop}`) : crop;
}

/**
 * A member's cohort pseudonym as a reader sees it: the stored "Grower K7" (stable, the same in every
 * CSV) reads "Cultivador K7" in Spanish. Anything not of the form "Grower <tag>" / "Observer <tag>"
 * is shown as stored.
 */
export function pseudonymLabel(pseudonym: string, t: Translate = enT): string {
  const m = /^(Grower|Observer) (\S+)$/.exec(pseudonym);
  if (!m) return pseudonym;
  return m[1] === 'Grower' ? t('charts.pseudonym.grower', { tag: m[2]! }) : t('charts.pseudonym.observer', { tag: m[2]! });
}

/**
 * "Grower K7 · Tomato" for each trial; a grower's second trial of the same crop becomes
 * "Grower K7 · Tomato (2)", in the order the results list them (planting date).
 */
export function trialLabels(results: Pick<CohortResults, 'trials'>, tr: Translate = enT): Record<string, string> {
  const seen = new Map<string, number>();
  const counts = new Map<string, number>();
  const base = (t: CohortResults['trials'][number]) => `${pseudonymLabel(t.pseudonym, tr)} · ${cropLabel(t.crop, tr)}`;
  for (const t of results.trials) counts.set(base(t), (counts.get(base(t)) ?? 0) + 1);
  const out: Record<string, string> = {};
  for (const t of results.trials) {
    const b = base(t);
    const n = (seen.get(b) ?? 0) + 1;
    seen.set(b, n);
    out[t.trialId] = (counts.get(b) ?? 1) > 1 ? `${b} (${n})` : b;
  }
  return out;
}

/** A forest row with what the trial's own row says about it: who, its effect on its own scale, pairs, source, flags. */
export interface ForestTrial extends ForestRow {
  pseudonym: string;
  crop: string;
  /** The trial's effect and the variance it was pooled with (own scale). */
  estimate: number;
  variance: number;
  pairs: number;
  source: 'pairs' | 'season-totals';
  /** The trial has at least one quality flag. */
  flagged: boolean;
}

/**
 * The forest rows of one effect joined with their trials' rows (the response sends each trial's
 * pseudonym, effect, variance, pairs, source and flags once, in `trials`). In the forest's order.
 */
export function forestTrials(results: Pick<CohortResults, 'trials' | 'effects'>, effect: EffectKey): ForestTrial[] {
  const byId = new Map(results.trials.map((t) => [t.trialId, t]));
  return results.effects[effect].forest.map((f) => {
    const t = byId.get(f.trialId);
    const e = t?.effects[effect];
    if (!t || !e || e.estimate === null || e.variance === null || e.source === null) {
      throw new Error(`Forest row ${f.trialId} has no pooled effect in the trial rows.`);
    }
    return { ...f, pseudonym: t.pseudonym, crop: t.crop, estimate: e.estimate, variance: e.variance, pairs: e.pairs, source: e.source, flagged: t.flags.length > 0 };
  });
}

export interface EffectAxis {
  /** Axis title, two lines: what the numbers mean, and which side favours the pots. */
  title: [string, string];
  /** Short unit after a number ("%", "kg", "lb"). */
  unit: string;
  /** Converts a display value (percent, or kg per plant) into the reader's units. */
  convert: (v: number) => number;
  /** Values beyond this are drawn at the edge with an arrow (a back-transformed log ratio has one unbounded side). */
  limits: [number, number];
}

export function effectAxis(effect: EffectKey, o: Pick<ChartOptions, 'units' | 't'>, compact = false): EffectAxis {
  const axis = fullAxis(effect, o);
  if (!compact) return axis;
  // Narrow charts: titles short enough to sit under a plot of about 150 px.
  const t = o.t ?? enT;
  return { ...axis, title: [t(`charts.cohort.compactAxis.${effect}`, { unit: axis.unit }), t(`charts.cohort.compactAxis.${effect}Side`)] };
}

function fullAxis(effect: EffectKey, o: Pick<ChartOptions, 'units' | 't'>): EffectAxis {
  const t = o.t ?? enT;
  switch (effect) {
    case 'waterLogRatio':
      return {
        title: [t('charts.cohort.axis.waterLogRatio'), t('charts.cohort.axis.waterLogRatioSide')],
        unit: '%',
        convert: (v) => v,
        limits: [-100, 100],
      };
    case 'wueLogRatio':
      return {
        title: [t('charts.cohort.axis.wueLogRatio'), t('charts.cohort.axis.wueLogRatioSide')],
        unit: '%',
        convert: (v) => v,
        limits: [-100, 300],
      };
    case 'harvestPerPlantDiff': {
      const unit = unitLabel('mass', o.units);
      return {
        title: [t('charts.cohort.axis.harvestPerPlantDiff', { unit }), t('charts.cohort.axis.harvestPerPlantDiffSide')],
        unit,
        convert: (v) => toDisplay(v, 'mass', o.units),
        limits: [-Infinity, Infinity],
      };
    }
  }
}

interface ForestDatum {
  row: string;
  estimate: number;
  lo: number;
  hi: number;
  weight: number | null;
  group: string;
  pairs: number;
  loClipped: boolean;
  hiClipped: boolean;
}

/**
 * Forest plot of one effect: a row per pooled trial (square sized by its random-effects weight,
 * horizontal confidence interval), the pooled estimate as a diamond spanning its confidence
 * interval with the same interval shaded behind every trial, and the prediction interval dashed
 * on its own row. Trials are sorted by their estimate so the spread reads at a glance.
 * Null when no trial has this effect.
 */
export interface ForestOptions extends ChartOptions {
  /** Narrow screens: each row label on two lines (grower, crop) and taller rows. */
  compact?: boolean;
}

export function forestPlotSpec(results: CohortResults, effect: EffectKey, o: ForestOptions): Spec | null {
  const e: EffectResult = results.effects[effect];
  if (!e.forest.length) return null;
  const t = o.t ?? enT;
  const axis = effectAxis(effect, o, o.compact);
  const labels = trialLabels(results, t);
  const POOLED_LABEL = pooledRow(t);
  const PREDICTION_LABEL = predictionRow(t);
  const FLAG_YES = t('charts.cohort.flagged');
  const FLAG_NO = t('charts.cohort.notFlagged');
  const confidence = Math.round(results.options.confidence * 100);
  const c = axis.convert;

  const trials = forestTrials(results, effect)
    .map((f) => ({
      row: labels[f.trialId] ?? f.pseudonym,
      estimate: c(f.display.estimate),
      lo: c(f.display.ci[0]),
      hi: c(f.display.ci[1]),
      weight: f.weightPercent,
      group: f.flagged ? FLAG_YES : FLAG_NO,
      pairs: f.pairs,
    }))
    .sort((a, b) => b.estimate - a.estimate || a.row.localeCompare(b.row));
  const pooled = e.pooled;
  const p = pooled ? { estimate: c(pooled.display.estimate), lo: c(pooled.display.ci[0]), hi: c(pooled.display.ci[1]) } : null;
  const pi = pooled?.display.predictionInterval ? { lo: c(pooled.display.predictionInterval[0]), hi: c(pooled.display.predictionInterval[1]) } : null;

  // The x range: every interval and 0, cut at the axis limits (clipped intervals get an arrow at the edge).
  const [limLo, limHi] = [c(axis.limits[0]), c(axis.limits[1])];
  const values = [0, ...trials.flatMap((t) => [t.lo, t.hi]), ...(p ? [p.lo, p.hi] : []), ...(pi ? [pi.lo, pi.hi] : [])];
  const domain: [number, number] = [Math.max(limLo, Math.min(...values)), Math.min(limHi, Math.max(...values))];
  const clip = (v: number) => Math.min(domain[1], Math.max(domain[0], v));
  const rows: ForestDatum[] = trials.map((t) => ({
    ...t,
    lo: clip(t.lo),
    hi: clip(t.hi),
    estimate: clip(t.estimate),
    loClipped: t.lo < domain[0],
    hiClipped: t.hi > domain[1],
  }));

  const order = [...rows.map((r) => r.row), ...(p ? [POOLED_LABEL] : []), ...(pi ? [PREDICTION_LABEL] : [])];
  // Every layer names the same axis title, or Vega-Lite would join the field names into one.
  const x = (field: string) => ({
    field,
    type: 'quantitative',
    title: axis.title,
    scale: { domain, nice: true, zero: true },
    axis: { tickCount: o.compact ? 4 : 8 },
  });
  const y = {
    field: 'row',
    type: 'nominal',
    title: null,
    sort: order,
    scale: { domain: order },
    axis: {
      domain: false,
      ticks: false,
      labelPadding: 6,
      // A file rendered on the server measures text by estimate, so it gets more room than a browser.
      labelLimit: o.compact ? 120 : typeof o.width === 'number' ? 280 : 200,
      // On a phone "Grower K7 · Tomato" becomes two lines: grower, then crop.
      ...(o.compact ? { labelExpr: "split(datum.label, ' · ')", labelLineHeight: 13 } : {}),
    },
  };
  const fmt = axis.unit === '%' ? '.0f' : '.2f';
  const legend = { orient: 'bottom', direction: o.compact ? 'vertical' : 'horizontal', labelLimit: 240 };

  const layers: Spec[] = [];
  if (p) {
    layers.push({
      data: { values: [p] },
      mark: { type: 'rect', color: FLAGGED, opacity: 0.12 },
      encoding: { x: x('lo'), x2: { field: 'hi' } },
    });
  }
  layers.push({
    data: { values: [{ zero: 0 }] },
    mark: { type: 'rule', color: MUTED, strokeDash: [3, 3] },
    encoding: { x: x('zero') },
  });
  if (p) {
    layers.push({ data: { values: [p] }, mark: { type: 'rule', color: POOLED, opacity: 0.5 }, encoding: { x: x('estimate') } });
  }
  layers.push(
    {
      data: { values: rows },
      mark: { type: 'rule', color: INK, strokeWidth: 1.5 },
      encoding: { y, x: x('lo'), x2: { field: 'hi' } },
    },
    {
      // An interval running off the axis ends in an arrowhead at the edge.
      data: {
        values: rows.flatMap((r) => [
          ...(r.loClipped ? [{ row: r.row, at: r.lo, arrow: '←' }] : []),
          ...(r.hiClipped ? [{ row: r.row, at: r.hi, arrow: '→' }] : []),
        ]),
      },
      mark: { type: 'text', color: INK, fontSize: 10 },
      encoding: { y, x: x('at'), text: { field: 'arrow' } },
    },
    {
      data: { values: rows },
      mark: { type: 'point', filled: true, opacity: 1 },
      encoding: {
        y,
        x: x('estimate'),
        size: { field: 'weight', type: 'quantitative', title: t('charts.cohort.weight'), scale: { range: [40, 360], zero: true }, legend: null },
        color: {
          field: 'group',
          type: 'nominal',
          title: null,
          scale: { domain: [FLAG_NO, FLAG_YES], range: [INK, FLAGGED] },
          legend,
        },
        shape: {
          field: 'group',
          type: 'nominal',
          title: null,
          scale: { domain: [FLAG_NO, FLAG_YES], range: ['square', 'triangle-up'] },
          legend,
        },
        tooltip: [
          { field: 'row', title: t('charts.cohort.trial') },
          { field: 'estimate', title: t('charts.cohort.estimate', { unit: axis.unit }), format: fmt },
          { field: 'lo', title: t('charts.cohort.ciFrom', { confidence }), format: fmt },
          { field: 'hi', title: t('charts.cohort.to'), format: fmt },
          { field: 'weight', title: t('charts.cohort.weight'), format: '.1f' },
          { field: 'pairs', title: t('charts.cohort.pairs') },
          { field: 'group', title: t('charts.cohort.quality') },
        ],
      },
    },
  );
  if (p) {
    // The diamond: a trail whose width grows from 0 at the CI ends to 14 px at the estimate.
    layers.push({
      data: {
        values: [
          { row: POOLED_LABEL, x: p.lo, w: 0, i: 0 },
          { row: POOLED_LABEL, x: p.estimate, w: 14, i: 1 },
          { row: POOLED_LABEL, x: p.hi, w: 0, i: 2 },
        ],
      },
      mark: { type: 'trail', color: POOLED },
      encoding: { y, x: x('x'), size: { field: 'w', type: 'quantitative', scale: null, legend: null }, order: { field: 'i' } },
    });
    layers.push({
      data: { values: [{ row: POOLED_LABEL, ...p }] },
      mark: { type: 'rule', opacity: 0 },
      encoding: {
        y,
        x: x('lo'),
        x2: { field: 'hi' },
        tooltip: [
          { field: 'estimate', title: t('charts.cohort.pooled', { unit: axis.unit }), format: fmt },
          { field: 'lo', title: t('charts.cohort.ciFrom', { confidence }), format: fmt },
          { field: 'hi', title: t('charts.cohort.to'), format: fmt },
        ],
      },
    });
  }
  if (pi) {
    const piRow = { row: PREDICTION_LABEL, lo: clip(pi.lo), hi: clip(pi.hi), rawLo: pi.lo, rawHi: pi.hi };
    layers.push(
      {
        data: { values: [piRow] },
        mark: { type: 'rule', color: POOLED, strokeWidth: 2, strokeDash: [6, 4] },
        encoding: {
          y,
          x: x('lo'),
          x2: { field: 'hi' },
          tooltip: [
            { field: 'rawLo', title: t('charts.cohort.predictionFrom', { unit: axis.unit }), format: fmt },
            { field: 'rawHi', title: t('charts.cohort.to'), format: fmt },
          ],
        },
      },
      {
        data: {
          values: [
            { row: PREDICTION_LABEL, at: piRow.lo },
            { row: PREDICTION_LABEL, at: piRow.hi },
          ],
        },
        mark: { type: 'tick', color: POOLED, thickness: 2, size: 10, orient: 'vertical' },
        encoding: { y, x: x('at') },
      },
    );
  }

  const height = Math.max(80, (o.compact ? 34 : 26) * order.length);
  return {
    $schema: SCHEMA,
    width: o.width,
    height,
    config: chartConfig,
    layer: layers,
    resolve: { scale: { size: 'independent' } },
  };
}

/**
 * Cumulative water per treatment over the cohort, by ISO week: depth (litres over the
 * treatment's plot area, so beds of different sizes compare fairly) when known, else litres.
 */
export function cohortProgressSpec(results: Pick<CohortResults, 'progress'>, o: ChartOptions): Spec | null {
  if (!results.progress.length) return null;
  const byDepth = results.progress.every((r) => r.cumulativeMm !== null);
  const quantity = byDepth ? ('length-small' as const) : ('volume' as const);
  const unit = unitLabel(quantity, o.units);
  const t = o.t ?? enT;
  const values = results.progress.map((r) => ({
    week: r.weekStart,
    weekLabel: weekLabel(r.weekStart, t),
    isoWeek: r.isoWeek,
    treatment: r.treatment,
    treatmentName: treatmentName(r.treatment, t),
    value: toDisplay(byDepth ? r.cumulativeMm! : r.cumulativeLitres, quantity, o.units),
    trials: r.trials,
  }));
  const scale = treatmentScale(['olla', 'surface']);
  // Weeks as labelled steps ("1 Jun"), not a time scale: the dates carry no time of day, so no
  // time zone can move them, and the labels need no date expressions in the browser's interpreter.
  const weeks = [...new Set(values.map((v) => v.week))].sort();
  const weekAxis = {
    field: 'weekLabel',
    type: 'ordinal',
    title: t('charts.cohort.weekStartingMonday'),
    sort: weeks.map((w) => weekLabel(w, t)),
    axis: { labelAngle: 0, labelOverlap: 'parity' },
  };

  const last = ['olla', 'surface'].flatMap((t) => {
    const rows = values.filter((v) => v.treatment === t);
    return rows.length ? [rows[rows.length - 1]!] : [];
  });
  return {
    $schema: SCHEMA,
    width: o.width,
    height: 240,
    config: chartConfig,
    layer: [
      {
        data: { values },
        mark: { type: 'line', point: true },
        encoding: {
          x: weekAxis,
          y: { field: 'value', type: 'quantitative', title: byDepth ? t('charts.cohort.waterSoFarDepth', { unit }) : t('charts.cohort.waterSoFar', { unit }) },
          color: { field: 'treatment', type: 'nominal', title: t('charts.cohort.treatment'), scale, legend: { orient: 'bottom', direction: 'horizontal', ...treatmentLegendLabels(t) } },
          tooltip: [
            { field: 'isoWeek', title: t('charts.cohort.week') },
            { field: 'treatmentName', title: t('charts.cohort.treatment') },
            { field: 'value', title: unit, format: '.1f' },
            { field: 'trials', title: t('charts.cohort.trialsLogging') },
          ],
        },
      },
      {
        data: { values: last },
        mark: { type: 'text', align: 'right', dy: -10, fontWeight: 600 },
        encoding: {
          x: weekAxis,
          y: { field: 'value', type: 'quantitative' },
          text: { field: 'treatmentName' },
          color: { field: 'treatment', type: 'nominal', scale },
        },
      },
    ],
  };
}

/** "2026-06-01" → "1 Jun" ("1 jun" in Spanish). */
export function weekLabel(isoDate: string, t: Translate = enT): string {
  const [, month, day] = isoDate.split('-').map(Number);
  return t('charts.cohort.weekLabel', { day: String(day), month: t('charts.cohort.months').split(',')[(month ?? 1) - 1] ?? '' });
}

export interface CohortChart {
  id: string;
  title: string;
  spec: Spec;
}

export function forestTitle(effect: EffectKey, t: Translate = enT): string {
  return t(`charts.cohort.titles.${effect}`);
}

/** Every chart of a cohort that has data, with a file-friendly id (for the report bundle). */
export function cohortCharts(results: CohortResults, o: ChartOptions): CohortChart[] {
  const out: CohortChart[] = [];
  const t = o.t ?? enT;
  for (const [effect, id] of [
    ['waterLogRatio', 'forest-water-saved'],
    ['wueLogRatio', 'forest-water-use-efficiency'],
    ['harvestPerPlantDiff', 'forest-harvest-per-plant'],
  ] as const) {
    const spec = forestPlotSpec(results, effect, o);
    if (spec) out.push({ id, title: forestTitle(effect, t), spec });
  }
  const progress = cohortProgressSpec(results, o);
  if (progress) out.push({ id: 'cohort-water-progress', title: t('charts.cohort.titles.progress'), spec: progress });
  return out;
}
