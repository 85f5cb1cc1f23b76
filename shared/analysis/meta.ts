/**
 * Random-effects meta-analysis of several olla trials (gardens, seasons), each summarised
 * by an effect (e.g. mean difference or log ratio) and its sampling variance.
 *
 * - Between-trial variance τ² by DerSimonian-Laird (moment estimator) or REML (Fisher
 *   scoring with step halving, as in the R package metafor's rma.uni).
 * - Pooled estimate with inverse-variance weights 1/(vᵢ + τ²), Wald-type (normal) CI.
 * - Cochran's Q from the fixed-effect fit, df = k − 1, its chi-square p-value.
 * - I² = 100·τ² / (τ² + s²) with the "typical" within-trial variance
 *   s² = (k − 1)·Σw / [(Σw)² − Σw²], w = 1/v (Higgins & Thompson 2002), which metafor uses
 *   for every estimator; for DL it equals (Q − df)/Q when τ² > 0.
 * - Prediction interval (Higgins, Thompson & Spiegelhalter 2009):
 *   estimate ± t_{k−2, 1−α/2}·√(τ² + SE²). It needs k ≥ 3; with k = 2 it is [NaN, NaN].
 */
import jStat from 'jstat';
import { sum } from 'simple-statistics';
import { AnalysisInputError, assertFiniteValues, assertNonNegative, assertProbability } from './input-error';

export type Tau2Method = 'DL' | 'REML';

export interface RandomEffectsOptions {
  method?: Tau2Method;
  /** Confidence level for the CI and the prediction interval, default 0.95. */
  confidence?: number;
}

export interface RandomEffectsResult {
  k: number;
  method: Tau2Method;
  estimate: number;
  se: number;
  /** Wald z statistic and two-sided p-value of the pooled estimate. */
  z: number;
  pValue: number;
  ci: [number, number];
  tau2: number;
  q: number;
  df: number;
  pQ: number;
  /** I² in percent. */
  i2: number;
  /** H² = (τ² + s²)/s². */
  h2: number;
  /** [NaN, NaN] when k < 3 (t with k − 2 degrees of freedom does not exist). */
  predictionInterval: [number, number];
  /** Random-effects weights in percent, in input order. */
  weightsPercent: number[];
  /** REML only: whether Fisher scoring converged (always true for DL). */
  converged: boolean;
  iterations: number;
}

const REML_TOLERANCE = 1e-10;
const REML_MAX_ITERATIONS = 1000;

function validate(effects: readonly number[], variances: readonly number[], minimum: number): void {
  if (!Array.isArray(effects) || !Array.isArray(variances)) {
    throw new AnalysisInputError('Effects and variances must be arrays of numbers.');
  }
  if (effects.length !== variances.length) {
    throw new AnalysisInputError(`Effects and variances must have the same length (got ${effects.length} and ${variances.length}).`);
  }
  if (effects.length < minimum) {
    throw new AnalysisInputError(`At least ${minimum} trials are needed (got ${effects.length}).`);
  }
  assertFiniteValues('effects', effects);
  assertFiniteValues('variances', variances);
  variances.forEach((v, i) => {
    if (v <= 0) throw new AnalysisInputError(`variances[${i}] must be greater than zero (got ${v}).`);
  });
}

function weightedMean(values: readonly number[], weights: readonly number[]): number {
  return sum(values.map((y, i) => (weights[i] as number) * y)) / sum(weights as number[]);
}

function twoSidedZ(confidence: number): number {
  return jStat.normal.inv(1 - (1 - confidence) / 2, 0, 1);
}

function chiSquareUpper(q: number, df: number): number {
  if (df <= 0 || Number.isNaN(q)) return Number.NaN;
  return Math.max(0, 1 - jStat.chisquare.cdf(q, df));
}

interface Tau2Fit {
  tau2: number;
  converged: boolean;
  iterations: number;
}

/*
 * The sums below are simple-statistics' compensated `sum` over the same terms in the same order as
 * the plain formulas (Σw, Σw², Σw·y, …), so the results are the same to the last bit; the terms go
 * into scratch Float64Arrays reused across terms and REML steps instead of a new array per term,
 * which a 500-trial cohort (one fit per subgroup level, per sensitivity set, per effect) turned
 * into most of its garbage.
 */

/** simple-statistics' compensated sum of a Float64Array (it reads only length and indices). */
function total(values: Float64Array): number {
  return sum(values as unknown as number[]);
}

/** Σ term(i) for i < scratch.length, compensated, through `scratch`. */
function sumOf(scratch: Float64Array, term: (i: number) => number): number {
  for (let i = 0; i < scratch.length; i += 1) scratch[i] = term(i);
  return total(scratch);
}

