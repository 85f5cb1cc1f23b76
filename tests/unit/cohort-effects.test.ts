import { describe, expect, it } from 'vitest';
import {
  analyseCohort,
  describeTrials,
  fastLeaveOneOut,
  pairValues,
  potCapacityClass,
  progressRows,
  trialEffect,
  wrongUnitFlag,
  type BlockAggregate,
  type CohortOptions,
  type CohortTrialAggregate,
  type TrialWaterWeeks,
} from '@shared/analysis/cohort-effects';
import fc from 'fast-check';
import { leaveOneOut, logRiskRatio, randomEffects } from '@shared/analysis/meta';
import { forestTrials } from '@shared/charts/cohort-charts';
import { cohortResultsSchema } from '@shared/schemas/cohort-results';
import { LITRES_PER_US_GALLON } from '@shared/units';

// BCG vaccine trials (Colditz et al. 1994; R metafor `dat.bcg`), per trial: tpos, tneg, cpos, cneg (REFERENCES.md).
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
// Allocation of each trial, as listed for dat.bcg on the metafor project's "Testing Factors and Linear Combinations" page.
const bcgAlloc = [
  'random',
  'random',
  'random',
  'random',
  'alternate',
  'alternate',
  'random',
  'random',
  'random',
  'systematic',
  'systematic',
  'systematic',
  'systematic',
];
const bcgRr = bcg.map(([a, b, c, d]) => logRiskRatio({ treatmentEvents: a, treatmentNonEvents: b, controlEvents: c, controlNonEvents: d }));

const uuid = (i: number) => `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`;

function trialAgg(i: number, over: Partial<CohortTrialAggregate> = {}): CohortTrialAggregate {
  return {
    trialId: uuid(i),
    pseudonym: `Grower T${i}`,
    mine: false,
    crop: 'tomato',
    status: 'active',
    plantingDate: '2026-05-01',
    endDate: null,
    latitudeDeg: 35,
    longitudeDeg: -107,
    soilTexture: 'loam',
    expectedDays: 100,
    harvestRecords: 0,
    moistureMethods: [],
    settings: ['in_ground'],
    mulch: [false],
    lids: [true],
    potCount: 2,
    meanPotCapacityL: 8,
    potCapacitiesL: [8],
    potShapes: ['globe'],
    clayBodies: ['terracotta'],
    potMakes: ['wheel_thrown'],
    exclusion: null,
    ...over,
  };
}

/** A block with the given depths (mm) on plots of the given areas; harvest optional (kg, plants). */
function block(
  trial: number,
  key: string,
  ollaMm: number,
  surfaceMm: number,
  opts: { ollaArea?: number; surfaceArea?: number; ollaKg?: number | null; surfaceKg?: number | null; plants?: number } = {},
): BlockAggregate {
  const oa = opts.ollaArea ?? 1;
  const sa = opts.surfaceArea ?? 1;
  const plants = opts.plants ?? 4;
  return {
    trialId: uuid(trial),
    blockKey: key,
    ollaPlots: 1,
    ollaAreaM2: oa,
    ollaPlants: plants,
    ollaL: ollaMm * oa,
    ollaHarvestKg: opts.ollaKg ?? 0,
    ollaPlotsWithoutHarvest: opts.ollaKg === undefined || opts.ollaKg === null ? 1 : 0,
    surfacePlots: 1,
    surfaceAreaM2: sa,
    surfacePlants: plants,
    surfaceL: surfaceMm * sa,
    surfaceHarvestKg: opts.surfaceKg ?? 0,
    surfacePlotsWithoutHarvest: opts.surfaceKg === undefined || opts.surfaceKg === null ? 1 : 0,
  };
}

/**
 * Two pairs whose log water ratios are y ± √v: their mean is y and s²/n = (2v)/2 = v, so the
 * trial's effect and variance are exactly the BCG trial's yi and vi.
 */
function bcgBlocks(i: number, y: number, v: number): BlockAggregate[] {
  const d = Math.sqrt(v);
  // Unequal plot areas check that depths (litres / area), not litres, are compared.
  return [
    block(i, 'A', 40 * Math.exp(y + d), 40, { ollaArea: 1.5, surfaceArea: 2 }),
    block(i, 'B', 40 * Math.exp(y - d), 40, { ollaArea: 1.5, surfaceArea: 2 }),
  ];
}

