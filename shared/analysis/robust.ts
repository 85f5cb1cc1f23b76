/**
 * Robust summaries used by data-quality flags: median, median absolute deviation (MAD),
 * the modified z-score of Iglewicz & Hoaglin (1993), the lag-1 autocorrelation of a series,
 * and a heuristic for volumes typed in the wrong unit (US gallons vs litres).
 *
 * Median and MAD come from simple-statistics.
 */
import { mean, median as ssMedian, medianAbsoluteDeviation } from 'simple-statistics';
import { AnalysisInputError, assertFiniteValues, assertPositive } from './input-error';
import { LITRES_PER_US_GALLON } from '../units';

/** Modified z-scores beyond this are outlier candidates (Iglewicz & Hoaglin 1993, recalled). */
export const ROBUST_Z_OUTLIER = 3.5;
/** 0.6745 ≈ Φ⁻¹(0.75): makes MAD comparable to a standard deviation for normal data. */
export const ROBUST_Z_CONSTANT = 0.6745;

function requireValues(values: readonly number[], minimum = 1): void {
  if (!Array.isArray(values) || values.length < minimum) {
    throw new AnalysisInputError(`At least ${minimum} value(s) are needed (got ${Array.isArray(values) ? values.length : 0}).`);
  }
  assertFiniteValues('values', values);
}

export function median(values: readonly number[]): number {
  requireValues(values);
  return ssMedian(values as number[]);
}

/** Raw (unscaled) median absolute deviation: median(|x − median(x)|). */
export function mad(values: readonly number[]): number {
  requireValues(values);
  return medianAbsoluteDeviation(values as number[]);
}

/**
 * Modified z-scores 0.6745·(x − median)/MAD. When MAD = 0 (more than half the values are
 * identical) a value equal to the median scores 0 and any other ±Infinity: it differs from
 * the bulk, however little, and the flag should show it.
 */
export function robustZScores(values: readonly number[]): number[] {
  const center = median(values);
  const spread = mad(values);
  return values.map((x) => {
    const deviation = x - center;
    if (spread === 0) return deviation === 0 ? 0 : Math.sign(deviation) * Number.POSITIVE_INFINITY;
    return (ROBUST_Z_CONSTANT * deviation) / spread;
  });
}

/** Indices whose modified z-score exceeds the threshold in absolute value (default 3.5). */
export function robustOutliers(values: readonly number[], threshold = ROBUST_Z_OUTLIER): number[] {
  assertPositive('threshold', threshold);
  return robustZScores(values).flatMap((z, index) => (Math.abs(z) > threshold ? [index] : []));
}

/**
 * Lag-1 autocorrelation r(1) = Σ(yᵢ − ȳ)(yᵢ₊₁ − ȳ) / Σ(yᵢ − ȳ)², the definition used for the
 * NIST StRD certified values. A high r(1) in daily readings points at drift (a sensor or a
 * habit) rather than day-to-day noise. NaN when all values are equal.
 */
export function lag1Autocorrelation(values: readonly number[]): number {
  requireValues(values, 2);
  const m = mean(values as number[]);
  let numerator = 0;
  let denominator = 0;
  for (let i = 0; i < values.length; i += 1) {
    const d = (values[i] as number) - m;
    denominator += d * d;
    if (i + 1 < values.length) numerator += d * ((values[i + 1] as number) - m);
  }
  return denominator === 0 ? Number.NaN : numerator / denominator;
}

export interface WrongUnitFlag {
  index: number;
  value: number;
  /** value / median of all the trial's values. */
  ratioToMedian: number;
  /**
   * 'looks-like-gallons-converted-twice': about 3.785 times the others, as if a number in
   * litres was taken for gallons and converted. 'looks-like-gallons-typed-as-litres': about
   * 1/3.785 of the others, as if gallons were typed into a litre field.
   */
  kind: 'looks-like-gallons-converted-twice' | 'looks-like-gallons-typed-as-litres';
  /** The value if the suspected mistake is undone. Never applied automatically. */
  suggestedValue: number;
}

export interface WrongUnitOptions {
  /** Relative tolerance around the factor 3.785 (default 0.15, i.e. ratios 3.29-4.35). */
  tolerance?: number;
  /** Modified z-score the value must exceed to be flagged (default 3.5). */
  threshold?: number;
  /** Fewer values than this give no flags: the median is not trustworthy (default 4). */
  minimumValues?: number;
}

/**
 * Heuristic: which volumes in one trial (litres, e.g. every refill of comparable pots) look
 * like a US-gallon / litre mix-up? A value is flagged when both hold:
 * 1. its ratio to the trial's median is within `tolerance` of 3.785 (the litres in a US
 *    gallon) or of 1/3.785; and
 * 2. it is a robust outlier (|modified z| > threshold), so a trial whose values naturally
 *    spread over a factor of 4 is not flagged wholesale.
 * The median is used because one or two mistaken entries barely move it. It is a prompt for
 * a person to check the entry, never a correction.
 */
export function looksLikeWrongVolumeUnit(values: readonly number[], options: WrongUnitOptions = {}): WrongUnitFlag[] {
  const tolerance = options.tolerance ?? 0.15;
  const threshold = options.threshold ?? ROBUST_Z_OUTLIER;
  const minimumValues = options.minimumValues ?? 4;
  assertPositive('tolerance', tolerance);
  assertPositive('threshold', threshold);
  requireValues(values, 0);
  if (values.length < minimumValues) return [];
  const center = median(values);
  if (!(center > 0)) return [];
  const logFactor = Math.log(LITRES_PER_US_GALLON);
  const logTolerance = Math.log(1 + tolerance);
  // Condition 1 first: with no value near 3.785× or 1/3.785× the median (nearly every series) nothing can
  // be flagged, so the MAD and the z-scores are not computed. Same tests, same order, same flags.
  const nearFactor = (value: number) => {
    if (!(value > 0)) return false;
    const logRatio = Math.log(value / center);
    return Math.abs(logRatio - logFactor) <= logTolerance || Math.abs(logRatio + logFactor) <= logTolerance;
  };
  if (!values.some(nearFactor)) return [];
  const scores = robustZScores(values);
  const flags: WrongUnitFlag[] = [];
  values.forEach((value, index) => {
    if (!(value > 0) || Math.abs(scores[index] as number) <= threshold) return;
    const ratio = value / center;
    const logRatio = Math.log(ratio);
    if (Math.abs(logRatio - logFactor) <= logTolerance) {
      flags.push({
        index,
        value,
        ratioToMedian: ratio,
        kind: 'looks-like-gallons-converted-twice',
        suggestedValue: value / LITRES_PER_US_GALLON,
      });
    } else if (Math.abs(logRatio + logFactor) <= logTolerance) {
      flags.push({
        index,
        value,
        ratioToMedian: ratio,
        kind: 'looks-like-gallons-typed-as-litres',
        suggestedValue: value * LITRES_PER_US_GALLON,
      });
    }
  });
  return flags;
}
