import { describe, expect, it, test } from 'vitest';
import { AnalysisInputError } from '@shared/analysis/paired';
import { pairedPower, pairedSampleSize, pairedSampleSizeFractional } from '@shared/analysis/power';

describe('pairedSampleSize (two-sided paired t-test, noncentral t, strict)', () => {
  it('matches R power.t.test(delta = 1, sd = 1, type = "paired", power = 0.8): n = 9.94 → 10 pairs', () => {
    // R value from REFERENCES.md (marked M, recomputed); scipy.stats.nct root gives 9.937850.
    expect(pairedSampleSizeFractional({ meanDifference: 1, sdDifference: 1 })).toBeCloseTo(9.94, 2);
    expect(pairedSampleSizeFractional({ meanDifference: 1, sdDifference: 1 })).toBeCloseTo(9.93785, 4);
    expect(pairedSampleSize({ meanDifference: 1, sdDifference: 1 })).toBe(10);
  });

  // Effect sizes d_z = 0.2 / 0.5 / 0.8 are Cohen's (1988) small / medium / large. The
  // fractional n are roots of the same power equation solved independently with
  // scipy.stats.nct + brentq (Python); the whole numbers 199 / 34 / 15 for power 0.8 are
  // also the figures commonly quoted for a one-sample / paired t-test (from memory).
  test.each([
    // [delta, sd, alpha, power, fractional n (scipy), whole n]
    [0.5, 1, 0.05, 0.8, 33.36713, 34],
    [0.8, 1, 0.05, 0.8, 14.30276, 15],
    [0.2, 1, 0.05, 0.8, 198.15082, 199],
    [1, 1, 0.01, 0.9, 18.30346, 19],
    [2, 3, 0.05, 0.9, 25.63987, 26],
    [0.5, 1, 0.05, 0.9, 43.99548, 44],
  ])('delta %s, sd %s, alpha %s, power %s → n %s, rounded up %s', (delta, sd, alpha, power, fractional, whole) => {
    const input = { meanDifference: delta, sdDifference: sd, alpha, power };
    expect(pairedSampleSizeFractional(input)).toBeCloseTo(fractional, 3);
    expect(pairedSampleSize(input)).toBe(whole);
  });

  it('gives the same n for a negative expected difference (two-sided test)', () => {
    expect(pairedSampleSize({ meanDifference: -0.5, sdDifference: 1 })).toBe(34);
  });

  it('returns 2 pairs when the effect is huge', () => {
    expect(pairedSampleSize({ meanDifference: 100, sdDifference: 1 })).toBe(2);
  });

  it('is the smallest whole n reaching the power', () => {
    for (const d of [0.3, 0.6, 1.2]) {
      const n = pairedSampleSize({ meanDifference: d, sdDifference: 1 });
      expect(pairedPower({ n, meanDifference: d, sdDifference: 1 })).toBeGreaterThanOrEqual(0.8);
      expect(pairedPower({ n: n - 1, meanDifference: d, sdDifference: 1 })).toBeLessThan(0.8);
    }
  });

  test.each([
    ['zero difference', { meanDifference: 0, sdDifference: 1 }],
    ['zero sd', { meanDifference: 1, sdDifference: 0 }],
    ['alpha of 5', { meanDifference: 1, sdDifference: 1, alpha: 5 }],
    ['power of 1', { meanDifference: 1, sdDifference: 1, power: 1 }],
  ])('throws AnalysisInputError for %s', (_label, input) => {
    expect(() => pairedSampleSize(input)).toThrow(AnalysisInputError);
  });
});

describe('pairedPower', () => {
  test.each([
    // [n, delta, alpha, power] – scipy.stats.nct recomputation (independent implementation)
    [10, 1, 0.05, 0.8030969],
    [20, 0.5, 0.05, 0.5645044],
    [34, 0.5, 0.05, 0.8077775],
    [19, 1, 0.01, 0.914718],
  ])('n = %s, d = %s, alpha = %s → power %s (scipy.stats.nct)', (n, d, alpha, power) => {
    expect(pairedPower({ n, meanDifference: d, sdDifference: 1, alpha })).toBeCloseTo(power, 6);
  });

  it('approaches the normal-theory power for large n', () => {
    // For large n the t test behaves like a z test: power ≈ Φ(√n·d − z_{0.975}) (textbook normal approximation).
    const n = 2000;
    const d = 0.07;
    const z975 = 1.959963984540054;
    const ncp = Math.sqrt(n) * d;
    // Standard normal table: Φ(1.17) = 0.8790, Φ(1.18) = 0.8810, so Φ(1.1705) ≈ 0.8791.
    expect(ncp - z975).toBeCloseTo(1.1705, 3);
    expect(pairedPower({ n, meanDifference: d, sdDifference: 1 })).toBeCloseTo(0.8791, 2);
  });

  it('equals alpha when the difference is tiny (no effect → rejection rate alpha)', () => {
    expect(pairedPower({ n: 30, meanDifference: 1e-9, sdDifference: 1, alpha: 0.05 })).toBeCloseTo(0.05, 6);
  });
});
