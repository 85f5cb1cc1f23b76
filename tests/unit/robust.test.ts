import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it, test } from 'vitest';
import { AnalysisInputError } from '@shared/analysis/paired';
import { lag1Autocorrelation, looksLikeWrongVolumeUnit, mad, median, robustOutliers, robustZScores } from '@shared/analysis/robust';

function readNistColumn(file: string): number[] {
  const text = readFileSync(new URL(`../../datasets/nist-strd/${file}`, import.meta.url), 'utf8');
  return text
    .split('\n')
    .filter((line) => line.trim() !== '' && !line.startsWith('#'))
    .slice(1)
    .map(Number);
}

describe('median, MAD and modified z-scores', () => {
  it('gives median 2 and MAD 1 for 1, 1, 2, 2, 4, 6, 9', () => {
    // Worked example of the median absolute deviation (Wikipedia "Median absolute deviation"; from memory).
    const x = [1, 1, 2, 2, 4, 6, 9];
    expect(median(x)).toBe(2);
    expect(mad(x)).toBe(1);
  });

  it('uses Iglewicz & Hoaglin (1993) modified z = 0.6745·(x − median)/MAD with the 3.5 cut-off (constants from memory)', () => {
    const x = [1, 1, 2, 2, 4, 6, 9];
    const z = robustZScores(x);
    expect(z[6]).toBeCloseTo(0.6745 * 7, 12); // (9 − 2)/1
    expect(z[0]).toBeCloseTo(-0.6745, 12);
    expect(robustOutliers(x)).toEqual([6]); // only 9 exceeds 3.5
  });

  it('scores ±Infinity against a zero MAD (documented)', () => {
    expect(robustZScores([5, 5, 5, 5, 6])).toEqual([0, 0, 0, 0, Number.POSITIVE_INFINITY]);
  });

  it('is unchanged by shifting and scaling the data (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.integer({ min: -10000, max: 10000 }).map((v) => v / 8),
          { minLength: 3, maxLength: 40 },
        ),
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        (x, shift, scale) => {
          fc.pre(mad(x) > 1e-6);
          const z1 = robustZScores(x);
          const z2 = robustZScores(x.map((v) => v * scale + shift));
          z1.forEach((z, i) => expect(z2[i]).toBeCloseTo(z, 6));
        },
      ),
    );
  });

  it('rejects empty input', () => {
    expect(() => median([])).toThrow(AnalysisInputError);
  });
});

describe('lag1Autocorrelation on NIST StRD univariate data (certified values)', () => {
  it('Michelso: r(1) = 0.535199668621283 (REFERENCES.md, V)', () => {
    const r = lag1Autocorrelation(readNistColumn('michelso.csv'));
    expect(Math.abs(r - 0.535199668621283)).toBeLessThan(1e-12);
  });

  it('Lew: r(1) = -0.307304800605679 (NIST certified value, read in two independent test suites that quote NIST; not in REFERENCES.md)', () => {
    const r = lag1Autocorrelation(readNistColumn('lew.csv'));
    expect(Math.abs(r - -0.307304800605679)).toBeLessThan(1e-12);
  });

  it('NumAcc1 (10000001, 10000003, 10000002): r(1) = -0.5 (NIST certified value, recalled; by hand: (−1·1 + 1·0)/2)', () => {
    expect(lag1Autocorrelation([10000001, 10000003, 10000002])).toBeCloseTo(-0.5, 12);
  });

  it('is NaN for a constant series', () => {
    expect(lag1Autocorrelation([3, 3, 3])).toBeNaN();
  });
});

describe('looksLikeWrongVolumeUnit (heuristic)', () => {
  const refills = [10, 9.5, 10.2, 9.8, 10.1, 10.4, 9.7];

  it('flags a value about 3.785 times the others (US gallon factor, NIST Handbook 44)', () => {
    const flags = looksLikeWrongVolumeUnit([...refills, 37.9]);
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ index: 7, kind: 'looks-like-gallons-converted-twice' });
    expect(flags[0]!.suggestedValue).toBeCloseTo(37.9 / 3.785411784, 12);
  });

  it('flags a value about 1/3.785 of the others (gallons typed into a litre field)', () => {
    const flags = looksLikeWrongVolumeUnit([2.64, ...refills]);
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ index: 0, kind: 'looks-like-gallons-typed-as-litres' });
    expect(flags[0]!.suggestedValue).toBeCloseTo(2.64 * 3.785411784, 12);
  });

  test.each([
    ['a consistent trial', refills],
    ['a trial with a natural four-fold spread', [2, 4, 5, 6, 7, 8, 9]],
    ['an outlier at another ratio (×2)', [...refills, 20]],
    ['too few values to judge', [10, 37.9, 10]],
  ])('raises nothing for %s', (_label, values) => {
    expect(looksLikeWrongVolumeUnit(values)).toEqual([]);
  });

  it('finds one litre/gallon slip among comparable refills (property)', () => {
    fc.assert(
      fc.property(
        // refills within ±5 % of 10 L, so one slipped value lands within the 15 % tolerance of 3.785 × median
        fc.array(fc.double({ min: 9.5, max: 10.5, noNaN: true }), { minLength: 5, maxLength: 30 }),
        fc.nat(),
        (values, pick) => {
          expect(looksLikeWrongVolumeUnit(values)).toEqual([]);
          const index = pick % values.length;
          const slipped = values.map((v, i) => (i === index ? v * 3.785411784 : v));
          const flags = looksLikeWrongVolumeUnit(slipped);
          expect(flags.map((f) => f.index)).toEqual([index]);
          expect(flags[0]!.suggestedValue).toBeCloseTo(values[index]!, 9);
        },
      ),
    );
  });
});
