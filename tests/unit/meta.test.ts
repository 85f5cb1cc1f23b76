import fc from 'fast-check';
import { describe, expect, it, test } from 'vitest';
import { AnalysisInputError } from '@shared/analysis/paired';
import { leaveOneOut, logRiskRatio, randomEffects, subgroupDifference } from '@shared/analysis/meta';

// BCG vaccine trials (Colditz et al. 1994; R metafor `dat.bcg`), per trial: tpos, tneg, cpos, cneg.
const bcg: Array<[number, number, number, number]> = [
  [4, 119, 11, 128],
  [6, 300, 29, 274],
  [3, 228, 11, 209],
  [62, 13536, 248, 12619],
  [33, 5036, 47, 5761],
  [180, 1361, 372, 1079],
  [8, 2537, 10, 619],
  [505, 87886, 499, 87892],
  [29, 7470, 45, 7232],
  [17, 1699, 65, 1600],
  [186, 50448, 141, 27197],
  [5, 2493, 3, 2338],
  [27, 16886, 29, 17825],
];
const logRr = bcg.map(([a, b, c, d]) => logRiskRatio({ treatmentEvents: a, treatmentNonEvents: b, controlEvents: c, controlNonEvents: d }));
const yi = logRr.map((r) => r.effect);
const vi = logRr.map((r) => r.variance);

describe('logRiskRatio (escalc measure "RR")', () => {
  it('computes yi and vi of the first BCG trial by the formula in REFERENCES.md', () => {
    // yi = ln[(4/123)/(11/139)], vi = 1/4 − 1/123 + 1/11 − 1/139: by hand −0.889311, 0.325585
    expect(yi[0]).toBeCloseTo(-0.8893113339, 9);
    expect(vi[0]).toBeCloseTo(0.325584765, 9);
  });

  it('adds 0.5 to every cell when one is zero', () => {
    const r = logRiskRatio({ treatmentEvents: 0, treatmentNonEvents: 10, controlEvents: 5, controlNonEvents: 5 });
    expect(r.effect).toBeCloseTo(Math.log(0.5 / 11 / (5.5 / 11)), 12);
    expect(r.variance).toBeCloseTo(1 / 0.5 - 1 / 11 + 1 / 5.5 - 1 / 11, 12);
  });
});