const dl: CohortOptions = { method: 'DL', confidence: 0.95, includeSinglePairs: false, excludeFlagged: false };
const reml: CohortOptions = { ...dl, method: 'REML' };

function bcgCohort(options: CohortOptions, moderator?: (i: number) => Partial<CohortTrialAggregate>) {
  const trials = bcgRr.map((_, i) => trialAgg(i + 1, moderator?.(i)));
  const blocks = bcgRr.flatMap((r, i) => bcgBlocks(i + 1, r.effect, r.variance));
  return analyseCohort({ cohortId: uuid(999), asOf: '2026-09-30', trials, blocks, water: [], progress: [], options });
}

describe('per-trial effects from per-pair aggregates', () => {
  it('turns two pairs into the BCG yi and vi (mean of per-pair log ratios, variance s²/n)', () => {
    const r = bcgRr[0]!;
    const pv = pairValues(bcgBlocks(1, r.effect, r.variance));
    const e = trialEffect(pv.values.waterLogRatio, pv.totals.waterLogRatio);
    // Aronson 1948: yi = −0.8893, vi = 0.3256 (metafor escalc output on the project's tips page; REFERENCES.md formula).
    expect(e.estimate).toBeCloseTo(-0.8893113339, 9);
    expect(e.variance).toBeCloseTo(0.325584765, 9);
    expect(e.perPairVariance).toBeCloseTo(2 * 0.325584765, 9);
    expect(e.source).toBe('pairs');
  });

  it('computes WUE log ratio and harvest per plant from each pair, and skips pairs with a missing harvest', () => {
    // Pair A by hand: olla 20 L, 2 kg, 4 plants; surface 50 L, 1.5 kg, 4 plants.
    // WUE ratio = (2/20)/(1.5/50) = 3.333…; per plant 0.5 − 0.375 = 0.125 kg. Pair B has no surface harvest record.
    const pv = pairValues([block(1, 'A', 20, 50, { ollaKg: 2, surfaceKg: 1.5 }), block(1, 'B', 22, 48, { ollaKg: 2.2 })]);
    expect(pv.pairs).toBe(2);
    expect(pv.pairsMissingHarvest).toBe(1);
    expect(pv.values.waterLogRatio).toHaveLength(2);
    expect(pv.values.wueLogRatio).toEqual([expect.closeTo(Math.log(0.1 / 0.03), 12)]);
    expect(pv.values.harvestPerPlantDiff).toEqual([expect.closeTo(0.125, 12)]);
  });

  it('treats a logged 0 kg harvest as a harvest (difference computable, log ratio not)', () => {
    const pv = pairValues([block(1, 'A', 20, 50, { ollaKg: 0, surfaceKg: 1 })]);
    expect(pv.pairsMissingHarvest).toBe(0);
    expect(pv.values.harvestPerPlantDiff).toEqual([-0.25]);
    expect(pv.values.wueLogRatio).toEqual([]);
  });

  it('refuses a variance of zero (identical pairs) instead of dividing by it', () => {
    const e = trialEffect([0.2, 0.2, 0.2], 0.2);
    expect(e.variance).toBeNull();
    expect(e.note).toMatch(/variance is 0/);
  });
});

