// The wetted-radius rule (a pot wets about one radius beyond its wall, so the wetted circle
// around the centre has a radius of one diameter) is common practice, no source. The checks
// below test the geometry that follows from it, not the rule itself.
import fc from 'fast-check';
import { describe, expect, it, test } from 'vitest';
import { AnalysisInputError } from '@shared/analysis/paired';
import { gridCoverage, planOllas, refillIntervalDays, wettedAreaM2, wettedRadiusM } from '@shared/agronomy/olla-layout';

function distance(a: { x: number; y: number }, b: { x: number; y: number }): number {
  return Math.hypot(a.x - b.x, a.y - b.y);
}

describe('wetted zone (rule of thumb: common practice, no source)', () => {
  it('wetted radius = pot radius + one radius = one diameter', () => {
    expect(wettedRadiusM(0.3)).toBe(0.3);
    expect(wettedAreaM2(0.3)).toBeCloseTo(Math.PI * 0.09, 12);
  });
});

describe('planOllas', () => {
  // Expected grids worked by hand: cells a × b must satisfy a² + b² ≤ (2R)² with R = one
  // diameter (cell half-diagonal within the wetted radius), and a, b ≥ one diameter.
  it('plans a 1.2 × 1.2 m bed with 0.3 m pots as a 3 × 3 grid', () => {
    // 3 × 3: 0.4² + 0.4² = 0.32 ≤ 0.36. Fewer pots fail: 2 × 2 gives 0.72, 2 × 3 or 3 × 2 gives 0.52, 4 × 2 gives 0.45.
    const plan = planOllas({ lengthM: 1.2, widthM: 1.2 }, { widestDiameterM: 0.3 });
    expect(plan.count).toBe(9);
    expect([plan.columns, plan.rows]).toEqual([3, 3]);
    expect(plan.fullCoverage).toBe(true);
    expect(plan.coveredFraction).toBe(1);
    expect(plan.spacingM.x).toBeCloseTo(0.4, 12);
    expect(plan.positions[0]!.x).toBeCloseTo(0.2, 12);
    expect(plan.positions[0]!.y).toBeCloseTo(0.2, 12);
  });

  it('plans a 3 × 1 m bed with 0.3 m pots as 10 × 2', () => {
    // 2 rows: b = 0.5, so a ≤ √(0.36 − 0.25) = 0.332 → 10 columns (a = 0.3): 20 pots.
    // 3 rows: b = 0.333, so a ≤ 0.499 → 7 columns: 21 pots. 1 row cannot cover (b = 1).
    const plan = planOllas({ lengthM: 3, widthM: 1 }, { widestDiameterM: 0.3 });
    expect(plan.count).toBe(20);
    expect([plan.columns, plan.rows]).toEqual([10, 2]);
  });

  it('uses a single pot when one wetted circle covers the bed', () => {
    // 0.5 × 0.5 m bed, 0.4 m pot: half-diagonal 0.354 ≤ R = 0.4.
    const plan = planOllas({ lengthM: 0.5, widthM: 0.5 }, { widestDiameterM: 0.4 });
    expect(plan.count).toBe(1);
    expect(plan.positions).toEqual([{ x: 0.25, y: 0.25 }]);
  });

  it('covers a narrow bed with a single row', () => {
    // 2 × 0.35 m bed, 0.3 m pot: one row (b = 0.35), so a ≤ √(0.36 − 0.1225) = 0.487 → 5 columns.
    const plan = planOllas({ lengthM: 2, widthM: 0.35 }, { widestDiameterM: 0.3 });
    expect([plan.columns, plan.rows]).toEqual([5, 1]);
    expect(plan.fullCoverage).toBe(true);
  });

  it('reports partial coverage when no allowed grid covers the bed', () => {
    // Pots kept 0.9 m apart in a 0.31 × 2.5 m bed: one column, two rows 1.25 m apart → gaps between the circles.
    const plan = planOllas({ lengthM: 0.31, widthM: 2.5 }, { widestDiameterM: 0.3 }, { minCentreSpacingM: 0.9 });
    expect(plan.fullCoverage).toBe(false);
    expect([plan.columns, plan.rows]).toEqual([1, 2]);
    // Each circle (R = 0.3) covers y within √(0.09 − dx²) of its centre; averaged over the bed about 2 × 0.55 / 2.5.
    expect(plan.coveredFraction).toBeGreaterThan(0.35);
    expect(plan.coveredFraction).toBeLessThan(0.5);
  });

  test.each([
    ['a bed narrower than the pot', { lengthM: 2, widthM: 0.2 }, { widestDiameterM: 0.3 }],
    ['a zero length', { lengthM: 0, widthM: 1 }, { widestDiameterM: 0.3 }],
    ['a negative diameter', { lengthM: 1, widthM: 1 }, { widestDiameterM: -0.3 }],
  ])('throws AnalysisInputError for %s', (_label, bed, pot) => {
    expect(() => planOllas(bed, pot)).toThrow(AnalysisInputError);
  });

  const beds = fc
    .record({
      lengthM: fc.double({ min: 0.3, max: 8, noNaN: true }),
      widthM: fc.double({ min: 0.3, max: 3, noNaN: true }),
      widestDiameterM: fc.double({ min: 0.15, max: 0.5, noNaN: true }),
    })
    .filter((b) => b.widestDiameterM <= Math.min(b.lengthM, b.widthM));

  it('keeps every pot inside the bed and pots at least one diameter apart (property)', () => {
    fc.assert(
      fc.property(beds, ({ lengthM, widthM, widestDiameterM: d }) => {
        const plan = planOllas({ lengthM, widthM }, { widestDiameterM: d });
        expect(plan.count).toBe(plan.positions.length);
        const inside = plan.positions.every(
          (p) => p.x - d / 2 >= -1e-9 && p.x + d / 2 <= lengthM + 1e-9 && p.y - d / 2 >= -1e-9 && p.y + d / 2 <= widthM + 1e-9,
        );
        expect(inside).toBe(true);
        let closest = Number.POSITIVE_INFINITY;
        for (let i = 0; i < plan.positions.length; i += 1) {
          for (let j = i + 1; j < plan.positions.length; j += 1) {
            closest = Math.min(closest, distance(plan.positions[i]!, plan.positions[j]!));
          }
        }
        expect(closest).toBeGreaterThanOrEqual(d - 1e-9);
      }),
      { numRuns: 150 },
    );
  });

  it('when it claims full coverage, every point of the bed is within the wetted radius of a pot (property)', () => {
    fc.assert(
      fc.property(beds, fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (bed, u, v) => {
        const plan = planOllas(bed, bed);
        fc.pre(plan.fullCoverage);
        const point = { x: u * bed.lengthM, y: v * bed.widthM };
        const nearest = Math.min(...plan.positions.map((p) => distance(p, point)));
        expect(nearest).toBeLessThanOrEqual(plan.wettedRadiusM + 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it('uses no more pots than needed: one column or row fewer would leave a gap (property)', () => {
    fc.assert(
      fc.property(beds, (bed) => {
        const plan = planOllas(bed, bed);
        fc.pre(plan.fullCoverage);
        const r = plan.wettedRadiusM;
        // Any grid with fewer pots must fail coverage or spacing: check the two neighbours.
        for (const [c, rw] of [
          [plan.columns - 1, plan.rows],
          [plan.columns, plan.rows - 1],
        ] as const) {
          if (c < 1 || rw < 1) continue;
          const a = bed.lengthM / c;
          const b = bed.widthM / rw;
          expect(a * a + b * b).toBeGreaterThan(4 * r * r - 1e-9);
        }
      }),
      { numRuns: 150 },
    );
  });
});

describe('refillIntervalDays', () => {
  it('divides capacity by measured seepage', () => {
    // 10 L pot at 0.5 L/day (field range 0.16-0.60 L/day per pitcher, REFERENCES.md) → 20 days
    expect(refillIntervalDays({ capacityL: 10, seepageLPerDay: 0.5 })).toEqual({ days: 20, dailyDrawL: 0.5, basis: 'measured-seepage' });
  });

  it('uses crop need over the wetted area when seepage is unknown (1 mm over 1 m² = 1 L)', () => {
    // 6 mm/day over the 0.283 m² wetted circle of a 0.3 m pot = 1.696 L/day; an 8 L pot lasts 4.7 days.
    const area = wettedAreaM2(0.3);
    const r = refillIntervalDays({ capacityL: 8, cropNeedMmPerDay: 6, wettedAreaM2: area });
    expect(r.basis).toBe('crop-need');
    expect(r.dailyDrawL).toBeCloseTo(6 * Math.PI * 0.09, 12);
    expect(r.days).toBeCloseTo(8 / (6 * Math.PI * 0.09), 12);
  });

  it('prefers measured seepage over crop need', () => {
    expect(refillIntervalDays({ capacityL: 10, seepageLPerDay: 1, cropNeedMmPerDay: 5, wettedAreaM2: 1 }).days).toBe(10);
  });

  it('returns Infinity for zero seepage and throws without enough input', () => {
    expect(refillIntervalDays({ capacityL: 10, seepageLPerDay: 0 }).days).toBe(Number.POSITIVE_INFINITY);
    expect(() => refillIntervalDays({ capacityL: 10 })).toThrow(AnalysisInputError);
    expect(() => refillIntervalDays({ capacityL: 10, cropNeedMmPerDay: 5 })).toThrow(AnalysisInputError);
    expect(() => refillIntervalDays({ capacityL: 0, seepageLPerDay: 1 })).toThrow(AnalysisInputError);
  });
});

describe('gridCoverage: share of a cell within the wetted radius of its centre (plane geometry)', () => {
  it('matches the textbook cases', () => {
    // A circle inscribed in a square covers π/4 of it (area πr² over (2r)²).
    expect(gridCoverage(1, 1, 0.5)).toBeCloseTo(Math.PI / 4, 12);
    // A circle through the corners covers the square.
    expect(gridCoverage(1, 1, Math.SQRT1_2)).toBe(1);
    // The same circle in a 2 × 1 rectangle: π/4 of area 2.
    expect(gridCoverage(2, 1, 0.5)).toBeCloseTo(Math.PI / 8, 12);
    // A circle smaller than the cell: its whole area πr² over the cell's.
    expect(gridCoverage(3, 2, 0.4)).toBeCloseTo((Math.PI * 0.16) / 6, 12);
  });

  test('agrees with counting points on a fine lattice', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 2, noNaN: true }), fc.double({ min: 0.1, max: 2, noNaN: true }), fc.double({ min: 0.05, max: 1.5, noNaN: true }), (a, b, r) => {
        const n = 400;
        let inside = 0;
        for (let i = 0; i < n; i++) {
          for (let j = 0; j < n; j++) {
            const x = ((i + 0.5) / n - 0.5) * a;
            const y = ((j + 0.5) / n - 0.5) * b;
            if (x * x + y * y <= r * r) inside++;
          }
        }
        expect(Math.abs(gridCoverage(a, b, r) - inside / (n * n))).toBeLessThan(0.01);
      }),
      { numRuns: 30 },
    );
  });
});

describe('planOllas with minCoverage (fewer pots when corners may stay dry)', () => {
  // A 6 × 3 ft bed (1.83 × 0.91 m) and 12-inch (0.305 m) pots, the planner's US default.
  const bed = { lengthM: 6 * 0.3048, widthM: 3 * 0.3048 };
  const pot = { widestDiameterM: 0.3048 };

  it('the whole bed takes 10 pots; 90 % takes 8; 80 % takes 6', () => {
    // Whole bed: 5 × 2 cells of 1.2 × 1.5 ft, half-diagonal 0.96 ft within the 1 ft wetted radius;
    // 4 × 2 (1.5 × 1.5 ft, half-diagonal 1.06 ft) leaves the corners dry.
    expect(planOllas(bed, pot).count).toBe(10);
    const most = planOllas(bed, pot, { minCoverage: 0.9 });
    expect([most.columns, most.rows]).toEqual([4, 2]);
    expect(most.fullCoverage).toBe(false);
    expect(most.coveredFraction).toBeGreaterThanOrEqual(0.9);
    const middle = planOllas(bed, pot, { minCoverage: 0.8 });
    expect([middle.columns, middle.rows]).toEqual([3, 2]);
    expect(middle.coveredFraction).toBeGreaterThanOrEqual(0.8);
    expect(middle.coveredFraction).toBeCloseTo(gridCoverage(bed.lengthM / 3, bed.widthM / 2, 0.3048), 12);
  });

  test('never more pots than the whole-bed plan, and always at least the share asked for when the whole-bed plan covers', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.4, max: 6, noNaN: true }), fc.double({ min: 0.4, max: 3, noNaN: true }), fc.double({ min: 0.5, max: 1, noNaN: true }), (l, w, c) => {
        const whole = planOllas({ lengthM: l, widthM: w }, { widestDiameterM: 0.3 });
        const part = planOllas({ lengthM: l, widthM: w }, { widestDiameterM: 0.3 }, { minCoverage: c });
        expect(part.count).toBeLessThanOrEqual(whole.count);
        if (whole.fullCoverage) expect(part.coveredFraction).toBeGreaterThanOrEqual(c - 1e-9);
      }),
      { numRuns: 200 },
    );
  });

  it('refuses a share outside 0.5–1', () => {
    expect(() => planOllas(bed, pot, { minCoverage: 0.3 })).toThrow(AnalysisInputError);
    expect(() => planOllas(bed, pot, { minCoverage: 1.2 })).toThrow(AnalysisInputError);
  });
});
