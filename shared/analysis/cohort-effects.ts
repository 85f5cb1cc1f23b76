/**
 * Pooled results of a cohort's shared olla trials, from aggregates the server has summed in SQL
 * (one row per trial, one per block, one per trial·kind of water event·ISO week, one per cohort week).
 * Pure: no I/O, no clock.
 *
 * Per-trial effects, olla against surface watering, from the trial's own pairs (blocks holding
 * both an olla and a surface plot):
 * - waterLogRatio: ln(olla depth / surface depth), depth = litres / plot area (mm);
 * - wueLogRatio: ln(olla WUE / surface WUE), WUE = harvest kg per m³ of water;
 * - harvestPerPlantDiff: olla − surface harvest per plant, kg.
 * With n ≥ 2 pairs the trial's effect is the mean of its per-pair values and its variance s²/n
 * (s² the sample variance, n − 1). A trial with one pair has no within-trial variance: it enters
 * only when the lead opts in, through its season totals, with an imputed variance (see
 * SINGLE_PAIR_RULE: a pragmatic choice, not a published rule).
 *
 * Pooling is shared/analysis/meta.ts (randomEffects, subgroupDifference, leaveOneOut).
 */
import jStat from 'jstat';
import { mean, sampleVariance } from 'simple-statistics';
import type {
  CohortResults,
  CohortTrialRow,
  EffectKey,
  EffectResult,
  Exclusion,
  ForestRow,
  ModeratorKey,
  PooledEstimate,
  ProgressRow,
  QualityFlag,
  SubgroupAnalysis,
  TrialEffect,
  TrialEffectNoteCode,
} from '../schemas/cohort-results';
import { cohortNoteCodes, effectKeys, moderatorKeys, type CohortNoteCode } from '../schemas/cohort-results';
import { randomEffects, subgroupDifference, type RandomEffectsResult, type Tau2Method } from './meta';
import { looksLikeWrongVolumeUnit, median, robustZScores, ROBUST_Z_OUTLIER } from './robust';

/** One shared (not withdrawn) trial, described in SQL. */
export interface CohortTrialAggregate {
  trialId: string;
  pseudonym: string;
  mine: boolean;
  crop: string;
  status: string;
  plantingDate: string;
  endDate: string | null;
  /** Garden location already rounded to whole degrees. */
  latitudeDeg: number;
  longitudeDeg: number;
  soilTexture: string;
  expectedDays: number;
  harvestRecords: number;
  /** Distinct soil-moisture methods logged. */
  moistureMethods: string[];
  /** Distinct values over the trial's olla and surface plots (lids: olla plots only). */
  settings: string[];
  mulch: boolean[];
  lids: boolean[];
  /** Pots in the olla plots. */
  potCount: number;
  meanPotCapacityL: number | null;
  potCapacitiesL: number[];
  potShapes: string[];
  clayBodies: string[];
  potMakes: string[];
  exclusion: { reason: string; createdAt: string; excludedByMe: boolean } | null;
}

/** One block (pair) of a trial: sums over its olla plots and over its surface plots. */
export interface BlockAggregate {
  trialId: string;
  blockKey: string;
  ollaPlots: number;
  ollaAreaM2: number;
  ollaPlants: number;
  ollaL: number;
  ollaHarvestKg: number;
  ollaPlotsWithoutHarvest: number;
  surfacePlots: number;
  surfaceAreaM2: number;
  surfacePlants: number;
  surfaceL: number;
  surfaceHarvestKg: number;
  surfacePlotsWithoutHarvest: number;
}

/**
 * One trial's water events by ISO week, built in SQL as arrays (one row per trial, not one per
 * trial, kind and week). Per kind (olla refills, surface waterings): the Mondays of the weeks with
 * events of that kind, ascending, and each week's mean litres per event (the wrong-unit check).
 */
export interface TrialWaterWeeks {
  trialId: string;
  /**
   * Days inside the season (planting to end or today) with at least one refill or watering record:
   * counted in SQL from per-week weekday masks, both kinds ORed, so a day with both counts once.
   */
  daysWithWater: number;
  ollaWeekStarts: string[];
  ollaLitresPerEvent: number[];
  surfaceWeekStarts: string[];
  surfaceLitresPerEvent: number[];
}

/** Cohort litres per treatment and ISO week with the running total (summed in SQL). */
export interface ProgressAggregate {
  weekStart: string;
  isoWeek: string;
  treatment: 'olla' | 'surface';
  litres: number;
  cumulativeLitres: number;
  trials: number;
}

export interface CohortOptions {
  method: Tau2Method;
  confidence: number;
  includeSinglePairs: boolean;
  excludeFlagged: boolean;
}

export const SINGLE_PAIR_RULE =
  'A trial with a single pair has no within-trial variance. When the lead opts in (includeSinglePairs=true) it contributes its season-totals ' +
  'effect with, as variance, the median per-pair variance s² of the multi-pair trials (not excluded by the lead) for the same effect — the ' +
  'variance of one pair in a typical trial. This is a pragmatic choice, not a published rule; with no multi-pair trial there is nothing to ' +
  'impute from and single-pair trials stay out.';

/** Trials in a subgroup below this count get a small-sample warning (product rule, no source). */
export const SMALL_SUBGROUP = 3;
/** Fewer trials than this give no out-of-line flags: the cohort median is not trustworthy (same floor as looksLikeWrongVolumeUnit). */
export const MIN_TRIALS_FOR_OUTLIER_FLAGS = 4;

interface EffectSpec {
  label: string;
  scale: 'log-ratio' | 'difference';
  displayLabel: string;
  /** Reader-facing transform of a value on the effect's own scale. */
  display: (x: number) => number;
  /** True when display() reverses order (a larger log ratio is a smaller saving). */
  decreasing: boolean;
}

