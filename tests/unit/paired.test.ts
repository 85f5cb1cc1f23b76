import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it, test } from 'vitest';
import { AnalysisInputError, averageRanks, describePairs, pairedComparison, wilcoxonSignedRank } from '@shared/analysis/paired';

// Student's sleep data (Cushny & Peebles 1905; Student 1908; R datasets::sleep), extra hours of sleep.
const sleepDrug1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const sleepDrug2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];
// MASS `shoes` (Box, Hunter & Hunter 1978, p. 100): sole wear of materials A and B on the same boys.
const shoesA = [13.2, 8.2, 10.9, 14.3, 10.7, 6.6, 9.5, 10.8, 8.8, 13.3];
const shoesB = [14.0, 8.8, 11.2, 14.2, 11.8, 6.4, 9.8, 11.3, 9.3, 13.6];
// Hollander & Wolfe (1973, p. 29), the example in R's ?wilcox.test (depression scale, first vs second visit).
const hwX = [1.83, 0.5, 1.62, 2.48, 1.68, 1.88, 1.55, 3.06, 1.3];
const hwY = [0.878, 0.647, 0.598, 2.05, 1.06, 1.29, 1.06, 3.14, 1.29];
// Darwin's Zea mays, crossed − self-fertilised heights in eighths of an inch (Fisher 1935).
const darwin = [6, 8, 14, 16, 23, 24, 28, 29, 41, -48, 49, 56, 60, -67, 75];
const zeros = (n: number) => new Array<number>(n).fill(0);

function readNistColumn(file: string): number[] {
  const text = readFileSync(new URL(`../../datasets/nist-strd/${file}`, import.meta.url), 'utf8');
  return text
    .split('\n')
    .filter((line) => line.trim() !== '' && !line.startsWith('#'))
    .slice(1)
    .map(Number);
}