describe('pooled water saving through the cohort assembly (BCG effects as per-trial log ratios)', () => {
  it('DerSimonian-Laird reproduces the published metafor results', () => {
    const w = bcgCohort(dl).effects.waterLogRatio;
    expect(w.k).toBe(13);
    const p = w.pooled!;
    expect(p.q).toBeCloseTo(152.233, 3); // Q = 152.2330, df 12 (REFERENCES.md, V+R)
    expect(p.df).toBe(12);
    expect(p.tau2).toBeCloseTo(0.3088, 4); // DL τ² 0.3088 (REFERENCES.md, V(t)+R)
    expect(p.estimate).toBeCloseTo(-0.7141, 4); // DL estimate −0.7141 (REFERENCES.md, V(t)+R)
    expect(p.se).toBeCloseTo(0.1787, 4); // DL SE 0.1787 (REFERENCES.md, V(t)+R)
    expect(p.ci[0]).toBeCloseTo(-1.0644, 4); // DL 95% CI (−1.0644, −0.3638) (REFERENCES.md, V(t)+R)
    expect(p.ci[1]).toBeCloseTo(-0.3638, 4);
    expect(p.i2).toBeCloseTo(92.12, 2); // DL I² 92.12 % (REFERENCES.md, V(t)+R)
    // Saving % = (1 − exp(estimate))·100, the interval reversed (a larger log ratio is a smaller saving).
    expect(p.display.estimate).toBeCloseTo((1 - Math.exp(p.estimate)) * 100, 10);
    expect(p.display.ci[0]).toBeCloseTo((1 - Math.exp(p.ci[1])) * 100, 10);
    expect(p.display.ci[1]).toBeCloseTo((1 - Math.exp(p.ci[0])) * 100, 10);
    // Prediction interval: recomputed in Python (numpy/scipy, t_{11}), not published (same values as tests/unit/meta.test.ts).
    expect(p.predictionInterval![0]).toBeCloseTo(-1.998838, 5);
    expect(p.predictionInterval![1]).toBeCloseTo(0.570604, 5);
    expect(w.forest.reduce((s, f) => s + f.weightPercent!, 0)).toBeCloseTo(100, 10);
    // The forest rows carry only what pooling adds; joined with the trial rows they give back each trial's
    // BCG log risk ratio and its variance (the pooling inputs) and, on the display scale, estimate ± 1.96·√variance.
    const joined = forestTrials(bcgCohort(dl), 'waterLogRatio');
    expect(joined.map((f) => f.pseudonym)).toEqual(bcgRr.map((_, i) => `Grower T${i + 1}`));
    joined.forEach((f, i) => {
      expect(f.estimate).toBeCloseTo(bcgRr[i]!.effect, 10);
      expect(f.variance).toBeCloseTo(bcgRr[i]!.variance, 10);
      expect(f).toMatchObject({ pairs: 2, source: 'pairs', flagged: false });
      const half = 1.959963984540054 * Math.sqrt(f.variance); // z for 95 % (standard normal quantile, textbook value)
      expect(f.display.estimate).toBeCloseTo((1 - Math.exp(f.estimate)) * 100, 10);
      expect(f.display.ci[0]).toBeCloseTo((1 - Math.exp(f.estimate + half)) * 100, 8);
      expect(f.display.ci[1]).toBeCloseTo((1 - Math.exp(f.estimate - half)) * 100, 8);
    });
  });

  it('REML reproduces the published metafor results', () => {
    const p = bcgCohort(reml).effects.waterLogRatio.pooled!;
    expect(p.method).toBe('REML');
    expect(p.converged).toBe(true);
    expect(p.tau2).toBeCloseTo(0.3132, 4); // REML τ² 0.3132 (REFERENCES.md, V+R)
    expect(p.estimate).toBeCloseTo(-0.7145, 4); // REML estimate −0.7145 (REFERENCES.md, V+R)
    expect(p.se).toBeCloseTo(0.1798, 4); // REML SE 0.1798 (REFERENCES.md, V+R)
    expect(p.ci[0]).toBeCloseTo(-1.0669, 4); // REML CI (−1.0669, −0.3622) (REFERENCES.md, V+R)
    expect(p.ci[1]).toBeCloseTo(-0.3622, 4);
    expect(p.i2).toBeCloseTo(92.22, 2); // REML I² 92.22 % (REFERENCES.md, V+R)
  });

  it('splits the BCG trials by allocation like an independent recomputation (recomputed, not published)', () => {
    // Allocation coded as crop. Reference values recomputed independently in Python (numpy/scipy): each subgroup pooled
    // with its own τ² (DL moment formula; REML by bounded optimisation of the restricted likelihood), then Q_between on
    // 1/SE² weights against chi-square with 2 df. Recomputed, not published.
    const crops: Record<string, CohortTrialAggregate['crop']> = { random: 'tomato', alternate: 'lettuce', systematic: 'cucumber' };
    const byAlloc = (i: number) => ({ crop: crops[bcgAlloc[i]!]! });
    const dlSub = bcgCohort(dl, byAlloc).effects.waterLogRatio.subgroups.find((s) => s.moderator === 'crop')!;
    expect(dlSub.test!.df).toBe(2);
    expect(dlSub.test!.q).toBeCloseTo(1.536769, 5);
    expect(dlSub.test!.pValue).toBeCloseTo(0.463762, 5);
    const level = (s: typeof dlSub, name: string) => s.levels.find((l) => l.level === name)!;
    expect(level(dlSub, 'tomato')).toMatchObject({ k: 7, smallSample: false });
    expect(level(dlSub, 'tomato').estimate).toBeCloseTo(-1.004161, 5);
    expect(level(dlSub, 'tomato').tau2).toBeCloseTo(0.763063, 5);
    expect(level(dlSub, 'lettuce').estimate).toBeCloseTo(-0.540793, 5);
    expect(level(dlSub, 'lettuce').smallSample).toBe(true); // k = 2 < 3
    expect(level(dlSub, 'cucumber').estimate).toBeCloseTo(-0.439347, 5);
    expect(dlSub.warning).toMatch(/"lettuce"/);

    const remlSub = bcgCohort(reml, byAlloc).effects.waterLogRatio.subgroups.find((s) => s.moderator === 'crop')!;
    expect(remlSub.test!.q).toBeCloseTo(1.861445, 4);
    expect(remlSub.test!.pValue).toBeCloseTo(0.394269, 4);
    // −0.9710 for the randomly allocated trials also matches the separate-model estimate recalled from metafor's
    // "comparing estimates of independent meta-analyses or subgroups" page (from memory, unverified).
    expect(level(remlSub, 'tomato').estimate).toBeCloseTo(-0.970965, 4);
    expect(level(remlSub, 'cucumber').estimate).toBeCloseTo(-0.424207, 4);
  });

  it('leaves each trial out in turn and labels the row with the trial left out', () => {
    const w = bcgCohort(dl).effects.waterLogRatio;
    expect(w.sensitivity.leaveOneOut).toHaveLength(13);
    // Omitting TPT Madras (trial 8, the large null trial): recomputed directly from the 12 remaining yi/vi.
    const rest = bcgRr.filter((_, i) => i !== 7);
    const direct = randomEffects(
      rest.map((r) => r.effect),
      rest.map((r) => r.variance),
    );
    const row = w.sensitivity.leaveOneOut.find((r) => r.omittedTrialId === uuid(8))!;
    expect(row.estimate).toBeCloseTo(direct.estimate, 12);
    expect(row.tau2).toBeCloseTo(direct.tau2, 12);
  });

  it('conforms to the shared response schema', () => {
    expect(() => cohortResultsSchema.parse(bcgCohort(dl))).not.toThrow();
  });
});