export const EFFECTS: Record<EffectKey, EffectSpec> = {
  waterLogRatio: {
    label: 'Log ratio of water used, olla / surface (depth per pair)',
    scale: 'log-ratio',
    displayLabel: 'Water saved by the pots, % of surface watering: (1 − exp(estimate))·100',
    display: (x) => (1 - Math.exp(x)) * 100,
    decreasing: true,
  },
  wueLogRatio: {
    label: 'Log ratio of water-use efficiency (kg per m³), olla / surface',
    scale: 'log-ratio',
    displayLabel: 'Change in water-use efficiency with pots, %: (exp(estimate) − 1)·100',
    display: (x) => (Math.exp(x) - 1) * 100,
    decreasing: false,
  },
  harvestPerPlantDiff: {
    label: 'Difference in harvest per plant, olla − surface (kg)',
    scale: 'difference',
    displayLabel: 'Harvest per plant, olla − surface, kg',
    display: (x) => x,
    decreasing: false,
  },
};

/** Water saved, % of surface watering, from a pooled log ratio: (1 − exp(estimate))·100. */
export function savingPercent(logRatio: number): number {
  return EFFECTS.waterLogRatio.display(logRatio);
}

function displayInterval(spec: EffectSpec, ci: readonly [number, number]): [number, number] {
  const a = spec.display(ci[0]);
  const b = spec.display(ci[1]);
  return spec.decreasing ? [b, a] : [a, b];
}

function zFor(confidence: number): number {
  return jStat.normal.inv(1 - (1 - confidence) / 2, 0, 1);
}

function finiteOrNull(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}

// ---------------------------------------------------------------------------------------------
// Per-pair values and per-trial effects

export interface PairValues {
  pairs: number;
  pairsMissingHarvest: number;
  values: Record<EffectKey, number[]>;
  /** Season totals over every olla and every surface plot of the trial (single-pair route). */
  totals: Record<EffectKey, number | null>;
}

function logRatioOfDepths(ollaL: number, ollaArea: number, surfaceL: number, surfaceArea: number): number | null {
  if (!(ollaL > 0 && surfaceL > 0 && ollaArea > 0 && surfaceArea > 0)) return null;
  return Math.log(ollaL / ollaArea / (surfaceL / surfaceArea));
}

function logRatioOfWue(ollaKg: number, ollaL: number, surfaceKg: number, surfaceL: number): number | null {
  if (!(ollaKg > 0 && surfaceKg > 0 && ollaL > 0 && surfaceL > 0)) return null;
  return Math.log(ollaKg / ollaL / (surfaceKg / surfaceL));
}

function perPlantDifference(ollaKg: number, ollaPlants: number, surfaceKg: number, surfacePlants: number): number | null {
  if (!(ollaPlants > 0 && surfacePlants > 0)) return null;
  return ollaKg / ollaPlants - surfaceKg / surfacePlants;
}

/**
 * Per-pair values of the three effects for one trial's blocks. A block is a pair when it holds
 * both treatments. Harvest effects need a harvest record on every plot of the pair (a logged
 * 0 kg counts; no record means the harvest is missing, not zero).
 */
export function pairValues(blocks: readonly BlockAggregate[]): PairValues {
  const values: Record<EffectKey, number[]> = { waterLogRatio: [], wueLogRatio: [], harvestPerPlantDiff: [] };
  let pairs = 0;
  let pairsMissingHarvest = 0;
  const t = {
    ollaL: 0,
    ollaArea: 0,
    ollaKg: 0,
    ollaPlants: 0,
    ollaMissing: 0,
    ollaPlots: 0,
    surfaceL: 0,
    surfaceArea: 0,
    surfaceKg: 0,
    surfacePlants: 0,
    surfaceMissing: 0,
    surfacePlots: 0,
  };
  for (const b of blocks) {
    t.ollaL += b.ollaL;
    t.ollaArea += b.ollaAreaM2;
    t.ollaKg += b.ollaHarvestKg;
    t.ollaPlants += b.ollaPlants;
    t.ollaMissing += b.ollaPlotsWithoutHarvest;
    t.ollaPlots += b.ollaPlots;
    t.surfaceL += b.surfaceL;
    t.surfaceArea += b.surfaceAreaM2;
    t.surfaceKg += b.surfaceHarvestKg;
    t.surfacePlants += b.surfacePlants;
    t.surfaceMissing += b.surfacePlotsWithoutHarvest;
    t.surfacePlots += b.surfacePlots;
    if (b.ollaPlots === 0 || b.surfacePlots === 0) continue;
    pairs += 1;
    const water = logRatioOfDepths(b.ollaL, b.ollaAreaM2, b.surfaceL, b.surfaceAreaM2);
    if (water !== null) values.waterLogRatio.push(water);
    const harvested = b.ollaPlotsWithoutHarvest === 0 && b.surfacePlotsWithoutHarvest === 0;
    if (!harvested) {
      pairsMissingHarvest += 1;
      continue;
    }
    const wue = logRatioOfWue(b.ollaHarvestKg, b.ollaL, b.surfaceHarvestKg, b.surfaceL);
    if (wue !== null) values.wueLogRatio.push(wue);
    const perPlant = perPlantDifference(b.ollaHarvestKg, b.ollaPlants, b.surfaceHarvestKg, b.surfacePlants);
    if (perPlant !== null) values.harvestPerPlantDiff.push(perPlant);
  }
  const harvestedTotals = t.ollaPlots > 0 && t.surfacePlots > 0 && t.ollaMissing < t.ollaPlots && t.surfaceMissing < t.surfacePlots;
  return {
    pairs,
    pairsMissingHarvest,
    values,
    totals: {
      waterLogRatio: logRatioOfDepths(t.ollaL, t.ollaArea, t.surfaceL, t.surfaceArea),
      wueLogRatio: harvestedTotals ? logRatioOfWue(t.ollaKg, t.ollaL, t.surfaceKg, t.surfaceL) : null,
      harvestPerPlantDiff: harvestedTotals ? perPlantDifference(t.ollaKg, t.ollaPlants, t.surfaceKg, t.surfacePlants) : null,
    },
  };
}

