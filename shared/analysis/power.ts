/**
 * Power and sample size for a two-sided paired t-test, computed like R's
 * `power.t.test(type = "paired", alternative = "two.sided", strict = TRUE)`:
 *
 *   power(n) = P(T' > q) + P(T' < −q),  T' ~ noncentral t(df = n − 1, ncp = √n · |δ| / σ),
 *   q = t_{1 − α/2, n − 1}
 *
 * where δ is the expected mean difference (treatment − control) and σ the standard
 * deviation of the differences. The noncentral t CDF is jstat's `noncentralt.cdf`
 * (series in incomplete beta functions; agrees with scipy.stats.nct to about 1e-8).
 */
import jStat from 'jstat';
import { AnalysisInputError, assertFinite, assertPositive, assertProbability } from './input-error';

export interface PairedPowerInput {
  /** Number of pairs (may be fractional for root finding; at least 2). */
  n: number;
  meanDifference: number;
  sdDifference: number;
  /** Two-sided significance level, default 0.05. */
  alpha?: number;
}

export interface PairedSampleSizeInput {
  meanDifference: number;
  sdDifference: number;
  /** Two-sided significance level, default 0.05. */
  alpha?: number;
  /** Target power, default 0.8. */
  power?: number;
}

const MAX_PAIRS = 1e7;

function validateEffect(meanDifference: number, sdDifference: number): void {
  assertFinite('meanDifference', meanDifference);
  assertPositive('sdDifference', sdDifference);
  if (meanDifference === 0) {
    throw new AnalysisInputError('meanDifference must not be 0: no number of pairs can detect a zero difference.');
  }
}

/** Power of the two-sided paired t-test with n pairs (strict: both rejection tails). */
export function pairedPower({ n, meanDifference, sdDifference, alpha = 0.05 }: PairedPowerInput): number {
  validateEffect(meanDifference, sdDifference);
  assertProbability('alpha', alpha);
  assertFinite('n', n);
  if (n < 2) throw new AnalysisInputError(`n must be at least 2 pairs (got ${n}).`);
  const df = n - 1;
  const q = jStat.studentt.inv(1 - alpha / 2, df);
  const ncp = (Math.sqrt(n) * Math.abs(meanDifference)) / sdDifference;
  const upper = 1 - jStat.noncentralt.cdf(q, df, ncp);
  const lower = jStat.noncentralt.cdf(-q, df, ncp);
  return Math.min(1, Math.max(0, upper + lower));
}

/**
 * The (fractional) number of pairs at which the power equals the target, found by
 * bisection: the value R prints as `n` in power.t.test (e.g. 9.94 for δ = σ = 1).
 * Returns 2 when two pairs already reach the target.
 */
export function pairedSampleSizeFractional({ meanDifference, sdDifference, alpha = 0.05, power = 0.8 }: PairedSampleSizeInput): number {
  validateEffect(meanDifference, sdDifference);
  assertProbability('alpha', alpha);
  assertProbability('power', power);
  const powerAt = (n: number) => pairedPower({ n, meanDifference, sdDifference, alpha });
  let low = 2;
  if (powerAt(low) >= power) return low;
  let high = 4;
  while (powerAt(high) < power) {
    low = high;
    high *= 2;
    if (high > MAX_PAIRS) {
      throw new AnalysisInputError(`More than ${MAX_PAIRS} pairs would be needed: the expected difference is too small against its spread.`);
    }
  }
  for (let i = 0; i < 200 && high - low > 1e-10 * high; i += 1) {
    const mid = (low + high) / 2;
    if (powerAt(mid) < power) low = mid;
    else high = mid;
  }
  return high;
}

/**
 * Smallest whole number of pairs whose two-sided paired t-test reaches the target power
 * (R's power.t.test n rounded up).
 */
export function pairedSampleSize(input: PairedSampleSizeInput): number {
  const fractional = pairedSampleSizeFractional(input);
  const { meanDifference, sdDifference, alpha = 0.05, power = 0.8 } = input;
  let n = Math.max(2, Math.floor(fractional));
  while (pairedPower({ n, meanDifference, sdDifference, alpha }) < power) n += 1;
  return n;
}