describe('fastLeaveOneOut (the O(k)-per-omission path used for large cohorts)', () => {
  const compare = (y: number[], v: number[], method: 'DL' | 'REML') => {
    const fast = fastLeaveOneOut(y, v, { method, confidence: 0.95 });
    const slow = leaveOneOut(y, v, { method });
    expect(fast).toHaveLength(slow.length);
    slow.forEach((s, i) => {
      const f = fast[i]!;
      expect(f.omitted).toBe(s.omitted);
      expect(f.estimate).toBeCloseTo(s.estimate, 8);
      expect(f.se).toBeCloseTo(s.se, 8);
      expect(f.tau2).toBeCloseTo(s.tau2, 8);
      expect(f.i2).toBeCloseTo(s.i2, 6);
      expect(f.ci[0]).toBeCloseTo(s.ci[0], 8);
      expect(f.ci[1]).toBeCloseTo(s.ci[1], 8);
    });
  };

  it.each(['DL', 'REML'] as const)('equals meta.leaveOneOut on the BCG trials (%s)', (method) => {
    compare(
      bcgRr.map((r) => r.effect),
      bcgRr.map((r) => r.variance),
      method,
    );
  });

  it('equals meta.leaveOneOut on random cohorts, including homogeneous ones where τ² hits 0 (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ y: fc.double({ min: -2, max: 1, noNaN: true }), v: fc.double({ min: 0.001, max: 1, noNaN: true }) }), {
          minLength: 3,
          maxLength: 40,
        }),
        fc.boolean(),
        fc.constantFrom('DL' as const, 'REML' as const),
        (rows, homogeneous, method) => {
          const y = rows.map((r) => (homogeneous ? -0.5 + r.y * 1e-3 : r.y));
          compare(
            y,
            rows.map((r) => r.v),
            method,
          );
        },
      ),
      { numRuns: 150 },
    );
  });
});