/** Per-pair values closer than this (relative to max(1, |mean|)) count as identical. */
const IDENTICAL_TOLERANCE = 1e-10;

export interface TrialEffectEstimate {
  pairs: number;
  estimate: number | null;
  variance: number | null;
  perPairVariance: number | null;
  source: 'pairs' | 'season-totals' | null;
  note: string | null;
  noteCode: TrialEffectNoteCode | null;
}

/**
 * A trial's effect from its per-pair values: mean and var/n with n ≥ 2; with one pair, the
 * season-totals value without a variance (the caller may impute one); none with no pair.
 */
export function trialEffect(values: readonly number[], seasonTotal: number | null): TrialEffectEstimate {
  const n = values.length;
  if (n === 0) return { pairs: 0, estimate: null, variance: null, perPairVariance: null, source: null, note: TRIAL_EFFECT_NOTES.no_complete_pair, noteCode: 'no_complete_pair' };
  if (n === 1) {
    return {
      pairs: 1,
      estimate: seasonTotal,
      variance: null,
      perPairVariance: null,
      source: seasonTotal === null ? null : 'season-totals',
      note: TRIAL_EFFECT_NOTES.single_pair,
      noteCode: 'single_pair',
    };
  }
  const s2 = sampleVariance(values as number[]);
  const estimate = mean(values as number[]);
  // Identical values leave floating-point dust (~1e-34) in s², not 0: compare the spread instead.
  const spread = Math.max(...values) - Math.min(...values);
  if (!(s2 > 0) || spread <= IDENTICAL_TOLERANCE * Math.max(1, Math.abs(estimate))) {
    return {
      pairs: n,
      estimate,
      variance: null,
      perPairVariance: 0,
      source: 'pairs',
      note: TRIAL_EFFECT_NOTES.same_value,
      noteCode: 'same_value',
    };
  }
  return { pairs: n, estimate, variance: s2 / n, perPairVariance: s2, source: 'pairs', note: null, noteCode: null };
}

// ---------------------------------------------------------------------------------------------
// Moderators and quality flags

function oneOrMixed(values: readonly string[]): string {
  if (values.length === 0) return 'unknown';
  return values.length === 1 ? values[0]! : 'mixed';
}

function boolLevel(values: readonly boolean[], yes: string, no: string): string {
  const distinct = [...new Set(values)];
  if (distinct.length === 0) return 'unknown';
  if (distinct.length > 1) return 'mixed';
  return distinct[0] ? yes : no;
}

/** Pot capacity class by the mean capacity of the trial's olla pots (class limits are a product choice: <6 L, 6–10 L, >10 L). */
export function potCapacityClass(meanCapacityL: number | null): string {
  if (meanCapacityL === null || !Number.isFinite(meanCapacityL)) return 'unknown';
  if (meanCapacityL < 6) return '<6 L';
  if (meanCapacityL <= 10) return '6–10 L';
  return '>10 L';
}

export function moderatorsOf(t: CohortTrialAggregate): Record<ModeratorKey, string> {
  return {
    potCapacity: potCapacityClass(t.meanPotCapacityL),
    potShape: oneOrMixed([...new Set(t.potShapes)]),
    clayBody: oneOrMixed([...new Set(t.clayBodies)]),
    potMake: oneOrMixed([...new Set(t.potMakes)]),
    crop: t.crop,
    soilTexture: t.soilTexture,
    setting: oneOrMixed([...new Set(t.settings)]),
    mulch: boolLevel(t.mulch, 'mulched', 'bare'),
    lid: boolLevel(t.lids, 'lid', 'no lid'),
  };
}

export function regionLabel(latitudeDeg: number, longitudeDeg: number): string {
  const lat = `${Math.abs(latitudeDeg)}°${latitudeDeg < 0 ? 'S' : 'N'}`;
  const lon = `${Math.abs(longitudeDeg)}°${longitudeDeg < 0 ? 'W' : 'E'}`;
  return `${lat}, ${lon}`;
}

/** looksLikeWrongVolumeUnit's default minimum number of values, passed explicitly so the early skip above cannot drift from it. */
const WRONG_UNIT_MINIMUM_WEEKS = 4;

type WaterSeries = QualityFlag['weeks'][number]['series'];

const SERIES_LABEL: Record<WaterSeries, string> = { olla_refill: 'olla refills', surface: 'surface waterings' };

/**
 * Wrong-unit flag for one trial: looksLikeWrongVolumeUnit on each kind of water event's series
 * of weekly mean litres per event (per event, so a week with more refills is not mistaken for
 * bigger ones; per kind, so pot refills are compared with pot refills). Hits are listed by kind,
 * then by week.
 *
 * Each series' first week is left out of the check: it holds the establishment water — the first
 * fill of a dry pot (the whole pot, plus what the dry clay wall soaks up) and the watering that
 * settles transplants — which is routinely several times a later week's top-up, often close to the
 * gallon factor 3.785 (common practice, no source; our planting guide asks growers to log both).
 */