describe('pairedComparison: paired t-test against published results', () => {
  it("reproduces Student's sleep data (drug 1 − drug 2)", () => {
    const r = pairedComparison(sleepDrug1, sleepDrug2);
    expect(r.n).toBe(10);
    expect(r.df).toBe(9); // R t.test(paired = TRUE): df = 9 (REFERENCES.md, V+R)
    expect(r.meanDifference).toBeCloseTo(-1.58, 12); // R: mean difference -1.58 (REFERENCES.md, V+R)
    expect(r.t).toBeCloseTo(-4.0621, 4); // R: t = -4.0621 (REFERENCES.md, V+R)
    expect(r.pValue).toBeCloseTo(0.002833, 6); // R: p-value = 0.002833 (REFERENCES.md, V+R)
    expect(r.ci[0]).toBeCloseTo(-2.4598858, 7); // R: 95% CI -2.4598858 (REFERENCES.md, V+R)
    expect(r.ci[1]).toBeCloseTo(-0.7001142, 7); // R: 95% CI -0.7001142 (REFERENCES.md, V+R)
    // Wilcoxon: zero and tied differences → normal approximation; R gives V = 0, p = 0.009091 (REFERENCES.md, V+R)
    expect(r.wilcoxon.statistic).toBe(0);
    expect(r.wilcoxon.exact).toBe(false);
    expect(r.wilcoxon.zeros).toBe(1);
    expect(r.wilcoxon.pValue).toBeCloseTo(0.009091, 6);
    // d_z = mean / sd of differences; sd 1.229995 recomputed with numpy (R agrees: sd(sleep diff) = 1.229995, memory)
    expect(r.sdDifference).toBeCloseTo(1.229995483, 8);
    expect(r.effectSizeDz).toBeCloseTo(-1.58 / 1.229995483, 8);
  });

  it('reproduces the MASS shoes comparison (A − B)', () => {
    const r = pairedComparison(shoesA, shoesB);
    expect(r.t).toBeCloseTo(-3.3489, 4); // R: t = -3.3489 (REFERENCES.md, V+R)
    expect(r.df).toBe(9); // R: df = 9 (REFERENCES.md, V+R)
    expect(r.pValue).toBeCloseTo(0.008539, 6); // R: p-value = 0.008539 (REFERENCES.md, V+R)
    expect(r.ci[0]).toBeCloseTo(-0.6869539, 7); // R: 95% CI -0.6869539 (REFERENCES.md, V+R)
    expect(r.ci[1]).toBeCloseTo(-0.1330461, 7); // R: 95% CI -0.1330461 (REFERENCES.md, V+R)
    // Wilcoxon on shoes: ties (three 0.3s, two 0.5s) → normal approximation. V = 3 and
    // p = 0.01412 recomputed by hand with R's formula (sigma² = 96.25 − 30/48) and with
    // scipy.stats.wilcoxon(method='approx', correction=True); not a published figure.
    expect(r.wilcoxon.statistic).toBe(3);
    expect(r.wilcoxon.exact).toBe(false);
    expect(r.wilcoxon.ties).toBe(true);
    expect(r.wilcoxon.pValue).toBeCloseTo(0.014116, 5);
  });

  it('reproduces Hollander & Wolfe (1973, p. 29) signed-rank results', () => {
    const twoSided = pairedComparison(hwX, hwY);
    expect(twoSided.wilcoxon.statistic).toBe(40); // R ?wilcox.test example: V = 40 (REFERENCES.md, V+R)
    expect(twoSided.wilcoxon.exact).toBe(true);
    expect(twoSided.wilcoxon.pValue).toBeCloseTo(0.0390625, 12); // exact two-sided p = 0.0390625 (REFERENCES.md, V+R)
    const greater = pairedComparison(hwX, hwY, { alternative: 'greater' });
    expect(greater.wilcoxon.statistic).toBe(40); // R: V = 40 (REFERENCES.md, V+R)
    expect(greater.wilcoxon.pValue).toBeCloseTo(0.01953, 5); // R: one-sided (x > y) p-value = 0.01953 (REFERENCES.md, V+R)
    // one-sided t interval is open above (R's t.test(alternative = "greater") prints Inf)
    expect(greater.ci[1]).toBe(Number.POSITIVE_INFINITY);
    expect(greater.pValue).toBeCloseTo(twoSided.pValue / 2, 12); // t is symmetric: one-sided p = half the two-sided p when t > 0
  });

  it("reproduces Fisher's analysis of Darwin's Zea mays", () => {
    const r = pairedComparison(darwin, zeros(darwin.length));
    expect(r.t).toBeCloseTo(2.148, 3); // Fisher (1935): t = 2.148 (REFERENCES.md, V+R)
    expect(r.df).toBe(14); // df = 14 (REFERENCES.md, V+R)
    expect(r.pValue).toBeCloseTo(0.0497, 4); // p = 0.0497 (REFERENCES.md, V+R)
    expect(r.wilcoxon.exact).toBe(true);
    expect(r.wilcoxon.pValue).toBeCloseTo(0.041259765625, 12); // exact two-sided p = 0.041259765625 = 1352/32768 (REFERENCES.md, V+R)
    expect(r.wilcoxon.statistic).toBe(96); // V = 96: all ranks (120) minus ranks of -48 (10) and -67 (14); R prints V = 96 (recomputed, scipy agrees)
  });

  test.each([
    // [confidence, t quantile for df = 9] – quantiles from standard t tables (e.g. NIST/SEMATECH e-Handbook 1.3.6.7.2)
    [0.9, 1.833],
    [0.95, 2.262],
    [0.99, 3.25],
  ])('uses the t quantile for a %s interval (t table, df = 9)', (confidence, quantile) => {
    const r = pairedComparison(sleepDrug1, sleepDrug2, { confidence });
    const half = (r.ci[1] - r.ci[0]) / 2;
    expect(half / r.standardError).toBeCloseTo(quantile, 3);
  });
});

describe('pairedComparison: numerical accuracy on NIST StRD univariate data (differences against a zero control)', () => {
  it('NumAcc1: mean 10000002, sd 1 (NIST StRD certified values, REFERENCES.md V)', () => {
    const values = [10000001, 10000003, 10000002];
    const r = pairedComparison(values, zeros(3));
    expect(r.meanDifference).toBe(10000002); // certified mean 10000002
    expect(r.sdDifference).toBe(1); // certified s 1
  });

  it('NumAcc4: mean 10000000.2, sd 0.1 to about 1e-7 relative (NIST StRD; REFERENCES.md notes float64 reaches only ~1e-7)', () => {
    const values = [10000000.2];
    for (let i = 0; i < 500; i += 1) values.push(10000000.1, 10000000.3);
    const r = pairedComparison(values, zeros(values.length));
    expect(r.n).toBe(1001);
    expect(Math.abs(r.meanDifference - 10000000.2) / 10000000.2).toBeLessThan(1e-14); // certified mean 10000000.2
    expect(Math.abs(r.sdDifference - 0.1) / 0.1).toBeLessThan(1e-7); // certified s 0.1
    // The one-pass formula Σy² − nȳ² fails here (REFERENCES.md): show that it does, so the test guards the method.
    const n = values.length;
    const onePass = Math.sqrt((values.reduce((s, v) => s + v * v, 0) - n * 10000000.2 ** 2) / (n - 1));
    // (here Σy² − nȳ² even comes out negative, so the square root is NaN)
    expect(Number.isNaN(onePass) || Math.abs(onePass - 0.1) / 0.1 > 1e-3).toBe(true);
  });

  it('Michelso: mean 299.8524, sd 0.0790105478190518 (NIST StRD certified values, REFERENCES.md V)', () => {
    const values = readNistColumn('michelso.csv');
    expect(values).toHaveLength(100);
    const r = pairedComparison(values, zeros(values.length));
    expect(r.meanDifference).toBeCloseTo(299.8524, 12); // certified mean 299.852400000000
    expect(Math.abs(r.sdDifference - 0.0790105478190518) / 0.0790105478190518).toBeLessThan(1e-12); // certified s
  });

  it('Lew: mean -177.435, sd 277.332168044316 (NIST StRD certified values, REFERENCES.md V)', () => {
    const values = readNistColumn('lew.csv');
    expect(values).toHaveLength(200);
    const r = pairedComparison(values, zeros(values.length));
    expect(r.meanDifference).toBeCloseTo(-177.435, 12); // certified mean -177.435000000000
    expect(Math.abs(r.sdDifference - 277.332168044316) / 277.332168044316).toBeLessThan(1e-13); // certified s
  });
});

