import fc from 'fast-check';
import { describe, expect, it, test } from 'vitest';
import { AnalysisInputError } from '@shared/analysis/paired';
import { adjustKcForClimate, CROP_COEFFICIENTS, CROP_IDS, etc, kcForDay, seasonLengthDays } from '@shared/agronomy/crop-coefficients';

describe('FAO-56 Table 12 single crop coefficients', () => {
  // FAO-56 Table 12 (Kc ini / mid / end), V(t) in shared/REFERENCES.md.
  test.each([
    ['tomato', 0.6, 1.15, 0.7, 0.9], // Table 12: tomato 0.6 / 1.15 / 0.70-0.90 (range kept: transcriptions disagree)
    ['sweet-pepper', 0.6, 1.05, 0.9, 0.9], // Table 12: sweet pepper 0.6 / 1.05 / 0.90
    ['squash-zucchini', 0.5, 0.95, 0.75, 0.75], // Table 12: squash, zucchini 0.5 / 0.95 / 0.75
    ['sweet-melon', 0.5, 1.05, 0.75, 0.75], // Table 12: sweet melon 0.5 / 1.05 / 0.75
    ['watermelon', 0.4, 1.0, 0.75, 0.75], // Table 12: watermelon 0.4 / 1.00 / 0.75
    ['lettuce', 0.7, 1.0, 0.95, 0.95], // Table 12: lettuce 0.7 / 1.00 / 0.95
    ['green-beans', 0.5, 1.05, 0.9, 0.9], // Table 12: green beans 0.5 / 1.05 / 0.90
    ['cucumber', 0.6, 1.0, 0.75, 0.75], // Table 12: cucumber 0.6 / 1.00 / 0.75
  ] as const)('%s: Kc ini %s, mid %s, end %s-%s', (crop, ini, mid, endMin, endMax) => {
    const c = CROP_COEFFICIENTS[crop];
    expect(c.kcIni).toBe(ini);
    expect(c.kcMid).toBe(mid);
    expect(c.kcEnd).toEqual({ min: endMin, max: endMax });
  });

  it('covers the eight crops of the trial', () => {
    expect(CROP_IDS).toHaveLength(8);
  });
});