export function wrongUnitFlag(w: TrialWaterWeeks): QualityFlag | null {
  const hits: QualityFlag['weeks'] = [];
  const bySeries: [WaterSeries, string[], number[]][] = [
    ['olla_refill', w.ollaWeekStarts, w.ollaLitresPerEvent],
    ['surface', w.surfaceWeekStarts, w.surfaceLitresPerEvent],
  ];
  for (const [series, weekStarts, perEvent] of bySeries) {
    // Below the heuristic's minimum nothing can be flagged: skip the medians. The weeks come
    // sorted from SQL, so index 0 is the first week (left out, see above) and hits stay in week order.
    if (perEvent.length - 1 < WRONG_UNIT_MINIMUM_WEEKS) continue;
    const checked = perEvent.slice(1);
    for (const f of looksLikeWrongVolumeUnit(checked, { minimumValues: WRONG_UNIT_MINIMUM_WEEKS })) {
      hits.push({
        series,
        weekStart: weekStarts[f.index + 1]!,
        litresPerEvent: f.value,
        ratioToMedian: f.ratioToMedian,
        suggestedLitresPerEvent: f.suggestedValue,
        kind: f.kind,
      });
    }
  }
  if (!hits.length) return null;
  const first = hits[0]!;
  return {
    kind: 'wrong-unit',
    message:
      `${hits.length} week(s) of water look like a US gallon / litre mix-up (${SERIES_LABEL[first.series]}, week of ${first.weekStart}: ` +
      `${first.litresPerEvent.toFixed(1)} L per event, ${first.ratioToMedian.toFixed(2)}× the trial's usual). Check the entries; nothing was changed.`,
    methods: [],
    effect: null,
    robustZ: null,
    weeks: hits,
  };
}

/** Flags that need only the trial itself: mixed moisture methods, closed without a harvest. */
export function ownFlags(t: CohortTrialAggregate): QualityFlag[] {
  const flags: QualityFlag[] = [];
  if (t.moistureMethods.length > 1) {
    flags.push({
      kind: 'mixed-moisture-methods',
      message: `Soil moisture was read with ${t.moistureMethods.length} methods (${t.moistureMethods.join(', ')}); their scales cannot be compared or averaged.`,
      methods: [...t.moistureMethods],
      effect: null,
      robustZ: null,
      weeks: [],
    });
  }
  if (t.status === 'closed' && t.harvestRecords === 0) {
    flags.push({ kind: 'closed-without-harvest', message: 'The trial was closed without any harvest record.', methods: [], effect: null, robustZ: null, weeks: [] });
  }
  return flags;
}

/**
 * Out-of-line flags: modified z-scores (Iglewicz & Hoaglin; robust.ts) of each trial's effect
 * against the cohort's trials, |z| > 3.5. Needs MIN_TRIALS_FOR_OUTLIER_FLAGS values.
 */
export function outOfLineFlags(effect: EffectKey, estimates: readonly { trialId: string; value: number }[]): Map<string, QualityFlag> {
  const out = new Map<string, QualityFlag>();
  if (estimates.length < MIN_TRIALS_FOR_OUTLIER_FLAGS) return out;
  const values = estimates.map((e) => e.value);
  const center = median(values);
  const z = robustZScores(values);
  estimates.forEach((e, i) => {
    const score = z[i]!;
    if (Math.abs(score) <= ROBUST_Z_OUTLIER) return;
    const spec = EFFECTS[effect];
    out.set(e.trialId, {
      kind: 'out-of-line',
      message:
        `${spec.label}: ${e.value.toFixed(3)} is far from the cohort's median ${center.toFixed(3)} ` +
        (Number.isFinite(score)
          ? `(modified z ${score.toFixed(1)}, beyond ±${ROBUST_Z_OUTLIER}).`
          : '(most trials agree exactly, so any difference stands out).'),
      methods: [],
      effect,
      robustZ: finiteOrNull(score),
      weeks: [],
    });
  });
  return out;
}

// ---------------------------------------------------------------------------------------------
// Pooling

/** One trial's contribution to a pooled estimate. */
export interface PoolEntry {
  trialId: string;
  pseudonym: string;
  effect: number;
  variance: number;
  pairs: number;
  source: 'pairs' | 'season-totals';
  flagged: boolean;
  moderators: Record<ModeratorKey, string>;
}

function presentPooled(spec: EffectSpec, r: RandomEffectsResult): PooledEstimate {
  const pi = r.predictionInterval.every(Number.isFinite) ? ([r.predictionInterval[0], r.predictionInterval[1]] as [number, number]) : null;
  return {
    k: r.k,
    method: r.method,
    estimate: r.estimate,
    se: r.se,
    ci: r.ci,
    pValue: r.pValue,
    tau2: r.tau2,
    q: r.q,
    df: r.df,
    pQ: finiteOrNull(r.pQ),
    i2: r.i2,
    predictionInterval: pi,
    converged: r.converged,
    display: { estimate: spec.display(r.estimate), ci: displayInterval(spec, r.ci), predictionInterval: pi ? displayInterval(spec, pi) : null },
  };
}

/** Random-effects pooled estimate of the entries, or null with the reason (k < 2). */
export function pool(
  effect: EffectKey,
  entries: readonly PoolEntry[],
  options: Pick<CohortOptions, 'method' | 'confidence'>,
): { pooled: PooledEstimate | null; fit: RandomEffectsResult | null; reason: string | null; reasonCode: 'too_few_trials' | null } {
  if (entries.length < 2) {
    return { pooled: null, fit: null, reason: `Pooling needs at least 2 trials with this effect (have ${entries.length}).`, reasonCode: 'too_few_trials' };
  }
  const fit = randomEffects(
    entries.map((e) => e.effect),
    entries.map((e) => e.variance),
    { method: options.method, confidence: options.confidence },
  );
  return { pooled: presentPooled(EFFECTS[effect], fit), fit, reason: null, reasonCode: null };
}

