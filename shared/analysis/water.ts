/**
 * Water accounting for paired olla / surface-watering beds. Quantities are SI as stored:
 * litres, kilograms, square metres, millimetres.
 *
 * Identities used (exact by definition): 1 m³ = 1000 L; 1 mm of water over 1 m² = 1 L.
 */
import { linearRegression, mean, sum } from 'simple-statistics';
import { AnalysisInputError, assertFiniteValues, assertNonNegative, assertPositive } from './input-error';

/**
 * Water-use efficiency (water productivity), kg of harvest per m³ of water applied.
 * Bainbridge (2012) reports up to about 7 kg/m³ for buried clay pots against 0.7 for basin
 * irrigation; the figure depends entirely on crop and climate.
 */
export function waterUseEfficiency(yieldKg: number, waterLitres: number): number {
  assertNonNegative('yieldKg', yieldKg);
  assertPositive('waterLitres', waterLitres);
  return yieldKg / (waterLitres / 1000);
}

/**
 * Water saved by the treatment bed, percent of the control bed's water:
 * 100·(control − treatment)/control. Negative when the treatment used more.
 */
export function waterSavingPercent(treatmentLitres: number, controlLitres: number): number {
  assertNonNegative('treatmentLitres', treatmentLitres);
  assertPositive('controlLitres', controlLitres);
  return (100 * (controlLitres - treatmentLitres)) / controlLitres;
}

/** Depth of water in mm when the given litres are spread over the area in m² (1 L/m² = 1 mm). */
export function depthMm(litres: number, areaM2: number): number {
  assertNonNegative('litres', litres);
  assertPositive('areaM2', areaM2);
  return litres / areaM2;
}

/** Litres needed to apply a depth in mm over an area in m². */
export function litresForDepth(depthMillimetres: number, areaM2: number): number {
  assertNonNegative('depthMm', depthMillimetres);
  assertNonNegative('areaM2', areaM2);
  return depthMillimetres * areaM2;
}

/** Harvest of the treatment bed relative to the control bed (1 = same harvest). */
export function harvestRatio(treatmentYieldKg: number, controlYieldKg: number): number {
  assertNonNegative('treatmentYieldKg', treatmentYieldKg);
  assertPositive('controlYieldKg', controlYieldKg);
  return treatmentYieldKg / controlYieldKg;
}

export interface LineFit {
  n: number;
  slope: number;
  intercept: number;
  slopeSe: number;
  interceptSe: number;
  /** Residual standard deviation √(SSE/(n − 2)). */
  residualSd: number;
  rSquared: number;
}

/**
 * Ordinary least-squares line y = intercept + slope·x with standard errors; the slope and
 * intercept come from simple-statistics' centred linearRegression. Needs 3 or more points
 * (n − 2 residual degrees of freedom) and x values that are not all equal.
 */
export function leastSquaresLine(x: readonly number[], y: readonly number[]): LineFit {
  if (x.length !== y.length) {
    throw new AnalysisInputError(`x and y must have the same length (got ${x.length} and ${y.length}).`);
  }
  if (x.length < 3) throw new AnalysisInputError(`A fitted line with standard errors needs at least 3 points (got ${x.length}).`);
  assertFiniteValues('x', x);
  assertFiniteValues('y', y);
  const n = x.length;
  const xMean = mean(x as number[]);
  const yMean = mean(y as number[]);
  const sxx = sum(x.map((v) => (v - xMean) ** 2));
  if (sxx === 0) throw new AnalysisInputError('x values must not all be equal.');
  const { m: slope, b: intercept } = linearRegression(x.map((v, i) => [v, y[i] as number]));
  const sse = sum(x.map((v, i) => ((y[i] as number) - (intercept + slope * v)) ** 2));
  const syy = sum(y.map((v) => (v - yMean) ** 2));
  const residualSd = Math.sqrt(sse / (n - 2));
  return {
    n,
    slope,
    intercept,
    slopeSe: residualSd / Math.sqrt(sxx),
    interceptSe: residualSd * Math.sqrt(1 / n + (xMean * xMean) / sxx),
    residualSd,
    rSquared: syy === 0 ? Number.NaN : 1 - sse / syy,
  };
}

export interface LevelReading {
  /** Days since the first reading (fractions allowed). */
  day: number;
  /** Litres left in the pot. */
  litres: number;
}

/**
 * Seepage rate of one pot, L/day, from readings of the water left in it between refills:
 * minus the least-squares slope of litres against days, with its standard error.
 */
export function seepageRateFromLevels(readings: readonly LevelReading[]): { litresPerDay: number; se: number; n: number } {
  const fit = leastSquaresLine(
    readings.map((r) => r.day),
    readings.map((r) => r.litres),
  );
  return { litresPerDay: -fit.slope, se: fit.slopeSe, n: fit.n };
}
