/**
 * Paired comparison of an olla (treatment) bed against a surface-watered (control) bed.
 *
 * Each pair is one measurement taken on both beds under the same conditions (same week,
 * same block, same crop). Differences are always treatment − control, so a positive mean
 * difference means "more in the olla bed".
 *
 * Two tests are reported side by side:
 * - Student's paired t-test (mean of the differences, two-sided by default), with the
 *   confidence interval of the mean difference;
 * - the Wilcoxon signed-rank test, following the defaults of R's `wilcox.test(paired = TRUE)`:
 *   zero differences are dropped; the p-value is exact when fewer than 50 non-zero
 *   differences remain and there are neither ties nor zeros; otherwise the normal
 *   approximation with continuity correction and tie-corrected variance is used.
 *
 * Distributions come from jstat, means and standard deviations from simple-statistics.
 * The exact signed-rank distribution is counted by dynamic programming (glue written here).
 */
import jStat from 'jstat';
import { mean, sampleStandardDeviation, sum } from 'simple-statistics';
import { AnalysisInputError, assertFiniteValues, assertProbability } from './input-error';

export { AnalysisInputError } from './input-error';

export type Alternative = 'two-sided' | 'greater' | 'less';

export interface PairedOptions {
  /** Confidence level of the interval, default 0.95. */
  confidence?: number;
  /**
   * Alternative hypothesis about treatment − control, default 'two-sided'.
   * 'greater' means "the olla bed is higher"; 'less' means "the olla bed is lower".
   * It applies to the t-test, its interval (one-sided bounds) and the Wilcoxon test.
   */
  alternative?: Alternative;
}

export interface WilcoxonSignedRank {
  /** Sum of the ranks of the positive differences after dropping zeros (R's V). */
  statistic: number;
  pValue: number;
  /** True when the p-value comes from the exact null distribution. */
  exact: boolean;
  /** Number of non-zero differences that were ranked. */
  nonZero: number;
  /** Number of zero differences that were dropped. */
  zeros: number;
  /** True when some absolute differences were tied. */
  ties: boolean;
}

export interface PairedComparison {
  n: number;
  meanDifference: number;
  sdDifference: number;
  standardError: number;
  t: number;
  df: number;
  pValue: number;
  ci: [number, number];
  confidence: number;
  alternative: Alternative;
  wilcoxon: WilcoxonSignedRank;
  /** Cohen's d_z: mean difference divided by the standard deviation of the differences. */
  effectSizeDz: number;
  /**
   * True when every difference is the same number (sd = 0). Then:
   * - standardError = 0 and ci = [mean, mean] (one-sided: the finite bound is the mean);
   * - if the mean is not zero, t = ±Infinity and the p-value is 0 in the direction of the
   *   mean (1 against it), effectSizeDz = ±Infinity;
   * - if every difference is zero, t, pValue and effectSizeDz are NaN: there is nothing to test.
   * Nothing throws: the caller shows the flag instead of a p-value.
   */
  constantDifferences: boolean;
}

const WILCOXON_EXACT_LIMIT = 50;
const RANK_DECIMALS = 10;

function validatePairs(treatment: readonly number[], control: readonly number[], minimum: number): void {
  if (!Array.isArray(treatment) || !Array.isArray(control)) {
    throw new AnalysisInputError('Treatment and control must be arrays of numbers.');
  }
  if (treatment.length !== control.length) {
    throw new AnalysisInputError(
      `Treatment and control must have the same number of values (got ${treatment.length} and ${control.length}); each value pairs with one on the other bed.`,
    );
  }
  if (treatment.length < minimum) {
    throw new AnalysisInputError(
      minimum === 1 ? 'At least one pair of values is needed.' : `A paired test needs at least ${minimum} pairs (got ${treatment.length}).`,
    );
  }
  assertFiniteValues('treatment', treatment);
  assertFiniteValues('control', control);
}

/** Differences treatment − control, element by element. */
export function pairedDifferences(treatment: readonly number[], control: readonly number[]): number[] {
  validatePairs(treatment, control, 1);
  return treatment.map((value, index) => value - (control[index] as number));
}

/** Round to a fixed number of decimals so floating-point noise does not split ties. */
function roundForRanking(value: number): number {
  return Number(value.toFixed(RANK_DECIMALS));
}