export interface LeaveOneOutFit {
  omitted: number;
  estimate: number;
  se: number;
  ci: [number, number];
  tau2: number;
  i2: number;
}

const REML_TOLERANCE = 1e-10;
const REML_MAX_ITERATIONS = 1000;

/**
 * Leave-one-out fits with the estimators of meta.ts's randomEffects (DL moment estimator; REML
 * Fisher scoring started from the subset's DL τ², with the same step halving and tolerance),
 * written for speed: each subset's fixed-effect sums are the totals minus the omitted trial and
 * every pass is one loop over plain numbers, so 500 trials take milliseconds rather than 500
 * full refits. Tested equal to meta.leaveOneOut. Returns [] below k = 3.
 */
export function fastLeaveOneOut(
  effects: readonly number[],
  variances: readonly number[],
  options: Pick<CohortOptions, 'method' | 'confidence'>,
): LeaveOneOutFit[] {
  const k = effects.length;
  if (k < 3 || variances.length !== k) return [];
  const z = zFor(options.confidence);
  const v = Float64Array.from(variances);
  const w = new Float64Array(k);
  for (let j = 0; j < k; j += 1) w[j] = 1 / v[j]!;
  // Centre the effects (every estimate here shifts with them) so the running sums keep their precision.
  let sw0 = 0;
  let swy0 = 0;
  for (let j = 0; j < k; j += 1) {
    sw0 += w[j]!;
    swy0 += w[j]! * effects[j]!;
  }
  const shift = swy0 / sw0;
  const y = new Float64Array(k);
  for (let j = 0; j < k; j += 1) y[j] = effects[j]! - shift;
  let S1 = 0;
  let S2 = 0;
  let Sy = 0;
  let Syy = 0;
  for (let j = 0; j < k; j += 1) {
    const wj = w[j]!;
    S1 += wj;
    S2 += wj * wj;
    Sy += wj * y[j]!;
    Syy += wj * y[j]! * y[j]!;
  }
  const df = k - 2;
  const reml = options.method === 'REML';
  const out = new Array<LeaveOneOutFit>(k);
  for (let i = 0; i < k; i += 1) {
    const wi = w[i]!;
    const yi = y[i]!;
    const s1 = S1 - wi;
    const s2 = S2 - wi * wi;
    const sy = Sy - wi * yi;
    const q = Syy - wi * yi * yi - (sy * sy) / s1;
    const c = s1 - s2 / s1;
    let tau2 = Math.max(0, (q - df) / c);
    if (reml) tau2 = remlTau2Without(y, v, i, tau2);
    // Same terms in the same order as a loop that skips i, without the test in the loop.
    let sw = 0;
    let swy = 0;
    for (let j = 0; j < i; j += 1) {
      const wr = 1 / (v[j]! + tau2);
      sw += wr;
      swy += wr * y[j]!;
    }
    for (let j = i + 1; j < k; j += 1) {
      const wr = 1 / (v[j]! + tau2);
      sw += wr;
      swy += wr * y[j]!;
    }
    const estimate = swy / sw + shift;
    const se = Math.sqrt(1 / sw);
    const typicalWithin = (df * s1) / (s1 * s1 - s2);
    out[i] = { omitted: i, estimate, se, ci: [estimate - z * se, estimate + z * se], tau2, i2: (100 * tau2) / (tau2 + typicalWithin) };
  }
  return out;
}

/** Running sums of one REML step over every trial but the omitted one (see remlTau2Without). */
const remlSums = new Float64Array(6);

/** Adds trials [from, to) to remlSums: Σw, Σw², Σw³, Σw·y, Σw²·y, Σw²·y². */
function addRemlTerms(y: Float64Array, v: Float64Array, tau2: number, from: number, to: number): void {
  let sw = remlSums[0]!;
  let sw2 = remlSums[1]!;
  let sw3 = remlSums[2]!;
  let swy = remlSums[3]!;
  let sw2y = remlSums[4]!;
  let sw2yy = remlSums[5]!;
  for (let j = from; j < to; j += 1) {
    const wj = 1 / (v[j]! + tau2);
    const w2 = wj * wj;
    const yj = y[j]!;
    const w2y = w2 * yj;
    sw += wj;
    sw2 += w2;
    sw3 += w2 * wj;
    swy += wj * yj;
    sw2y += w2y;
    // (w²·y)·y, the same product, in the same order, as w²·y·y.
    sw2yy += w2y * yj;
  }
  remlSums[0] = sw;
  remlSums[1] = sw2;
  remlSums[2] = sw3;
  remlSums[3] = swy;
  remlSums[4] = sw2y;
  remlSums[5] = sw2yy;
}

/** REML τ² of every trial but `omit`: meta.ts's Fisher scoring, step halving and tolerance, in one pass per step. */
function remlTau2Without(y: Float64Array, v: Float64Array, omit: number, start: number): number {
  let tau2 = start;
  for (let iteration = 1; iteration <= REML_MAX_ITERATIONS; iteration += 1) {
    remlSums.fill(0);
    addRemlTerms(y, v, tau2, 0, omit);
    addRemlTerms(y, v, tau2, omit + 1, y.length);
    const sw = remlSums[0]!;
    const sw2 = remlSums[1]!;
    const sw3 = remlSums[2]!;
    const swy = remlSums[3]!;
    const sw2y = remlSums[4]!;
    const sw2yy = remlSums[5]!;
    const mu = swy / sw;
    const traceP = sw - sw2 / sw;
    const tracePP = sw2 - (2 * sw3) / sw + (sw2 * sw2) / (sw * sw);
    const yPPy = sw2yy - 2 * mu * sw2y + mu * mu * sw2;
    let adjustment = (yPPy - traceP) / tracePP;
    if (tau2 <= 0 && adjustment <= 0) return 0;
    while (tau2 + adjustment < 0) adjustment /= 2;
    tau2 += adjustment;
    if (Math.abs(adjustment) < REML_TOLERANCE) return tau2;
  }
  return tau2;
}

