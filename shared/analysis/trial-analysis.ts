/**
 * Everything Seepwise computes for one trial, from aggregates the server has already summed in
 * SQL (per-plot totals, per-plot daily litres, weather days, daily moisture means). Pure: no
 * I/O, no clock; the same function can run in the browser.
 */
import enAnalysis from '../locales/en/analysis.json';
import { enT } from '../i18n/translate';
import { CROP_COEFFICIENTS, etc, kcForDay, type CropCoefficients, type CropId } from '../agronomy/crop-coefficients';
import { et0ForDay, type Et0Method } from '../agronomy/et0';
import { describePairs, pairedComparison, type PairDescription, type PairedComparison } from './paired';
import { depthMm, harvestRatio, waterSavingPercent, waterUseEfficiency } from './water';
import { daysBetween, dayNumber, dayOfNumber } from '../time-zone';

export interface PlotAggregate {
  id: string;
  label: string;
  treatment: string | null;
  blockKey: string;
  areaM2: number;
  plantCount: number;
  waterL: number;
  ollaL: number;
  surfaceL: number;
  waterEvents: number;
  harvestKg: number;
  marketableKg: number;
  harvests: number;
}

export interface WeatherAggregate {
  day: string;
  tMinC: number;
  tMaxC: number;
  rainMm: number;
  rhMinPct: number | null;
  rhMaxPct: number | null;
  windSpeedMs: number | null;
  windHeightM: number;
  sunshineHours: number | null;
  solarRadiationMJ: number | null;
}

export interface TrialAnalysisInput {
  trial: {
    crop: string;
    plantingDate: string;
    endDate: string | null;
    treatments: string[];
    kcOverrides: { ini?: number; mid?: number; end?: number };
    stressThresholds: Record<string, number>;
  };
  garden: { latitudeDeg: number; elevationM: number; coastal: boolean };
  plots: PlotAggregate[];
  /** Litres per plot per calendar day of the garden, one row per plot in columns (as the analysis SQL returns it). */
  dailyWater: PlotDailyWater[];
  weather: WeatherAggregate[];
  /** Daily mean soil moisture per treatment and method. */
  moisture: { day: string; treatment: string; method: string; mean: number; n: number }[];
  /** The last day to count (today, or the trial's end). */
  asOf: string;
  confidence?: number;
}

export type PairedMetric =
  | { kind: 'test'; n: number; result: PairedComparison }
  | { kind: 'descriptive'; n: number; description: PairDescription | null; reason: string; reasonKey: DescriptiveReason };

/** Why a metric has no test: `analysis.reasons.<key>` in shared/locales (`reason` is its English text). */
export type DescriptiveReason = keyof typeof enAnalysis.reasons;
/** A warning as a key of `analysis.warnings` in shared/locales with its values, so any language can show it. */
export interface AnalysisNotice {
  key: keyof typeof enAnalysis.warnings;
  params?: Record<string, string>;
}

export interface PairRow {
  blockKey: string;
  treatmentPlot: string;
  controlPlot: string;
  waterMm: [number, number];
  harvestKgPerM2: [number, number];
  wueKgPerM3: [number | null, number | null];
}

export interface Comparison {
  treatment: string;
  control: string;
  pairs: PairRow[];
  /** Season totals across all plots of each treatment. */
  waterSavingPercent: number | null;
  harvestRatio: number | null;
  wueRatio: number | null;
  metrics: { waterMm: PairedMetric; harvestKgPerM2: PairedMetric; wueKgPerM3: PairedMetric };
}

export interface TreatmentSummary {
  treatment: string;
  plotCount: number;
  areaM2: number;
  waterL: number;
  depthMm: number;
  harvestKg: number;
  harvestKgPerM2: number;
  wueKgPerM3: number | null;
}

export interface PlotSummary extends PlotAggregate {
  depthMm: number;
  harvestKgPerM2: number;
  wueKgPerM3: number | null;
}