function tau2DerSimonianLaird(k: number, sw: number, sw2: number, q: number): Tau2Fit {
  const c = sw - sw2 / sw;
  return { tau2: Math.max(0, (q - (k - 1)) / c), converged: true, iterations: 0 };
}

/**
 * REML τ² by Fisher scoring for the intercept-only model. With W = diag(1/(v + τ²)) and
 * P = W − W11ᵀW / 1ᵀW1, each step adds (YᵀPPY − tr P) / tr(PP), halved while it would make
 * τ² negative (metafor's algorithm, written here for one intercept).
 */
function tau2Reml(effects: readonly number[], variances: readonly number[], start: number, w: Float64Array, scratch: Float64Array): Tau2Fit {
  const k = effects.length;
  let tau2 = start;
  for (let iteration = 1; iteration <= REML_MAX_ITERATIONS; iteration += 1) {
    for (let i = 0; i < k; i += 1) w[i] = 1 / ((variances[i] as number) + tau2);
    const sw = total(w);
    const sw2 = sumOf(scratch, (i) => w[i]! * w[i]!);
    const sw3 = sumOf(scratch, (i) => w[i]! * w[i]! * w[i]!);
    const mu = sumOf(scratch, (i) => w[i]! * (effects[i] as number)) / sw;
    const traceP = sw - sw2 / sw;
    const tracePP = sw2 - (2 * sw3) / sw + (sw2 * sw2) / (sw * sw);
    const yPPy = sumOf(scratch, (i) => w[i]! ** 2 * ((effects[i] as number) - mu) ** 2);
    let adjustment = (yPPy - traceP) / tracePP;
    // At the boundary with the score pointing below zero, τ² = 0 is the REML estimate.
    if (tau2 <= 0 && adjustment <= 0) return { tau2: 0, converged: true, iterations: iteration };
    while (tau2 + adjustment < 0) adjustment /= 2;
    tau2 += adjustment;
    if (Math.abs(adjustment) < REML_TOLERANCE) return { tau2, converged: true, iterations: iteration };
  }
  return { tau2, converged: false, iterations: REML_MAX_ITERATIONS };
}

/** Random-effects meta-analysis (see module note). Needs at least 2 trials. */
export function randomEffects(effects: readonly number[], variances: readonly number[], options: RandomEffectsOptions = {}): RandomEffectsResult {
  validate(effects, variances, 2);
  const method = options.method ?? 'DL';
  if (method !== 'DL' && method !== 'REML') throw new AnalysisInputError(`Unknown τ² method "${String(method)}".`);
  const confidence = options.confidence ?? 0.95;
  assertProbability('confidence', confidence);

  const k = effects.length;
  const df = k - 1;
  const scratch = new Float64Array(k);
  const w = new Float64Array(k);
  for (let i = 0; i < k; i += 1) w[i] = 1 / (variances[i] as number);
  const sw = total(w);
  const sw2 = sumOf(scratch, (i) => w[i]! * w[i]!);
  const fixed = sumOf(scratch, (i) => w[i]! * (effects[i] as number)) / sw;
  const q = sumOf(scratch, (i) => w[i]! * ((effects[i] as number) - fixed) ** 2);

  const dl = tau2DerSimonianLaird(k, sw, sw2, q);
  const fit = method === 'DL' ? dl : tau2Reml(effects, variances, dl.tau2, new Float64Array(k), scratch);
  const tau2 = fit.tau2;

  const wRandom = new Float64Array(k);
  for (let i = 0; i < k; i += 1) wRandom[i] = 1 / ((variances[i] as number) + tau2);
  const swRandom = total(wRandom);
  const estimate = sumOf(scratch, (i) => wRandom[i]! * (effects[i] as number)) / swRandom;
  const se = Math.sqrt(1 / swRandom);
  const zCrit = twoSidedZ(confidence);
  const z = estimate / se;

  const typicalWithin = (df * sw) / (sw * sw - sw2);
  const i2 = (100 * tau2) / (tau2 + typicalWithin);
  const h2 = (tau2 + typicalWithin) / typicalWithin;

  let predictionInterval: [number, number] = [Number.NaN, Number.NaN];
  if (k >= 3) {
    const t = jStat.studentt.inv(1 - (1 - confidence) / 2, k - 2);
    const half = t * Math.sqrt(tau2 + se * se);
    predictionInterval = [estimate - half, estimate + half];
  }

  const weightsPercent = new Array<number>(k);
  for (let i = 0; i < k; i += 1) weightsPercent[i] = (100 * wRandom[i]!) / swRandom;
  return {
    k,
    method,
    estimate,
    se,
    z,
    pValue: 2 * jStat.normal.cdf(-Math.abs(z), 0, 1),
    ci: [estimate - zCrit * se, estimate + zCrit * se],
    tau2,
    q,
    df,
    pQ: chiSquareUpper(q, df),
    i2,
    h2,
    predictionInterval,
    weightsPercent,
    converged: fit.converged,
    iterations: fit.iterations,
  };
}