function subgroupLevel(
  spec: EffectSpec,
  level: string,
  entries: readonly PoolEntry[],
  options: Pick<CohortOptions, 'method' | 'confidence'>,
  fit?: { estimate: number; se: number; tau2: number },
) {
  const z = zFor(options.confidence);
  let estimate: number;
  let se: number;
  let tau2 = 0;
  if (fit) {
    ({ estimate, se, tau2 } = fit);
  } else if (entries.length === 1) {
    estimate = entries[0]!.effect;
    se = Math.sqrt(entries[0]!.variance);
  } else {
    const r = randomEffects(
      entries.map((e) => e.effect),
      entries.map((e) => e.variance),
      options,
    );
    estimate = r.estimate;
    se = r.se;
    tau2 = r.tau2;
  }
  const ci: [number, number] = [estimate - z * se, estimate + z * se];
  return {
    level,
    k: entries.length,
    estimate,
    se,
    ci,
    tau2,
    display: { estimate: spec.display(estimate), ci: displayInterval(spec, ci) },
    smallSample: entries.length < SMALL_SUBGROUP,
  };
}

/**
 * Subgroup analysis for one moderator: each level pooled on its own (its own τ²), then
 * subgroupDifference's Q between levels. "unknown" is shown but left out of the test.
 */
export function subgroupAnalysis(
  effect: EffectKey,
  moderator: ModeratorKey,
  entries: readonly PoolEntry[],
  options: Pick<CohortOptions, 'method' | 'confidence'>,
): SubgroupAnalysis {
  const spec = EFFECTS[effect];
  const byLevel = new Map<string, PoolEntry[]>();
  for (const e of entries) {
    const level = e.moderators[moderator];
    const list = byLevel.get(level) ?? [];
    list.push(e);
    byLevel.set(level, list);
  }
  const ordered = [...byLevel.entries()].sort((a, b) => b[1].length - a[1].length || a[0].localeCompare(b[0]));
  const tested = ordered.filter(([level]) => level !== 'unknown');
  let test: SubgroupAnalysis['test'] = null;
  let note: string | null = null;
  let noteCode: SubgroupAnalysis['noteCode'] = null;
  const fitted = new Map<string, { estimate: number; se: number; tau2: number }>();
  if (tested.length >= 2) {
    const d = subgroupDifference(
      tested.map(([, list]) => ({ effects: list.map((e) => e.effect), variances: list.map((e) => e.variance) })),
      options.method,
    );
    test = { q: d.q, df: d.df, pValue: finiteOrNull(d.pValue), levels: tested.map(([level]) => level) };
    // Each level's own fit (its own τ²) is the one the test used.
    d.groups.forEach((g, n) => fitted.set(tested[n]![0], g));
  } else {
    noteCode = entries.length === 0 ? 'no_trials' : 'one_level';
    note = noteCode === 'no_trials' ? 'No trials to compare.' : 'Fewer than 2 known levels among the pooled trials: no test between subgroups.';
  }
  const levels = ordered.map(([level, list]) => subgroupLevel(spec, level, list, options, fitted.get(level)));
  const small = levels.filter((l) => l.smallSample).map((l) => l.level);
  const warning = small.length
    ? `Fewer than ${SMALL_SUBGROUP} trials in ${small.map((s) => `"${s}"`).join(', ')}: those estimates are unstable and the test has little power.`
    : null;
  return { moderator, levels, test, warning, note, noteCode };
}

function forestRows(effect: EffectKey, entries: readonly PoolEntry[], fit: RandomEffectsResult | null, confidence: number): ForestRow[] {
  const spec = EFFECTS[effect];
  const z = zFor(confidence);
  return entries.map((e, i) => {
    const half = z * Math.sqrt(e.variance);
    const ci: [number, number] = [e.effect - half, e.effect + half];
    // The trial's own estimate, variance, pairs, source and flags are in its row of `trials`, not repeated here.
    return {
      trialId: e.trialId,
      weightPercent: fit ? fit.weightsPercent[i]! : entries.length === 1 ? 100 : null,
      display: { estimate: spec.display(e.effect), ci: displayInterval(spec, ci) },
    };
  });
}

/**
 * Everything for one effect: the main pooled estimate over `main`, forest rows, subgroups,
 * leave-one-out, and pooled with and without flagged trials over `base`.
 */
export function effectResult(
  effect: EffectKey,
  base: readonly PoolEntry[],
  options: CohortOptions,
  singlePairs: { eligible: number; included: number; imputedVariance: number | null },
): EffectResult {
  const spec = EFFECTS[effect];
  const main = options.excludeFlagged ? base.filter((e) => !e.flagged) : [...base];
  const { pooled, fit, reason, reasonCode } = pool(effect, main, options);
  let leaveOneOutRows: EffectResult['sensitivity']['leaveOneOut'] = [];
  let leaveOneOutNote: string | null = null;
  let leaveOneOutNoteCode: 'too_few_trials' | null = null;
  if (main.length >= 3) {
    leaveOneOutRows = fastLeaveOneOut(
      main.map((e) => e.effect),
      main.map((e) => e.variance),
      options,
    ).map((r) => ({
      omittedTrialId: main[r.omitted]!.trialId,
      estimate: r.estimate,
      tau2: r.tau2,
      i2: r.i2,
      display: { estimate: spec.display(r.estimate), ci: displayInterval(spec, r.ci) },
    }));
  } else {
    leaveOneOutNoteCode = 'too_few_trials';
    leaveOneOutNote = `Leave-one-out needs at least 3 pooled trials (have ${main.length}).`;
  }
  const unflagged = base.filter((e) => !e.flagged);
  // Reuse the main fit when a sensitivity set is the same trials: each set and `main` are nested, so equal size means equal sets.
  const withFlagged = base.length === main.length ? pooled : pool(effect, base, options).pooled;
  const withoutFlagged = unflagged.length === main.length ? pooled : pool(effect, unflagged, options).pooled;
  return {
    effect,
    label: spec.label,
    scale: spec.scale,
    displayLabel: spec.displayLabel,
    k: main.length,
    pooled,
    reason,
    reasonCode,
    forest: forestRows(effect, main, fit, options.confidence),
    subgroups: moderatorKeys.map((m) => subgroupAnalysis(effect, m, main, options)),
    sensitivity: {
      leaveOneOut: leaveOneOutRows,
      leaveOneOutNote,
      leaveOneOutNoteCode,
      withFlagged,
      withoutFlagged,
      flaggedTrials: base.length - unflagged.length,
    },
    singlePairs: { ...singlePairs, rule: SINGLE_PAIR_RULE },
  };
}