describe('single-pair trials', () => {
  // Three multi-pair trials (per-pair log ratios chosen by hand) and one single-pair trial.
  const trials = [trialAgg(1), trialAgg(2), trialAgg(3), trialAgg(4)];
  const blocks = [
    block(1, 'A', 40 * Math.exp(-0.5), 40),
    block(1, 'B', 40 * Math.exp(-0.7), 40), // s² = 0.02
    block(2, 'A', 40 * Math.exp(-0.6), 40),
    block(2, 'B', 40 * Math.exp(-1.0), 40), // s² = 0.08
    block(3, 'A', 40 * Math.exp(-0.2), 40),
    block(3, 'B', 40 * Math.exp(-0.8), 40),
    block(3, 'C', 40 * Math.exp(-0.5), 40), // s² = 0.09
    block(4, 'A', 25, 50), // one pair: season totals ln(25/50)
  ];
  const run = (includeSinglePairs: boolean) =>
    analyseCohort({ cohortId: uuid(999), asOf: '2026-09-30', trials, blocks, water: [], progress: [], options: { ...dl, includeSinglePairs } });

  it('stays out by default and says why', () => {
    const r = run(false);
    expect(r.effects.waterLogRatio.k).toBe(3);
    expect(r.effects.waterLogRatio.singlePairs).toMatchObject({ eligible: 1, included: 0 });
    expect(r.trials[3]!.effects.waterLogRatio).toMatchObject({ pooled: false, pairs: 1, source: 'season-totals' });
    expect(r.trials[3]!.effects.waterLogRatio.note).toMatch(/includeSinglePairs=true/);
  });

  it('enters through its season totals with the median per-pair variance when the lead opts in', () => {
    const r = run(true);
    const w = r.effects.waterLogRatio;
    expect(w.k).toBe(4);
    // Per-pair sample variances by hand: 0.02, 0.08, 0.09 → median 0.08 (the documented pragmatic rule).
    expect(w.singlePairs.imputedVariance).toBeCloseTo(0.08, 12);
    expect(w.singlePairs).toMatchObject({ eligible: 1, included: 1 });
    expect(w.singlePairs.rule).toMatch(/pragmatic choice, not a published rule/);
    const row = forestTrials(r, 'waterLogRatio').find((f) => f.trialId === uuid(4))!;
    expect(row).toMatchObject({ source: 'season-totals', pairs: 1 });
    expect(row.estimate).toBeCloseTo(Math.log(0.5), 12);
    expect(row.variance).toBeCloseTo(0.08, 12);
    expect(r.trials[3]!.effects.waterLogRatio.variance).toBeCloseTo(0.08, 12);
  });
});

const mondays = (n: number) => Array.from({ length: n }, (_, i) => new Date(Date.UTC(2026, 5, 1 + 7 * i)).toISOString().slice(0, 10));
/** One trial's weekly litres per olla refill (and none at the surface), as the water query returns them. */
const weeks = (trial: number, values: number[], surface: number[] = []): TrialWaterWeeks => ({
  trialId: uuid(trial),
  daysWithWater: values.length,
  ollaWeekStarts: mondays(values.length),
  ollaLitresPerEvent: values,
  surfaceWeekStarts: mondays(surface.length),
  surfaceLitresPerEvent: surface,
});