export interface SubgroupInput {
  effects: number[];
  variances: number[];
}

export interface SubgroupSummary {
  k: number;
  estimate: number;
  se: number;
  tau2: number;
}

export interface SubgroupDifference {
  /** Q_between on the pooled subgroup estimates. */
  q: number;
  /** Number of subgroups − 1. */
  df: number;
  pValue: number;
  groups: SubgroupSummary[];
}

/**
 * Test for a difference between subgroups (e.g. pot size, soil type): each subgroup is
 * pooled on its own, with its own τ² (a subgroup with one trial keeps that trial's
 * estimate and standard error), then Q_between = Σ w_g (θ_g − θ̄)², w_g = 1/SE_g²,
 * θ̄ = Σ w_g θ_g / Σ w_g, against chi-square with (groups − 1) df.
 */
export function subgroupDifference(groups: readonly SubgroupInput[], method: Tau2Method = 'DL'): SubgroupDifference {
  if (!Array.isArray(groups) || groups.length < 2) {
    throw new AnalysisInputError('A subgroup comparison needs at least 2 subgroups.');
  }
  const summaries: SubgroupSummary[] = groups.map((group, index) => {
    validate(group.effects, group.variances, 1);
    if (group.effects.length === 1) {
      return {
        k: 1,
        estimate: group.effects[0] as number,
        se: Math.sqrt(group.variances[0] as number),
        tau2: 0,
      };
    }
    try {
      const fit = randomEffects(group.effects, group.variances, { method });
      return { k: fit.k, estimate: fit.estimate, se: fit.se, tau2: fit.tau2 };
    } catch (error) {
      if (error instanceof AnalysisInputError) {
        throw new AnalysisInputError(`Subgroup ${index + 1}: ${error.message}`);
      }
      throw error;
    }
  });
  const w = summaries.map((g) => 1 / (g.se * g.se));
  const theta = summaries.map((g) => g.estimate);
  const pooled = weightedMean(theta, w);
  const q = sum(theta.map((t, i) => (w[i] as number) * (t - pooled) ** 2));
  const df = summaries.length - 1;
  return { q, df, pValue: chiSquareUpper(q, df), groups: summaries };
}

export interface LeaveOneOutRow extends RandomEffectsResult {
  /** Index (0-based, input order) of the trial left out. */
  omitted: number;
}

/** The random-effects analysis repeated k times, each time without one trial. Needs k ≥ 3. */
export function leaveOneOut(effects: readonly number[], variances: readonly number[], options: RandomEffectsOptions = {}): LeaveOneOutRow[] {
  validate(effects, variances, 3);
  return effects.map((_, omitted) => {
    const keep = (_value: number, index: number) => index !== omitted;
    return { omitted, ...randomEffects(effects.filter(keep), variances.filter(keep), options) };
  });
}

export interface TwoByTwoCounts {
  /** Events in the treatment arm. */
  treatmentEvents: number;
  /** Non-events in the treatment arm. */
  treatmentNonEvents: number;
  controlEvents: number;
  controlNonEvents: number;
}

/**
 * Log risk ratio and its large-sample variance from a 2×2 table:
 * yi = ln[(a/(a+b)) / (c/(c+d))], vi = 1/a − 1/(a+b) + 1/c − 1/(c+d).
 * When any cell is 0, 0.5 is added to all four cells (the usual continuity correction).
 */
export function logRiskRatio(counts: TwoByTwoCounts): { effect: number; variance: number } {
  let a = counts.treatmentEvents;
  let b = counts.treatmentNonEvents;
  let c = counts.controlEvents;
  let d = counts.controlNonEvents;
  for (const [name, value] of Object.entries(counts)) assertNonNegative(name, value as number);
  if (a + b === 0 || c + d === 0) throw new AnalysisInputError('Each arm needs at least one participant.');
  if (a === 0 || b === 0 || c === 0 || d === 0) {
    a += 0.5;
    b += 0.5;
    c += 0.5;
    d += 0.5;
  }
  return {
    effect: Math.log(a / (a + b) / (c / (c + d))),
    variance: 1 / a - 1 / (a + b) + 1 / c - 1 / (c + d),
  };
}