// ---------------------------------------------------------------------------------------------
// The whole cohort

/** English text of each trial-effect note code (the API's `note`; readers get their own words from `noteCode`). */
export const TRIAL_EFFECT_NOTES: Record<TrialEffectNoteCode, string> = {
  no_complete_pair: 'No complete pair has this measurement.',
  single_pair: 'A single pair: no within-trial variance.',
  same_value: 'Every pair gave the same value, so the variance is 0: check for copied entries.',
  single_pair_imputed: 'Single pair: season totals with the imputed variance.',
  excluded: 'Excluded by the lead.',
  flagged_left_out: 'Flagged: left out because excludeFlagged=true.',
  single_pair_opt_in: 'A single pair: included only with includeSinglePairs=true.',
  single_pair_no_donor: 'A single pair, but no multi-pair trial to impute a variance from.',
};

/** English text of the "how these results were made" notes (the API's `notes`). */
export function cohortNoteText(code: CohortNoteCode, method: Tau2Method): string {
  switch (code) {
    case 'pseudonyms':
      return 'Growers appear by their cohort pseudonym only; garden locations are rounded to whole degrees.';
    case 'per_trial':
      return 'Each trial contributes one effect per measure, from its own pairs: the mean of the per-pair values, with variance s²/n.';
    case 'pooling':
      return `Pooled by random effects (${method === 'DL' ? 'DerSimonian-Laird' : 'REML'} τ², Wald-type intervals); the prediction interval uses t on k − 2 df.`;
    case 'flags':
      return 'Quality flags are prompts to check entries, never corrections. Lead exclusions leave the pooled estimates but stay listed with their reason.';
    case 'progress':
      return 'Progress counts every shared trial the lead has not excluded, flagged or not; depth is litres over the treatments’ total plot area in those trials.';
  }
}

export interface DescribedTrial {
  row: CohortTrialRow;
  estimates: Record<EffectKey, TrialEffectEstimate>;
  flagged: boolean;
  excluded: boolean;
}

/** Per-trial rows with effects (before pooling) and quality flags. */
export function describeTrials(
  trials: readonly CohortTrialAggregate[],
  blocks: readonly BlockAggregate[],
  water: readonly TrialWaterWeeks[],
): DescribedTrial[] {
  const blocksByTrial = groupBy(blocks, (b) => b.trialId);
  const waterByTrial = new Map<string, TrialWaterWeeks>();
  for (const w of water) waterByTrial.set(w.trialId, w);
  const prepared = trials.map((t) => {
    const pv = pairValues(blocksByTrial.get(t.trialId) ?? []);
    const estimates = {} as Record<EffectKey, TrialEffectEstimate>;
    for (const k of effectKeys) estimates[k] = trialEffect(pv.values[k], pv.totals[k]);
    const flags = ownFlags(t);
    const weeks = waterByTrial.get(t.trialId);
    const unit = weeks ? wrongUnitFlag(weeks) : null;
    if (unit) flags.push(unit);
    return { t, pv, estimates, flags, watered: weeks?.daysWithWater ?? 0 };
  });
  for (const key of effectKeys) {
    const withEstimate: { trialId: string; value: number }[] = [];
    for (const p of prepared) {
      const value = p.estimates[key].estimate;
      if (value !== null) withEstimate.push({ trialId: p.t.trialId, value });
    }
    const outliers = outOfLineFlags(key, withEstimate);
    if (outliers.size === 0) continue;
    for (const p of prepared) {
      const f = outliers.get(p.t.trialId);
      if (f) p.flags.push(f);
    }
  }
  return prepared.map(({ t, pv, estimates, flags, watered }) => {
    const effects = {} as Record<EffectKey, TrialEffect>;
    for (const k of effectKeys) {
      // Written out rather than spread (V8's slow path for a spread plus a key); same keys, same order.
      const e = estimates[k];
      effects[k] = { pairs: e.pairs, estimate: e.estimate, variance: e.variance, perPairVariance: e.perPairVariance, source: e.source, note: e.note, noteCode: e.noteCode, pooled: false };
    }
    const row: CohortTrialRow = {
      trialId: t.trialId,
      pseudonym: t.pseudonym,
      mine: t.mine,
      crop: t.crop,
      status: t.status,
      plantingDate: t.plantingDate,
      endDate: t.endDate,
      region: { latitudeDeg: t.latitudeDeg, longitudeDeg: t.longitudeDeg, label: regionLabel(t.latitudeDeg, t.longitudeDeg) },
      soilTexture: t.soilTexture,
      potCapacitiesL: [...t.potCapacitiesL].sort((a, b) => a - b),
      potCount: t.potCount,
      moderators: moderatorsOf(t),
      pairs: pv.pairs,
      completeness: {
        expectedDays: t.expectedDays,
        daysWithWater: watered,
        share: t.expectedDays > 0 ? Math.min(1, watered / t.expectedDays) : null,
        harvestRecords: t.harvestRecords,
        pairsMissingHarvest: pv.pairsMissingHarvest,
      },
      flags,
      exclusion: t.exclusion,
      effects,
    };
    return { row, estimates, flagged: flags.length > 0, excluded: t.exclusion !== null };
  });
}

