import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it, test } from 'vitest';
import { AnalysisInputError } from '@shared/analysis/paired';
import { depthMm, harvestRatio, leastSquaresLine, litresForDepth, seepageRateFromLevels, waterSavingPercent, waterUseEfficiency } from '@shared/analysis/water';
import { fromDisplay } from '@shared/units';

function readNorris(): { x: number[]; y: number[] } {
  const text = readFileSync(new URL('../../datasets/nist-strd/norris.csv', import.meta.url), 'utf8');
  const rows = text
    .split('\n')
    .filter((line) => line.trim() !== '' && !line.startsWith('#'))
    .slice(1)
    .map((line) => line.split(',').map(Number));
  return { y: rows.map((r) => r[0] as number), x: rows.map((r) => r[1] as number) };
}

describe('waterUseEfficiency', () => {
  it('is kg per m³: 7 kg from 1000 L is 7 kg/m³', () => {
    // Bainbridge (2012): buried clay pots reach about 7 kg/m³ (REFERENCES.md, V); 1 m³ = 1000 L (SI definition).
    expect(waterUseEfficiency(7, 1000)).toBe(7);
    expect(waterUseEfficiency(0.7, 1000)).toBeCloseTo(0.7, 12); // basin irrigation figure in the same source
  });

  it('does not depend on the unit system the inputs were typed in (property)', () => {
    // 1 lb/US gal = 0.45359237 kg / 0.003785411784 m³ = 119.826427 kg/m³ (exact definitions, NIST Handbook 44 App. C)
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 1e4, noNaN: true }), fc.double({ min: 0.1, max: 1e6, noNaN: true }), (pounds, gallons) => {
        const wue = waterUseEfficiency(fromDisplay(pounds, 'mass', 'us'), fromDisplay(gallons, 'volume', 'us'));
        expect(wue / ((pounds / gallons) * 119.82642731689663)).toBeCloseTo(1, 12);
      }),
    );
  });

  it('scales linearly with yield and inversely with water (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 1e4, noNaN: true }),
        fc.double({ min: 0.1, max: 1e6, noNaN: true }),
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        (kg, litres, k) => {
          const base = waterUseEfficiency(kg, litres);
          expect(waterUseEfficiency(kg * k, litres) / base).toBeCloseTo(k, 10);
          expect(waterUseEfficiency(kg, litres * k) / base).toBeCloseTo(1 / k, 10);
        },
      ),
    );
  });

  test.each([
    ['zero water', () => waterUseEfficiency(1, 0)],
    ['negative water', () => waterUseEfficiency(1, -5)],
    ['negative yield', () => waterUseEfficiency(-1, 5)],
  ])('throws AnalysisInputError for %s', (_label, call) => {
    expect(call).toThrow(AnalysisInputError);
  });
});

describe('waterSavingPercent, depthMm, harvestRatio', () => {
  test.each([
    // Reported savings against surface watering (REFERENCES.md): 50 % common practice, no source;
    // 70 % (Daka & Nonde 1996, against watering cans); 82-84 % (Siyal, Soomro & Siyal 2015).
    [50, 100, 50],
    [30, 100, 70],
    [17, 100, 83],
    [120, 100, -20], // the olla bed used more: a negative saving, shown as such
  ])('treatment %s L against control %s L saves %s %%', (treatment, control, saving) => {
    expect(waterSavingPercent(treatment, control)).toBeCloseTo(saving, 12);
  });

  it('throws for a non-positive control', () => {
    expect(() => waterSavingPercent(10, 0)).toThrow(AnalysisInputError);
    expect(() => waterSavingPercent(10, -1)).toThrow(/greater than zero/);
  });

  it('1 L over 1 m² is 1 mm (definition of the litre and the millimetre)', () => {
    expect(depthMm(1, 1)).toBe(1);
    expect(depthMm(25, 5)).toBe(5);
    expect(litresForDepth(5, 5)).toBe(25);
    // 1 inch over 1 ft² = 2.359737216 L (REFERENCES.md units, exact): 25.4 mm × 0.09290304 m²
    expect(depthMm(2.359737216, 0.09290304)).toBeCloseTo(25.4, 12);
    expect(() => depthMm(1, 0)).toThrow(AnalysisInputError);
  });

  it('harvestRatio divides treatment by control and rejects a zero control', () => {
    expect(harvestRatio(12, 10)).toBeCloseTo(1.2, 12);
    expect(() => harvestRatio(12, 0)).toThrow(AnalysisInputError);
  });
});

describe('leastSquaresLine on NIST StRD Norris (certified values, REFERENCES.md V)', () => {
  const { x, y } = readNorris();
  const fit = leastSquaresLine(x, y);

  it('reads all 36 observations', () => {
    expect(x).toHaveLength(36);
  });

  test.each([
    ['intercept B0', fit.intercept, -0.262323073774029, 1e-10], // certified B0
    ['slope B1', fit.slope, 1.00211681802045, 1e-12], // certified B1
    ['residual SD', fit.residualSd, 0.884796396144373, 1e-12], // certified residual standard deviation
    ['R²', fit.rSquared, 0.999993745883712, 1e-12], // certified R-squared
    ['SD of B0', fit.interceptSe, 0.232818234301152, 1e-10], // certified SD of B0, read in a transcription of NIST Norris.dat (not in REFERENCES.md)
    ['SD of B1', fit.slopeSe, 0.429796848199937e-3, 1e-10], // certified SD of B1, read in a transcription of NIST Norris.dat (not in REFERENCES.md)
  ])('%s', (_name, value, certified, relative) => {
    expect(Math.abs((value - certified) / certified)).toBeLessThan(relative);
  });
});

describe('seepageRateFromLevels', () => {
  it('recovers a constant seepage rate exactly', () => {
    // 10 L pot losing 0.4 L/day (within the 0.16-0.60 L/day field range in REFERENCES.md)
    const readings = [0, 1, 2, 3, 4].map((day) => ({ day, litres: 10 - 0.4 * day }));
    const r = seepageRateFromLevels(readings);
    expect(r.litresPerDay).toBeCloseTo(0.4, 12);
    expect(r.se).toBeCloseTo(0, 12);
  });

  it('needs three readings on different days', () => {
    expect(() =>
      seepageRateFromLevels([
        { day: 0, litres: 10 },
        { day: 1, litres: 9 },
      ]),
    ).toThrow(AnalysisInputError);
    expect(() => seepageRateFromLevels([0, 0, 0].map((day) => ({ day, litres: 5 })))).toThrow(AnalysisInputError);
  });
});