describe('randomEffects on the BCG trials (log risk ratios)', () => {
  it('DerSimonian-Laird matches the published metafor results', () => {
    const r = randomEffects(yi, vi, { method: 'DL' });
    expect(r.k).toBe(13);
    expect(r.df).toBe(12); // Q (df = 12)
    expect(r.q).toBeCloseTo(152.233, 3); // Q = 152.2330 (REFERENCES.md, V+R)
    expect(r.pQ).toBeLessThan(1e-15); // metafor prints p < .0001 (true value about 2e-26, scipy)
    expect(r.tau2).toBeCloseTo(0.3088, 4); // DL τ² = 0.3088 (REFERENCES.md, V(t)+R)
    expect(r.estimate).toBeCloseTo(-0.7141, 4); // DL estimate −0.7141 (REFERENCES.md, V(t)+R)
    expect(r.se).toBeCloseTo(0.1787, 4); // DL SE 0.1787 (REFERENCES.md, V(t)+R)
    expect(r.ci[0]).toBeCloseTo(-1.0644, 4); // DL 95% CI lower −1.0644 (REFERENCES.md, V(t)+R)
    expect(r.ci[1]).toBeCloseTo(-0.3638, 4); // DL 95% CI upper −0.3638 (REFERENCES.md, V(t)+R)
    expect(r.i2).toBeCloseTo(92.12, 2); // DL I² = 92.12 % (REFERENCES.md, V(t)+R)
    expect(r.i2).toBeCloseTo((100 * (r.q - r.df)) / r.q, 8); // for DL, I² = (Q − df)/Q (Higgins & Thompson 2002)
  });

  it('REML matches the published metafor results', () => {
    const r = randomEffects(yi, vi, { method: 'REML' });
    expect(r.converged).toBe(true);
    expect(r.q).toBeCloseTo(152.233, 3); // Q = 152.2330 (REFERENCES.md, V+R)
    expect(r.tau2).toBeCloseTo(0.3132, 4); // REML τ² = 0.3132 (REFERENCES.md, V+R)
    expect(r.estimate).toBeCloseTo(-0.7145, 4); // REML estimate −0.7145 (REFERENCES.md, V+R)
    expect(r.se).toBeCloseTo(0.1798, 4); // REML SE 0.1798 (REFERENCES.md, V+R)
    expect(r.ci[0]).toBeCloseTo(-1.0669, 4); // REML 95% CI lower −1.0669 (REFERENCES.md, V+R)
    expect(r.ci[1]).toBeCloseTo(-0.3622, 4); // REML 95% CI upper −0.3622 (REFERENCES.md, V+R)
    expect(r.i2).toBeCloseTo(92.22, 2); // REML I² = 92.22 % typical-within-variance form (REFERENCES.md, V+R)
  });

  it('REML τ² maximises the restricted likelihood (checked on a grid, independent of Fisher scoring)', () => {
    // Restricted log-likelihood of the intercept-only random-effects model, up to a constant
    // (standard form, e.g. Viechtbauer 2005; written from memory and checked against scipy's optimum 0.313243).
    const restricted = (t2: number) => {
      const w = vi.map((v) => 1 / (v + t2));
      const sw = w.reduce((a, b) => a + b, 0);
      const mu = w.reduce((a, wi, i) => a + wi * (yi[i] as number), 0) / sw;
      return -0.5 * (vi.reduce((a, v) => a + Math.log(v + t2), 0) + Math.log(sw) + w.reduce((a, wi, i) => a + wi * ((yi[i] as number) - mu) ** 2, 0));
    };
    const tau2 = randomEffects(yi, vi, { method: 'REML' }).tau2;
    for (const delta of [-0.01, -0.001, 0.001, 0.01]) {
      expect(restricted(tau2)).toBeGreaterThan(restricted(tau2 + delta));
    }
  });

  it('gives the Higgins-Thompson-Spiegelhalter prediction interval with t on k − 2 df', () => {
    // Recomputed independently in Python (numpy/scipy, t_{11, 0.975} = 2.200985): not a published value.
    const dl = randomEffects(yi, vi, { method: 'DL' });
    expect(dl.predictionInterval[0]).toBeCloseTo(-1.998838, 5);
    expect(dl.predictionInterval[1]).toBeCloseTo(0.570604, 5);
    const reml = randomEffects(yi, vi, { method: 'REML' });
    expect(reml.predictionInterval[0]).toBeCloseTo(-2.008376, 5);
    expect(reml.predictionInterval[1]).toBeCloseTo(0.579311, 5);
  });

  it('weights sum to 100 %', () => {
    const r = randomEffects(yi, vi);
    expect(r.weightsPercent.reduce((a, b) => a + b, 0)).toBeCloseTo(100, 10);
  });
});

describe('randomEffects edge cases', () => {
  it('returns τ² = 0 and the fixed-effect result for homogeneous trials', () => {
    // Identical effects: Q = 0, so τ² = 0 for DL and REML, I² = 0 and the estimate is the common value.
    for (const method of ['DL', 'REML'] as const) {
      const r = randomEffects([0.2, 0.2, 0.2, 0.2], [0.1, 0.2, 0.3, 0.4], { method });
      expect(r.tau2).toBeCloseTo(0, 8);
      expect(r.q).toBeCloseTo(0, 12);
      expect(r.i2).toBeCloseTo(0, 6);
      expect(r.estimate).toBeCloseTo(0.2, 12);
      // inverse-variance SE = 1/√(Σ 1/v) = 1/√(10 + 5 + 3.333 + 2.5)
      expect(r.se).toBeCloseTo(1 / Math.sqrt(10 + 5 + 10 / 3 + 2.5), 6);
    }
  });

  it('returns a NaN prediction interval for k = 2 (no t with 0 df; documented)', () => {
    const r = randomEffects([0.1, 0.5], [0.01, 0.02]);
    expect(r.predictionInterval[0]).toBeNaN();
    expect(r.predictionInterval[1]).toBeNaN();
    expect(Number.isFinite(r.estimate)).toBe(true);
  });

  test.each([
    ['one trial', [0.1], [0.01]],
    ['unequal lengths', [0.1, 0.2], [0.01]],
    ['a zero variance', [0.1, 0.2], [0.01, 0]],
    ['a NaN effect', [0.1, Number.NaN], [0.01, 0.02]],
  ])('throws AnalysisInputError for %s', (_label, effects, variances) => {
    expect(() => randomEffects(effects, variances)).toThrow(AnalysisInputError);
  });

  it('does not depend on the order of the trials (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: 0.001, max: 1, noNaN: true })), { minLength: 3, maxLength: 15 }),
        fc.constantFrom('DL' as const, 'REML' as const),
        (trials, method) => {
          const forward = randomEffects(
            trials.map((t) => t[0]),
            trials.map((t) => t[1]),
            { method },
          );
          const reversed = [...trials].reverse();
          const backward = randomEffects(
            reversed.map((t) => t[0]),
            reversed.map((t) => t[1]),
            { method },
          );
          expect(backward.estimate).toBeCloseTo(forward.estimate, 6);
          expect(backward.tau2).toBeCloseTo(forward.tau2, 6);
          expect(forward.tau2).toBeGreaterThanOrEqual(0);
          expect(forward.ci[0]).toBeLessThanOrEqual(forward.estimate);
          expect(forward.ci[1]).toBeGreaterThanOrEqual(forward.estimate);
        },
      ),
      { numRuns: 100 },
    );
  });
});