/** Cumulative depth (mm) per treatment: cumulative litres over the treatment's plot area in the trials counted. */
export function progressRows(progress: readonly ProgressAggregate[], areaM2: Record<'olla' | 'surface', number>): ProgressRow[] {
  return progress.map((p) => ({
    ...p,
    cumulativeMm: areaM2[p.treatment] > 0 ? p.cumulativeLitres / areaM2[p.treatment] : null,
  }));
}

export interface CohortAnalysisInput {
  cohortId: string;
  asOf: string;
  trials: CohortTrialAggregate[];
  blocks: BlockAggregate[];
  /** One row per trial with water events (trials without any have none). */
  water: TrialWaterWeeks[];
  /** Summed in SQL over the shared trials the lead has not excluded. */
  progress: ProgressAggregate[];
  options: CohortOptions;
  /** describeTrials() output when the caller already has it (the service needs it for the progress query). */
  described?: DescribedTrial[];
}

export function analyseCohort(input: CohortAnalysisInput): CohortResults {
  const { options } = input;
  const described = input.described ?? describeTrials(input.trials, input.blocks, input.water);
  const effects = {} as CohortResults['effects'];
  for (const key of effectKeys) {
    const candidates = described.filter((d) => !d.excluded);
    const perPair = candidates.map((d) => d.estimates[key]).filter((e) => e.pairs >= 2 && e.variance !== null && e.perPairVariance !== null);
    const imputedVariance = perPair.length ? median(perPair.map((e) => e.perPairVariance!)) : null;
    const eligibleSingles = candidates.filter((d) => d.estimates[key].pairs === 1 && d.estimates[key].estimate !== null);
    const base: PoolEntry[] = [];
    for (const d of candidates) {
      const e = d.estimates[key];
      const entry = (effect: number, variance: number, source: PoolEntry['source']): PoolEntry => ({
        trialId: d.row.trialId,
        pseudonym: d.row.pseudonym,
        effect,
        variance,
        pairs: e.pairs,
        source,
        flagged: d.flagged,
        moderators: d.row.moderators,
      });
      if (e.pairs >= 2 && e.estimate !== null && e.variance !== null) base.push(entry(e.estimate, e.variance, 'pairs'));
      else if (e.pairs === 1 && e.estimate !== null && options.includeSinglePairs && imputedVariance !== null && imputedVariance > 0) {
        base.push(entry(e.estimate, imputedVariance, 'season-totals'));
      }
    }
    const included = base.filter((b) => b.source === 'season-totals').length;
    effects[key] = effectResult(key, base, options, { eligible: eligibleSingles.length, included, imputedVariance });
    // Mark each trial's effect as pooled or say why not.
    const inMain = new Set(effects[key].forest.map((f) => f.trialId));
    const inBase = new Set(base.map((b) => b.trialId));
    for (const d of described) {
      const te = d.row.effects[key];
      if (d.estimates[key].source === 'season-totals' && inBase.has(d.row.trialId)) te.variance = imputedVariance;
      te.pooled = inMain.has(d.row.trialId);
      if (te.pooled) te.noteCode = d.estimates[key].source === 'season-totals' ? 'single_pair_imputed' : null;
      else if (d.excluded) te.noteCode = 'excluded';
      else if (inBase.has(d.row.trialId)) te.noteCode = 'flagged_left_out';
      else if (d.estimates[key].pairs === 1 && d.estimates[key].estimate !== null) {
        te.noteCode = !options.includeSinglePairs ? 'single_pair_opt_in' : 'single_pair_no_donor';
      }
      te.note = te.noteCode === null ? null : TRIAL_EFFECT_NOTES[te.noteCode];
    }
  }

  const exclusions: Exclusion[] = described
    .filter((d) => d.row.exclusion !== null)
    .map((d) => ({ trialId: d.row.trialId, pseudonym: d.row.pseudonym, ...d.row.exclusion! }))
    .sort((a, b) => a.createdAt.localeCompare(b.createdAt));

  // Progress counts every shared trial the lead has not excluded (the SQL does the same).
  const universe = new Set(described.filter((d) => !d.excluded).map((d) => d.row.trialId));
  const area = { olla: 0, surface: 0 };
  for (const b of input.blocks) {
    if (!universe.has(b.trialId)) continue;
    area.olla += b.ollaAreaM2;
    area.surface += b.surfaceAreaM2;
  }

  return {
    cohortId: input.cohortId,
    asOf: input.asOf,
    options,
    counts: {
      sharedTrials: described.length,
      excluded: described.filter((d) => d.excluded).length,
      flagged: described.filter((d) => d.flagged).length,
    },
    trials: described.map((d) => d.row),
    exclusions,
    effects,
    progress: progressRows(input.progress, area),
    notes: cohortNoteCodes.map((code) => cohortNoteText(code, options.method)),
    noteCodes: [...cohortNoteCodes],
  };
}

function groupBy<T>(items: readonly T[], key: (t: T) => string): Map<string, T[]> {
  const out = new Map<string, T[]>();
  for (const item of items) {
    const k = key(item);
    const list = out.get(k);
    if (list) list.push(item);
    else out.set(k, [item]);
  }
  return out;
}