export interface WeekRow {
  weekStart: string;
  et0Mm: number;
  etcMm: number | null;
  rainMm: number;
  appliedMm: Record<string, number>;
}

/**
 * Water applied to one plot, by day, in columns: day i is `firstDay` plus `dayOffsets[i]` calendar
 * days (ascending, each day once), and `litres[i]` is what the plot received that day (the
 * database's daily sum, unrounded). Days without water are absent. Running totals are the
 * reader's: `cumulativePoints`. (Columns instead of one row or [day, litres so far] pair per day:
 * a 20-plot season went from 90 KB to 25 KB of JSON, and the server no longer reads 3,000 rows;
 * bench/FINDINGS.md "Session 5".)
 */
export interface PlotDailyWater {
  plotId: string;
  firstDay: string;
  dayOffsets: number[];
  litres: number[];
}

export interface PlotWaterDays extends PlotDailyWater {
  label: string;
  treatment: string | null;
}

/** Sums rows of (plot, day, litres), in any order, into per-plot columns: what the analysis SQL does, for callers holding rows. */
export function plotDailyWater(rows: { plotId: string; day: string; litres: number }[]): PlotDailyWater[] {
  const byPlot = new Map<string, Map<string, number>>();
  for (const r of rows) {
    let own = byPlot.get(r.plotId);
    if (!own) byPlot.set(r.plotId, (own = new Map()));
    own.set(r.day, (own.get(r.day) ?? 0) + r.litres);
  }
  return [...byPlot].map(([plotId, days]) => {
    const sorted = [...days].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
    const first = dayNumber(sorted[0]![0]);
    return { plotId, firstDay: sorted[0]![0], dayOffsets: sorted.map(([day]) => dayNumber(day) - first), litres: sorted.map(([, litres]) => litres) };
  });
}


export interface TrialAnalysis {
  plots: PlotSummary[];
  treatments: TreatmentSummary[];
  comparisons: Comparison[];
  /** Water applied per plot and day, one series per plot (plots by label), days in order. */
  waterDays: PlotWaterDays[];
  cropWater: {
    weatherDays: number;
    methods: Record<Et0Method, number>;
    kc: { ini: number; mid: number; end: number } | null;
    totalEt0Mm: number;
    totalEtcMm: number | null;
    totalRainMm: number;
    weekly: WeekRow[];
    /** Applied water as a share of ETc over the days with weather, per treatment. */
    appliedShareOfEtc: Record<string, number | null>;
  };
  moisture: {
    series: { day: string; treatment: string; method: string; value: number }[];
    stress: { treatment: string; method: string; threshold: number; daysBelow: number; daysMeasured: number }[];
  };
  /** The warnings in English (kept for older readers); `notices` carries the same ones as translation keys. */
  warnings: string[];
  notices: AnalysisNotice[];
}

/** One collator for every sort: building one per comparison cost most of the route's time (benchmark). */
const byLabel = new Intl.Collator('en', { numeric: true }).compare;

/** One plot's water so far: `[day, litres up to and including that day]`, one point per day with water. */
export function cumulativePoints(s: PlotWaterDays): [day: string, litresSoFar: number][] {
  const first = dayNumber(s.firstDay);
  let total = 0;
  return s.dayOffsets.map((offset, i) => [dayOfNumber(first + offset), (total += s.litres[i]!)]);
}

/** Day number of the Monday of day number `n`'s ISO week (1970-01-01, day 0, was a Thursday). */
function mondayOf(n: number): number {
  return n - ((((n + 3) % 7) + 7) % 7);
}

/** Monday of the ISO week containing the day. */
export function weekStart(day: string): string {
  return dayOfNumber(mondayOf(dayNumber(day)));
}

function safeWue(kg: number, litres: number): number | null {
  return litres > 0 ? waterUseEfficiency(kg, litres) : null;
}