describe('leaveOneOut', () => {
  it('matches an independent recomputation (Python/numpy) for the BCG trials', () => {
    const dl = leaveOneOut(yi, vi, { method: 'DL' });
    expect(dl).toHaveLength(13);
    // Values recomputed in Python with the same estimators; not published figures.
    expect(dl[0]!.omitted).toBe(0);
    expect(dl[0]!.estimate).toBeCloseTo(-0.7051252, 6);
    expect(dl[0]!.tau2).toBeCloseTo(0.3121715, 6);
    expect(dl[5]!.estimate).toBeCloseTo(-0.7127273, 6);
    expect(dl[7]!.estimate).toBeCloseTo(-0.7900866, 6);
    expect(dl[7]!.i2).toBeCloseTo(83.820153, 4);
    const reml = leaveOneOut(yi, vi, { method: 'REML' });
    expect(reml[0]!.estimate).toBeCloseTo(-0.7070838, 6);
    expect(reml[7]!.tau2).toBeCloseTo(0.2731829, 6);
  });

  it('needs at least 3 trials', () => {
    expect(() => leaveOneOut([0.1, 0.2], [0.01, 0.01])).toThrow(AnalysisInputError);
  });
});

describe('subgroupDifference', () => {
  const groups = [
    { effects: yi.slice(0, 6), variances: vi.slice(0, 6) },
    { effects: yi.slice(6), variances: vi.slice(6) },
  ];

  it('tests BCG trials 1-6 against 7-13 with separate τ² per subgroup', () => {
    // Q_between and p recomputed independently in Python (numpy/scipy): not published figures.
    const dl = subgroupDifference(groups, 'DL');
    expect(dl.df).toBe(1);
    expect(dl.groups[0]!.estimate).toBeCloseTo(-0.9841155, 6);
    expect(dl.groups[1]!.estimate).toBeCloseTo(-0.471446, 6);
    expect(dl.q).toBeCloseTo(2.9589162, 6);
    expect(dl.pValue).toBeCloseTo(0.0854052, 6);
    const reml = subgroupDifference(groups, 'REML');
    expect(reml.q).toBeCloseTo(2.1297443, 5);
    expect(reml.pValue).toBeCloseTo(0.1444649, 5);
  });

  it('gives Q = 0 for identical subgroups and keeps a one-trial subgroup as it is', () => {
    const same = subgroupDifference([groups[0]!, groups[0]!]);
    expect(same.q).toBeCloseTo(0, 12);
    expect(same.pValue).toBeCloseTo(1, 12);
    const single = subgroupDifference([{ effects: [0.3], variances: [0.04] }, groups[1]!]);
    expect(single.groups[0]).toEqual({ k: 1, estimate: 0.3, se: 0.2, tau2: 0 });
  });

  it('with two subgroups, Q_between = z² of the difference of the pooled estimates', () => {
    // Algebraic identity for 2 groups: Σw(θ − θ̄)² = (θ1 − θ2)² / (SE1² + SE2²).
    const r = subgroupDifference(groups, 'DL');
    const [g1, g2] = r.groups;
    expect(r.q).toBeCloseTo((g1!.estimate - g2!.estimate) ** 2 / (g1!.se ** 2 + g2!.se ** 2), 10);
  });

  it('needs at least two subgroups', () => {
    expect(() => subgroupDifference([groups[0]!])).toThrow(AnalysisInputError);
  });
});