/** Average ranks (1-based) of the values, ties sharing the mean of their positions. */
export function averageRanks(values: readonly number[]): { ranks: number[]; tieSizes: number[] } {
  const order = values.map((_, index) => index).sort((a, b) => (values[a] as number) - (values[b] as number));
  const sorted = order.map((index) => values[index] as number);
  const ranks = new Array<number>(values.length).fill(0);
  const tieSizes: number[] = [];
  let start = 0;
  while (start < sorted.length) {
    let end = start;
    while (end + 1 < sorted.length && sorted[end + 1] === sorted[start]) end += 1;
    const rank = (start + end + 2) / 2;
    for (let k = start; k <= end; k += 1) ranks[order[k] as number] = rank;
    tieSizes.push(end - start + 1);
    start = end + 1;
  }
  return { ranks, tieSizes };
}

/**
 * Exact null distribution of the signed-rank statistic V for n untied, non-zero
 * differences: counts[s] = number of subsets of {1..n} whose sum is s, out of 2^n.
 * Counts stay exact in doubles for n < 50 (2^49 < 2^53).
 */
function signedRankCounts(n: number): number[] {
  const maxSum = (n * (n + 1)) / 2;
  const counts = new Array<number>(maxSum + 1).fill(0);
  counts[0] = 1;
  for (let k = 1; k <= n; k += 1) {
    for (let s = (k * (k + 1)) / 2; s >= k; s -= 1) {
      counts[s] = (counts[s] as number) + (counts[s - k] as number);
    }
  }
  return counts;
}

/** P(V <= q) under the null, like R's psignrank(q, n). */
function signedRankCdf(q: number, counts: readonly number[], n: number): number {
  if (q < 0) return 0;
  let total = 0;
  const upper = Math.min(Math.floor(q), counts.length - 1);
  for (let s = 0; s <= upper; s += 1) total += counts[s] as number;
  return total / 2 ** n;
}

function standardNormalCdf(z: number): number {
  return jStat.normal.cdf(z, 0, 1);
}

/**
 * Wilcoxon signed-rank test on paired differences, with R's wilcox.test defaults.
 * Differences are rounded to 10 decimals first, so any |difference| below 5e-11 counts as
 * zero and is dropped. With no non-zero difference left, the p-value is NaN.
 */
export function wilcoxonSignedRank(differences: readonly number[], alternative: Alternative = 'two-sided'): WilcoxonSignedRank {
  assertFiniteValues('differences', differences);
  const rounded = differences.map(roundForRanking);
  const nonZero = rounded.filter((d) => d !== 0);
  const zeros = rounded.length - nonZero.length;
  const n = nonZero.length;
  if (n === 0) {
    return { statistic: 0, pValue: Number.NaN, exact: false, nonZero: 0, zeros, ties: false };
  }
  const { ranks, tieSizes } = averageRanks(nonZero.map(Math.abs));
  const statistic = sum(ranks.filter((_, i) => (nonZero[i] as number) > 0));
  const ties = tieSizes.some((size) => size > 1);

  if (n < WILCOXON_EXACT_LIMIT && !ties && zeros === 0) {
    const counts = signedRankCounts(n);
    const upperTail = (v: number) => 1 - signedRankCdf(v - 1, counts, n);
    let pValue: number;
    if (alternative === 'greater') {
      pValue = upperTail(statistic);
    } else if (alternative === 'less') {
      pValue = signedRankCdf(statistic, counts, n);
    } else {
      const p = statistic > (n * (n + 1)) / 4 ? upperTail(statistic) : signedRankCdf(statistic, counts, n);
      pValue = Math.min(2 * p, 1);
    }
    return { statistic, pValue, exact: true, nonZero: n, zeros, ties };
  }

  const centred = statistic - (n * (n + 1)) / 4;
  const tieTerm = sum(tieSizes.map((t) => t ** 3 - t));
  const sigma = Math.sqrt((n * (n + 1) * (2 * n + 1)) / 24 - tieTerm / 48);
  const correction = alternative === 'two-sided' ? Math.sign(centred) * 0.5 : alternative === 'greater' ? 0.5 : -0.5;
  const z = (centred - correction) / sigma;
  let pValue: number;
  if (!(sigma > 0)) {
    pValue = Number.NaN;
  } else if (alternative === 'greater') {
    pValue = standardNormalCdf(-z);
  } else if (alternative === 'less') {
    pValue = standardNormalCdf(z);
  } else {
    pValue = 2 * Math.min(standardNormalCdf(z), standardNormalCdf(-z));
  }
  return { statistic, pValue, exact: false, nonZero: n, zeros, ties };
}