describe('quality flags', () => {
  it('flags a week of refills about 3.785 times the usual (US gallon = 3.785411784 L, NIST Handbook 44)', () => {
    const f = wrongUnitFlag(weeks(1, [5, 5.1, 5.2, 4.9, 5.1, 5 * LITRES_PER_US_GALLON, 5]))!;
    expect(f.kind).toBe('wrong-unit');
    expect(f.weeks).toHaveLength(1);
    expect(f.weeks[0]).toMatchObject({ series: 'olla_refill', weekStart: '2026-07-06', kind: 'looks-like-gallons-converted-twice' });
    expect(f.weeks[0]!.suggestedLitresPerEvent).toBeCloseTo(5, 10);
    // A season that simply rises (2 → 8 L per refill) is not flagged.
    expect(wrongUnitFlag(weeks(1, [2, 3, 4, 5, 6, 7, 8]))).toBeNull();
    // Gallons typed into the litre field at the surface: 1/3.785 of the usual; olla weeks fine.
    const g = wrongUnitFlag(weeks(1, [5, 5, 5, 5, 5], [12, 12.5, 11.8, 12 / LITRES_PER_US_GALLON, 12.2, 12]))!;
    expect(g.weeks).toEqual([expect.objectContaining({ series: 'surface', weekStart: '2026-06-22', kind: 'looks-like-gallons-typed-as-litres' })]);
    expect(g.weeks[0]!.suggestedLitresPerEvent).toBeCloseTo(12, 10);
  });

  it('does not flag the first week, when each dry pot is filled whole (establishment water; common practice, no source)', () => {
    // Week 1: the first fill of a dry 10 L pot, ~4 times a later top-up of 2.5 L, as a gallon slip would be.
    const firstFills = weeks(1, [10, 2.5, 2.6, 2.4, 2.5, 2.6]);
    expect(wrongUnitFlag(firstFills)).toBeNull();
    // The same value in a later week is flagged: the exemption is the first week only.
    const later = wrongUnitFlag(weeks(1, [2.5, 2.5, 2.6, 10, 2.4, 2.5, 2.6]))!;
    expect(later.weeks.map((w) => w.weekStart)).toEqual(['2026-06-22']);
    // Fewer than four weeks after the first: too few for a median, nothing flagged (the heuristic's minimum).
    expect(wrongUnitFlag(weeks(1, [2.5, 2.5, 10, 2.5]))).toBeNull();
  });

  it('flags mixed moisture methods and a closed trial without a harvest', () => {
    const [a, b, c] = describeTrials(
      [
        trialAgg(1, { moistureMethods: ['tensiometer', 'vwc'] }),
        trialAgg(2, { status: 'closed', harvestRecords: 0 }),
        trialAgg(3, { status: 'closed', harvestRecords: 4 }),
      ],
      [],
      [],
    );
    expect(a!.row.flags.map((f) => f.kind)).toEqual(['mixed-moisture-methods']);
    expect(b!.row.flags.map((f) => f.kind)).toEqual(['closed-without-harvest']);
    expect(c!.row.flags).toEqual([]);
  });

  it('flags a trial whose water ratio is far from the cohort, and excludeFlagged drops it from the main estimate only', () => {
    // Six trials near ln ratio −0.7 and one near +0.4 (more water with pots). Robust z with MAD (Iglewicz & Hoaglin; cut-off 3.5, from memory).
    const centres = [-0.7, -0.72, -0.68, -0.75, -0.66, -0.71, 0.4];
    const trials = centres.map((_, i) => trialAgg(i + 1));
    const blocks = centres.flatMap((c, i) => [block(i + 1, 'A', 40 * Math.exp(c + 0.05), 40), block(i + 1, 'B', 40 * Math.exp(c - 0.05), 40)]);
    const input = { cohortId: uuid(999), asOf: '2026-09-30', trials, blocks, water: [], progress: [] };
    const all = analyseCohort({ ...input, options: dl });
    const flagged = all.trials.filter((t) => t.flags.length);
    expect(flagged.map((t) => t.trialId)).toEqual([uuid(7)]);
    expect(flagged[0]!.flags[0]).toMatchObject({ kind: 'out-of-line', effect: 'waterLogRatio' });
    expect(flagged[0]!.flags[0]!.robustZ!).toBeGreaterThan(3.5);
    expect(all.effects.waterLogRatio.k).toBe(7);
    const without = analyseCohort({ ...input, options: { ...dl, excludeFlagged: true } });
    expect(without.effects.waterLogRatio.k).toBe(6);
    expect(without.trials[6]!.effects.waterLogRatio.note).toMatch(/excludeFlagged/);
    // The sensitivity block shows both fits whichever option is chosen.
    for (const r of [all, without]) {
      expect(r.effects.waterLogRatio.sensitivity.withFlagged!.k).toBe(7);
      expect(r.effects.waterLogRatio.sensitivity.withoutFlagged!.k).toBe(6);
      expect(r.effects.waterLogRatio.sensitivity.flaggedTrials).toBe(1);
    }
    expect(without.effects.waterLogRatio.pooled!.estimate).toBeCloseTo(without.effects.waterLogRatio.sensitivity.withoutFlagged!.estimate, 12);
  });
});