/** Paired test when there are at least two complete pairs; otherwise the plain description and why. */
function pairedMetric(t: (number | null)[], c: (number | null)[], confidence: number): PairedMetric {
  const tt: number[] = [];
  const cc: number[] = [];
  t.forEach((v, i) => {
    const w = c[i];
    if (v !== null && w !== null && w !== undefined) {
      tt.push(v);
      cc.push(w);
    }
  });
  if (tt.length === 0) return { kind: 'descriptive', n: 0, description: null, reason: enT('analysis.reasons.noCompletePair'), reasonKey: 'noCompletePair' };
  if (tt.length === 1) {
    return {
      kind: 'descriptive',
      n: 1,
      description: describePairs(tt, cc),
      reason: enT('analysis.reasons.singlePair'),
      reasonKey: 'singlePair',
    };
  }
  return { kind: 'test', n: tt.length, result: pairedComparison(tt, cc, { confidence }) };
}

function cropKc(crop: string, overrides: TrialAnalysisInput['trial']['kcOverrides']): CropCoefficients | null {
  const base = CROP_COEFFICIENTS[crop as CropId];
  if (!base) return null;
  return {
    ...base,
    kcIni: overrides.ini ?? base.kcIni,
    kcMid: overrides.mid ?? base.kcMid,
    kcEnd: overrides.end !== undefined ? { min: overrides.end, max: overrides.end } : base.kcEnd,
  };
}