describe('pairedComparison: input handling', () => {
  test.each([
    ['unequal lengths', [1, 2, 3], [1, 2]],
    ['a single pair', [1], [2]],
    ['no pairs', [], []],
    ['a non-finite value', [1, Number.NaN], [1, 2]],
    ['an infinite value', [1, 2], [Number.POSITIVE_INFINITY, 2]],
  ])('throws AnalysisInputError for %s', (_label, treatment, control) => {
    expect(() => pairedComparison(treatment, control)).toThrow(AnalysisInputError);
  });

  it('names the problem in the message', () => {
    expect(() => pairedComparison([1, 2, 3], [1, 2])).toThrow(/same number of values/);
    expect(() => pairedComparison([1], [2])).toThrow(/at least 2 pairs/);
  });

  it('rejects a confidence level outside (0, 1)', () => {
    expect(() => pairedComparison([1, 2], [0, 0], { confidence: 95 })).toThrow(AnalysisInputError);
  });

  it('returns infinite t and p = 0 when every difference is the same non-zero number (documented)', () => {
    const r = pairedComparison([3, 4, 5], [1, 2, 3]);
    expect(r.constantDifferences).toBe(true);
    expect(r.sdDifference).toBe(0);
    expect(r.t).toBe(Number.POSITIVE_INFINITY);
    expect(r.pValue).toBe(0);
    expect(r.ci).toEqual([2, 2]);
    expect(r.effectSizeDz).toBe(Number.POSITIVE_INFINITY);
    // Three equal differences are tied, so R's rule uses the normal approximation: V = 6,
    // σ² = 3·4·7/24 − (3³ − 3)/48 = 3, z = (6 − 3 − 0.5)/√3 = 1.4434, p = 2·(1 − Φ(1.4434)) = 0.1489 (by hand, normal table)
    expect(r.wilcoxon.statistic).toBe(6);
    expect(r.wilcoxon.exact).toBe(false);
    expect(r.wilcoxon.pValue).toBeCloseTo(0.1489, 4);
  });

  it('returns NaN t and p when every difference is zero (nothing to test, documented)', () => {
    const r = pairedComparison([1, 2, 3], [1, 2, 3]);
    expect(r.constantDifferences).toBe(true);
    expect(r.t).toBeNaN();
    expect(r.pValue).toBeNaN();
    expect(r.effectSizeDz).toBeNaN();
    expect(r.wilcoxon.nonZero).toBe(0);
    expect(r.wilcoxon.pValue).toBeNaN();
  });

  it('rounds differences to 10 decimals before ranking so float noise does not split ties', () => {
    // 0.3 − 0.1 and 0.2 − 0.0 differ in binary (0.19999999999999998 vs 0.2) but are the same difference.
    const w = wilcoxonSignedRank([0.3 - 0.1, 0.2, 0.5, -0.7]);
    expect(w.ties).toBe(true);
    expect(w.exact).toBe(false);
  });
});