describe('exclusions, moderators and progress', () => {
  it('keeps a lead-excluded trial listed but out of every pooled estimate', () => {
    const r = bcgCohort(dl, (i) =>
      i === 7 ? { exclusion: { reason: 'Pots cracked in June', createdAt: '2026-07-01T00:00:00.000Z', excludedByMe: true } } : {},
    );
    const w = r.effects.waterLogRatio;
    expect(w.k).toBe(12);
    expect(w.forest.some((f) => f.trialId === uuid(8))).toBe(false);
    expect(w.sensitivity.withFlagged!.k).toBe(12);
    expect(r.exclusions).toEqual([
      { trialId: uuid(8), pseudonym: 'Grower T8', reason: 'Pots cracked in June', createdAt: '2026-07-01T00:00:00.000Z', excludedByMe: true },
    ]);
    expect(r.trials[7]!.effects.waterLogRatio).toMatchObject({ pooled: false, note: 'Excluded by the lead.' });
    // Same as leaving trial 8 out by hand.
    const rest = bcgRr.filter((_, i) => i !== 7);
    expect(w.pooled!.estimate).toBeCloseTo(
      randomEffects(
        rest.map((x) => x.effect),
        rest.map((x) => x.variance),
      ).estimate,
      12,
    );
  });

  it('classes pots by mean capacity and leaves "unknown" out of the subgroup test', () => {
    expect([potCapacityClass(5.9), potCapacityClass(6), potCapacityClass(10), potCapacityClass(10.1), potCapacityClass(null)]).toEqual([
      '<6 L',
      '6–10 L',
      '6–10 L',
      '>10 L',
      'unknown',
    ]);
    const r = bcgCohort(dl, (i) => ({ meanPotCapacityL: i < 5 ? 4 : i < 10 ? 12 : null, potShapes: i === 0 ? ['globe', 'bottle'] : ['globe'] }));
    const cap = r.effects.waterLogRatio.subgroups.find((s) => s.moderator === 'potCapacity')!;
    expect(cap.levels.map((l) => [l.level, l.k])).toEqual([
      ['<6 L', 5],
      ['>10 L', 5],
      ['unknown', 3],
    ]);
    expect(cap.test!.levels).toEqual(['<6 L', '>10 L']);
    expect(cap.test!.df).toBe(1);
    expect(r.trials[0]!.moderators.potShape).toBe('mixed');
  });

  it('takes days with water from the water query (counted in SQL) into completeness', () => {
    const [d] = describeTrials([trialAgg(1, { expectedDays: 8 })], [], [{ ...weeks(1, [5]), daysWithWater: 4 }]);
    expect(d!.row.completeness).toMatchObject({ expectedDays: 8, daysWithWater: 4, share: 0.5 });
    const [none] = describeTrials([trialAgg(2, { expectedDays: 8 })], [], [{ ...weeks(1, [5]), daysWithWater: 4 }]);
    expect(none!.row.completeness).toMatchObject({ daysWithWater: 0, share: 0 });
  });

  it('turns cohort litres into depth over the treatment area', () => {
    const rows = progressRows(
      [
        { weekStart: '2026-06-01', isoWeek: '2026-W23', treatment: 'olla', litres: 30, cumulativeLitres: 30, trials: 2 },
        { weekStart: '2026-06-08', isoWeek: '2026-W24', treatment: 'olla', litres: 20, cumulativeLitres: 50, trials: 2 },
      ],
      { olla: 4, surface: 0 },
    );
    // 1 L over 1 m² = 1 mm (REFERENCES.md, units).
    expect(rows.map((r) => r.cumulativeMm)).toEqual([7.5, 12.5]);
  });

  it('gives no pooled estimate with fewer than two trials and says why', () => {
    const r = analyseCohort({
      cohortId: uuid(999),
      asOf: '2026-09-30',
      trials: [trialAgg(1)],
      blocks: [block(1, 'A', 20, 40), block(1, 'B', 22, 40)],
      water: [],
      progress: [],
      options: dl,
    });
    expect(r.effects.waterLogRatio.pooled).toBeNull();
    expect(r.effects.waterLogRatio.reason).toMatch(/at least 2 trials/);
    expect(r.effects.waterLogRatio.forest[0]!.weightPercent).toBe(100);
    expect(r.effects.wueLogRatio.k).toBe(0);
  });
});