export function analyseTrial(input: TrialAnalysisInput): TrialAnalysis {
  const confidence = input.confidence ?? 0.95;
  const warnings: string[] = [];
  const notices: AnalysisNotice[] = [];
  const warn = (key: AnalysisNotice['key'], params?: Record<string, string>) => {
    notices.push(params ? { key, params } : { key });
    warnings.push(enT(`analysis.warnings.${key}`, params));
  };
  // Object.assign rather than a spread: the same objects, without V8's slow object spread (see et0ForDay).
  const plots: PlotSummary[] = input.plots.map((p) =>
    Object.assign({}, p, {
      depthMm: depthMm(p.waterL, p.areaM2),
      harvestKgPerM2: p.harvestKg / p.areaM2,
      wueKgPerM3: safeWue(p.harvestKg, p.waterL),
    }),
  );
  if (plots.some((p) => p.treatment === null)) warn('unassigned');
  if (plots.length && plots.every((p) => p.harvests === 0)) warn('noHarvest');

  // Per treatment totals.
  const treatmentNames = input.trial.treatments;
  const treatments: TreatmentSummary[] = treatmentNames.map((name) => {
    const own = plots.filter((p) => p.treatment === name);
    const areaM2 = own.reduce((s, p) => s + p.areaM2, 0);
    const waterL = own.reduce((s, p) => s + p.waterL, 0);
    const harvestKg = own.reduce((s, p) => s + p.harvestKg, 0);
    return {
      treatment: name,
      plotCount: own.length,
      areaM2,
      waterL,
      depthMm: areaM2 > 0 ? depthMm(waterL, areaM2) : 0,
      harvestKg,
      harvestKgPerM2: areaM2 > 0 ? harvestKg / areaM2 : 0,
      wueKgPerM3: safeWue(harvestKg, waterL),
    };
  });

  // Comparisons: every treatment against the control (surface watering when present).
  const control = treatmentNames.includes('surface') ? 'surface' : treatmentNames[treatmentNames.length - 1]!;
  const comparisons: Comparison[] = treatmentNames
    .filter((t) => t !== control)
    .map((treatment) => {
      const blocks = [...new Set(plots.map((p) => p.blockKey))].sort(byLabel);
      const pairs: PairRow[] = [];
      for (const blockKey of blocks) {
        const tp = plots.find((p) => p.blockKey === blockKey && p.treatment === treatment);
        const cp = plots.find((p) => p.blockKey === blockKey && p.treatment === control);
        if (!tp || !cp) continue;
        pairs.push({
          blockKey,
          treatmentPlot: tp.label,
          controlPlot: cp.label,
          waterMm: [tp.depthMm, cp.depthMm],
          harvestKgPerM2: [tp.harvestKgPerM2, cp.harvestKgPerM2],
          wueKgPerM3: [tp.wueKgPerM3, cp.wueKgPerM3],
        });
      }
      const ts = treatments.find((x) => x.treatment === treatment)!;
      const cs = treatments.find((x) => x.treatment === control)!;
      const hasHarvest = pairs.some((p) => p.harvestKgPerM2[0] > 0 || p.harvestKgPerM2[1] > 0);
      return {
        treatment,
        control,
        pairs,
        // Totals compare depths (mm), so plots of different size are compared fairly.
        waterSavingPercent: cs.depthMm > 0 ? waterSavingPercent(ts.depthMm, cs.depthMm) : null,
        harvestRatio: cs.harvestKgPerM2 > 0 ? harvestRatio(ts.harvestKgPerM2, cs.harvestKgPerM2) : null,
        wueRatio: ts.wueKgPerM3 !== null && cs.wueKgPerM3 !== null && cs.wueKgPerM3 > 0 ? ts.wueKgPerM3 / cs.wueKgPerM3 : null,
        metrics: {
          waterMm: pairedMetric(
            pairs.map((p) => p.waterMm[0]),
            pairs.map((p) => p.waterMm[1]),
            confidence,
          ),
          harvestKgPerM2: hasHarvest
            ? pairedMetric(
                pairs.map((p) => p.harvestKgPerM2[0]),
                pairs.map((p) => p.harvestKgPerM2[1]),
                confidence,
              )
            : { kind: 'descriptive', n: pairs.length, description: null, reason: enT('analysis.reasons.noHarvest'), reasonKey: 'noHarvest' },
          wueKgPerM3: pairedMetric(
            pairs.map((p) => p.wueKgPerM3[0]),
            pairs.map((p) => p.wueKgPerM3[1]),
            confidence,
          ),
        },
      };
    });
  if (comparisons.every((c) => c.pairs.length === 0) && plots.length) warn('noPair', { control });

  // Water per plot and day, as the database summed it: the plot's label and treatment added once.
  const byPlot = new Map(plots.map((p) => [p.id, p]));
  const waterDays: PlotWaterDays[] = input.dailyWater.map((w) => {
    const p = byPlot.get(w.plotId);
    return { ...w, label: p?.label ?? '', treatment: p?.treatment ?? null };
  });
  waterDays.sort((a, b) => byLabel(a.label, b.label) || (a.plotId < b.plotId ? -1 : a.plotId > b.plotId ? 1 : 0));

  // Crop water need: ET0 per weather day (FAO-56), Kc by stage, ETc; weekly against water applied.
  const kcCrop = cropKc(input.trial.crop, input.trial.kcOverrides);
  if (!kcCrop) warn('noKc');
  const methods: Record<Et0Method, number> = { 'penman-monteith': 0, hargreaves: 0 };
  // Weeks by the day number of their Monday.
  const weeks = new Map<number, WeekRow>();
  const weekFor = (dayNo: number) => {
    const monday = mondayOf(dayNo);
    let w = weeks.get(monday);
    if (!w) {
      w = { weekStart: dayOfNumber(monday), et0Mm: 0, etcMm: kcCrop ? 0 : null, rainMm: 0, appliedMm: Object.fromEntries(treatmentNames.map((t) => [t, 0])) };
      weeks.set(monday, w);
    }
    return w;
  };
  let totalEt0 = 0;
  let totalEtc = 0;
  let totalRain = 0;
  const weatherDaysInTrial = input.weather.filter((w) => w.day >= input.trial.plantingDate && w.day <= input.asOf);
  const weatherDaySet = new Set<number>();
  for (const w of weatherDaysInTrial) {
    const dayNo = dayNumber(w.day);
    weatherDaySet.add(dayNo);
    const r = et0ForDay(
      {
        date: w.day,
        tMinC: w.tMinC,
        tMaxC: w.tMaxC,
        rhMinPct: w.rhMinPct ?? undefined,
        rhMaxPct: w.rhMaxPct ?? undefined,
        windSpeedMs: w.windSpeedMs ?? undefined,
        windHeightM: w.windHeightM,
        sunshineHours: w.sunshineHours ?? undefined,
        solarRadiationMJ: w.solarRadiationMJ ?? undefined,
      },
      { latitudeDeg: input.garden.latitudeDeg, elevationM: input.garden.elevationM, coastal: input.garden.coastal },
    );
    methods[r.method] += 1;
    const week = weekFor(dayNo);
    week.et0Mm += r.et0Mm;
    week.rainMm += w.rainMm;
    totalEt0 += r.et0Mm;
    totalRain += w.rainMm;
    if (kcCrop) {
      const { kc } = kcForDay(kcCrop, daysBetween(input.trial.plantingDate, w.day));
      const e = etc(r.et0Mm, kc);
      week.etcMm = (week.etcMm ?? 0) + e;
      totalEtc += e;
    }
  }
  if (weatherDaysInTrial.length === 0) warn('noWeather');

  // Applied depth per treatment per week, and over the days that have weather (for the share of ETc).
  const areaByTreatment = new Map(treatments.map((t) => [t.treatment, t.areaM2]));
  const appliedOnWeatherDays = new Map<string, number>();
  for (const w of input.dailyWater) {
    const p = byPlot.get(w.plotId);
    if (!p?.treatment) continue;
    const area = areaByTreatment.get(p.treatment) ?? 0;
    if (area <= 0) continue;
    const first = dayNumber(w.firstDay);
    let onWeatherDays = 0;
    for (let i = 0; i < w.dayOffsets.length; i++) {
      const dayNo = first + w.dayOffsets[i]!;
      const mm = depthMm(w.litres[i]!, area);
      const week = weekFor(dayNo);
      week.appliedMm[p.treatment] = (week.appliedMm[p.treatment] ?? 0) + mm;
      if (weatherDaySet.has(dayNo)) onWeatherDays += mm;
    }
    appliedOnWeatherDays.set(p.treatment, (appliedOnWeatherDays.get(p.treatment) ?? 0) + onWeatherDays);
  }
  const appliedShareOfEtc: Record<string, number | null> = {};
  for (const t of treatmentNames) appliedShareOfEtc[t] = kcCrop && totalEtc > 0 ? (appliedOnWeatherDays.get(t) ?? 0) / totalEtc : null;

  // Soil moisture: each method on its own scale; stress days against the grower's thresholds.
  const series = input.moisture.map((m) => ({ day: m.day, treatment: m.treatment, method: m.method, value: m.mean }));
  const stress: TrialAnalysis['moisture']['stress'] = [];
  for (const [method, threshold] of Object.entries(input.trial.stressThresholds)) {
    for (const t of treatmentNames) {
      const days = input.moisture.filter((m) => m.method === method && m.treatment === t);
      if (!days.length) continue;
      // Tensiometers read suction: drier soil gives a higher number.
      const below = days.filter((m) => (method === 'tensiometer' ? m.mean > threshold : m.mean < threshold)).length;
      stress.push({ treatment: t, method, threshold, daysBelow: below, daysMeasured: days.length });
    }
  }

  return {
    plots,
    treatments,
    comparisons,
    waterDays,
    cropWater: {
      weatherDays: weatherDaysInTrial.length,
      methods,
      kc: kcCrop ? { ini: kcCrop.kcIni, mid: kcCrop.kcMid, end: (kcCrop.kcEnd.min + kcCrop.kcEnd.max) / 2 } : null,
      totalEt0Mm: totalEt0,
      totalEtcMm: kcCrop ? totalEtc : null,
      totalRainMm: totalRain,
      weekly: [...weeks].sort((a, b) => a[0] - b[0]).map(([, w]) => w),
      appliedShareOfEtc,
    },
    moisture: { series, stress },
    warnings,
    notices,
  };
}