function tTestPValue(t: number, df: number, alternative: Alternative): number {
  if (Number.isNaN(t)) return Number.NaN;
  if (!Number.isFinite(t)) {
    if (alternative === 'two-sided') return 0;
    if (alternative === 'greater') return t > 0 ? 0 : 1;
    return t < 0 ? 0 : 1;
  }
  if (alternative === 'greater') return jStat.studentt.cdf(-t, df);
  if (alternative === 'less') return jStat.studentt.cdf(t, df);
  return Math.min(1, 2 * jStat.studentt.cdf(-Math.abs(t), df));
}

/**
 * Paired t-test and Wilcoxon signed-rank test of treatment − control.
 * Throws AnalysisInputError for unequal lengths, fewer than 2 pairs or non-finite values.
 */
export function pairedComparison(treatment: readonly number[], control: readonly number[], options: PairedOptions = {}): PairedComparison {
  validatePairs(treatment, control, 2);
  const confidence = options.confidence ?? 0.95;
  assertProbability('confidence', confidence);
  const alternative = options.alternative ?? 'two-sided';

  const differences = pairedDifferences(treatment, control);
  const n = differences.length;
  const df = n - 1;
  const meanDifference = mean(differences);
  const first = differences[0] as number;
  const constantDifferences = differences.every((d) => d === first);
  const sdDifference = constantDifferences ? 0 : sampleStandardDeviation(differences);
  const standardError = sdDifference / Math.sqrt(n);

  let t: number;
  let effectSizeDz: number;
  if (sdDifference > 0) {
    t = meanDifference / standardError;
    effectSizeDz = meanDifference / sdDifference;
  } else if (meanDifference !== 0) {
    t = Math.sign(meanDifference) * Number.POSITIVE_INFINITY;
    effectSizeDz = t;
  } else {
    t = Number.NaN;
    effectSizeDz = Number.NaN;
  }
  const pValue = tTestPValue(t, df, alternative);

  let ci: [number, number];
  if (alternative === 'two-sided') {
    const q = jStat.studentt.inv(1 - (1 - confidence) / 2, df);
    ci = [meanDifference - q * standardError, meanDifference + q * standardError];
  } else {
    const q = jStat.studentt.inv(confidence, df);
    ci =
      alternative === 'greater'
        ? [meanDifference - q * standardError, Number.POSITIVE_INFINITY]
        : [Number.NEGATIVE_INFINITY, meanDifference + q * standardError];
  }

  return {
    n,
    meanDifference,
    sdDifference,
    standardError,
    t,
    df,
    pValue,
    ci,
    confidence,
    alternative,
    wilcoxon: wilcoxonSignedRank(differences, alternative),
    effectSizeDz,
    constantDifferences,
  };
}

export interface PairDescription {
  n: number;
  treatmentTotal: number;
  controlTotal: number;
  /** treatmentTotal − controlTotal. */
  difference: number;
  /** treatmentTotal / controlTotal; null when the control total is 0. */
  ratio: number | null;
  /** Mean of the per-pair differences (equals difference / n). */
  meanDifference: number;
  differences: number[];
  /** True when there are enough pairs (2 or more) for pairedComparison to run a test. */
  testable: boolean;
}

/**
 * Descriptive comparison for any number of pairs, including one: totals, difference
 * and ratio. It never reports a p-value or interval: one pair gives no estimate of
 * variability, so any test would be invented.
 */
export function describePairs(treatment: readonly number[], control: readonly number[]): PairDescription {
  const differences = pairedDifferences(treatment, control);
  const treatmentTotal = sum(treatment as number[]);
  const controlTotal = sum(control as number[]);
  return {
    n: differences.length,
    treatmentTotal,
    controlTotal,
    difference: treatmentTotal - controlTotal,
    ratio: controlTotal === 0 ? null : treatmentTotal / controlTotal,
    meanDifference: mean(differences),
    differences,
    testable: differences.length >= 2,
  };
}