describe('Wilcoxon signed-rank exact distribution', () => {
  // Exact null distribution by enumeration of all 2^n sign patterns (independent of the DP in the module).
  function enumerateTwoSided(n: number, v: number): number {
    const total = 2 ** n;
    const counts = new Array<number>((n * (n + 1)) / 2 + 1).fill(0);
    for (let mask = 0; mask < total; mask += 1) {
      let s = 0;
      for (let r = 1; r <= n; r += 1) if (mask & (1 << (r - 1))) s += r;
      counts[s] = (counts[s] as number) + 1;
    }
    const lower = counts.slice(0, v + 1).reduce((a, b) => a + b, 0) / total;
    const upper = counts.slice(v).reduce((a, b) => a + b, 0) / total;
    return Math.min(1, 2 * (v > (n * (n + 1)) / 4 ? upper : lower));
  }

  it('agrees with brute-force enumeration for every V when n = 8', () => {
    for (let v = 0; v <= 36; v += 1) {
      // differences 1..8 with the signs that give V = v (greedy from the largest rank)
      const signs = new Array<number>(8).fill(-1);
      let remaining = v;
      for (let r = 8; r >= 1; r -= 1) {
        if (remaining >= r) {
          signs[r - 1] = 1;
          remaining -= r;
        }
      }
      const d = signs.map((s, i) => s * (i + 1));
      const w = wilcoxonSignedRank(d);
      expect(w.statistic).toBe(v);
      expect(w.pValue).toBeCloseTo(enumerateTwoSided(8, v), 14);
    }
  });

  it('gives average ranks to ties', () => {
    expect(averageRanks([0.3, 0.1, 0.3, 0.5]).ranks).toEqual([2.5, 1, 2.5, 4]);
  });
});

describe('pairedComparison: properties', () => {
  const pairs = fc
    .array(
      fc.tuple(
        fc.double({ min: -1e4, max: 1e4, noNaN: true, noDefaultInfinity: true }),
        fc.double({ min: -1e4, max: 1e4, noNaN: true, noDefaultInfinity: true }),
      ),
      { minLength: 2, maxLength: 60 },
    )
    .filter((ps) => ps.some(([a, b]) => a - b !== ps[0]![0] - ps[0]![1]));

  it('swapping treatment and control negates the mean difference and the CI and keeps the p-values', () => {
    fc.assert(
      fc.property(pairs, (ps) => {
        const t = ps.map(([a]) => a);
        const c = ps.map(([, b]) => b);
        const forward = pairedComparison(t, c);
        const backward = pairedComparison(c, t);
        expect(backward.meanDifference).toBeCloseTo(-forward.meanDifference, 9);
        expect(backward.ci[0]).toBeCloseTo(-forward.ci[1], 9);
        expect(backward.ci[1]).toBeCloseTo(-forward.ci[0], 9);
        expect(backward.pValue).toBeCloseTo(forward.pValue, 12);
        // Wilcoxon p is NaN in both directions when every difference rounds to 0 at 10 decimals.
        if (forward.wilcoxon.nonZero === 0) expect(backward.wilcoxon.pValue).toBeNaN();
        else expect(backward.wilcoxon.pValue).toBeCloseTo(forward.wilcoxon.pValue, 12);
        const nz = forward.wilcoxon.nonZero;
        expect(forward.wilcoxon.statistic + backward.wilcoxon.statistic).toBeCloseTo((nz * (nz + 1)) / 2, 9);
      }),
      { numRuns: 200 },
    );
  });

  it('the CI contains the mean difference and p lies in [0, 1]', () => {
    fc.assert(
      fc.property(pairs, (ps) => {
        const r = pairedComparison(
          ps.map(([a]) => a),
          ps.map(([, b]) => b),
        );
        expect(r.ci[0]).toBeLessThanOrEqual(r.meanDifference);
        expect(r.ci[1]).toBeGreaterThanOrEqual(r.meanDifference);
        expect(r.pValue).toBeGreaterThanOrEqual(0);
        expect(r.pValue).toBeLessThanOrEqual(1);
        if (r.wilcoxon.nonZero > 0) {
          expect(r.wilcoxon.pValue).toBeGreaterThanOrEqual(0);
          expect(r.wilcoxon.pValue).toBeLessThanOrEqual(1);
        } else {
          expect(r.wilcoxon.pValue).toBeNaN();
        }
      }),
      { numRuns: 200 },
    );
  });
});

describe('describePairs', () => {
  it('describes a single pair without inventing a test', () => {
    const d = describePairs([12], [20]);
    expect(d).toMatchObject({ n: 1, treatmentTotal: 12, controlTotal: 20, difference: -8, ratio: 0.6, testable: false });
    expect(d).not.toHaveProperty('pValue');
    expect(d).not.toHaveProperty('ci');
  });

  it('sums several pairs and gives a null ratio for a zero control', () => {
    expect(describePairs([1, 2, 3], [2, 2, 2])).toMatchObject({ treatmentTotal: 6, controlTotal: 6, ratio: 1, meanDifference: 0, testable: true });
    expect(describePairs([1], [0]).ratio).toBeNull();
  });

  it('throws on unequal lengths or no pairs', () => {
    expect(() => describePairs([1, 2], [1])).toThrow(AnalysisInputError);
    expect(() => describePairs([], [])).toThrow(AnalysisInputError);
  });
});