describe('kcForDay (FAO-56 Kc curve, eq. 66)', () => {
  // Stage lengths of FAO-56 Table 11 are from memory (tomato 30/40/40/25, arid region) and editable.
  it('uses the Table 11 tomato stages by default (from memory: 30/40/40/25 = 135 days)', () => {
    expect(seasonLengthDays(CROP_COEFFICIENTS.tomato.stages)).toBe(135);
  });

  test.each([
    // [day, expected Kc, stage] for tomato with Kc end = midpoint 0.80 of 0.70-0.90.
    // Expected values follow eq. 66 by hand: Kc = Kc_prev + (i − ΣL_prev)/L_stage · (Kc_next − Kc_prev).
    [0, 0.6, 'initial'],
    [29, 0.6, 'initial'],
    [30, 0.6, 'development'], // start of development: still Kc ini
    [50, 0.6 + (20 / 40) * (1.15 - 0.6), 'development'], // halfway: 0.875
    [70, 1.15, 'mid'],
    [109, 1.15, 'mid'],
    [110, 1.15, 'late'],
    [122.5, 1.15 + (12.5 / 25) * (0.8 - 1.15), 'late'], // halfway: 0.975
    [135, 0.8, 'after-season'],
    [200, 0.8, 'after-season'],
  ] as const)('tomato day %s → Kc %s (%s)', (day, kc, stage) => {
    const r = kcForDay('tomato', day);
    expect(r.kc).toBeCloseTo(kc, 12);
    expect(r.stage).toBe(stage);
  });

  it('lets the tomato Kc end be chosen inside the Table 12 range or given', () => {
    expect(kcForDay('tomato', 135, { kcEnd: 'min' }).kc).toBe(0.7);
    expect(kcForDay('tomato', 135, { kcEnd: 'max' }).kc).toBe(0.9);
    expect(kcForDay('tomato', 135, { kcEnd: 0.85 }).kc).toBe(0.85);
    expect(kcForDay('lettuce', 75).kc).toBe(0.95); // single value in Table 12: min = max
  });

  it('accepts edited stage lengths', () => {
    const stages = { initialDays: 10, developmentDays: 10, midDays: 10, lateDays: 10 };
    expect(kcForDay('cucumber', 15, { stages }).kc).toBeCloseTo(0.8, 12); // halfway 0.6 → 1.0
    expect(kcForDay('cucumber', 35, { stages }).kc).toBeCloseTo(0.875, 12); // halfway 1.0 → 0.75
  });

  it('is continuous at every stage boundary for every crop', () => {
    for (const crop of CROP_IDS) {
      const s = CROP_COEFFICIENTS[crop].stages;
      const boundaries = [s.initialDays, s.initialDays + s.developmentDays, s.initialDays + s.developmentDays + s.midDays, seasonLengthDays(s)];
      for (const b of boundaries) {
        expect(kcForDay(crop, b - 1e-9).kc).toBeCloseTo(kcForDay(crop, b).kc, 6);
      }
    }
  });

  it('stays between the smallest and largest Kc of the crop (property)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...CROP_IDS), fc.double({ min: 0, max: 400, noNaN: true }), (crop, day) => {
        const c = CROP_COEFFICIENTS[crop];
        const { kc } = kcForDay(crop, day);
        const lo = Math.min(c.kcIni, c.kcMid, c.kcEnd.min);
        const hi = Math.max(c.kcIni, c.kcMid, c.kcEnd.max);
        expect(kc).toBeGreaterThanOrEqual(lo - 1e-12);
        expect(kc).toBeLessThanOrEqual(hi + 1e-12);
      }),
    );
  });

  test.each([
    ['a negative day', () => kcForDay('tomato', -1)],
    ['an unknown crop', () => kcForDay('okra' as never, 10)],
    ['a zero-length season', () => kcForDay('tomato', 1, { stages: { initialDays: 0, developmentDays: 0, midDays: 0, lateDays: 0 } })],
  ])('throws AnalysisInputError for %s', (_label, call) => {
    expect(call).toThrow(AnalysisInputError);
  });
});

describe('etc and the climate adjustment', () => {
  it('ETc = Kc × ET0 (FAO-56 eq. 56)', () => {
    // FAO-56 Ex. 18 ETo 3.9 mm/day with tomato Kc mid 1.15 (Table 12) → 4.485 mm/day.
    expect(etc(3.9, 1.15)).toBeCloseTo(4.485, 12);
    expect(() => etc(-1, 1)).toThrow(AnalysisInputError);
  });

  it('leaves Kc unchanged in the standard sub-humid climate (u2 = 2 m/s, RHmin = 45 %), per FAO-56 eq. 62', () => {
    expect(adjustKcForClimate(1.15, { u2: 2, rhMinPct: 45, heightM: 0.6 })).toBe(1.15);
  });

  it('raises Kc mid in a dry, windy climate and lowers it in a humid, calm one (FAO-56 eq. 62)', () => {
    // By hand: 1.15 + [0.04·(4 − 2) − 0.004·(20 − 45)]·(0.6/3)^0.3 = 1.15 + 0.18·0.617034 = 1.261066
    expect(adjustKcForClimate(1.15, { u2: 4, rhMinPct: 20, heightM: 0.6 })).toBeCloseTo(1.261066, 6);
    expect(adjustKcForClimate(1.15, { u2: 1, rhMinPct: 80, heightM: 0.6 })).toBeLessThan(1.15);
    expect(adjustKcForClimate(0.4, { u2: 4, rhMinPct: 20, heightM: 0.6 })).toBe(0.4); // eq. 62 applies only to Kc ≥ 0.45
  });
});
