import { describe, expect, it, test } from 'vitest';
import { AnalysisInputError } from '@shared/analysis/paired';
import { CONE_CHARTS, CONE_IDS, coneTemperature, firingBand, firingNote } from '@shared/agronomy/pyrometric-cones';

describe('coneTemperature (default: Orton standard chart, 150 °C/h)', () => {
  it('cone 04 = 1060 °C = 1940 °F', () => {
    const c = coneTemperature('04');
    expect(c.celsius).toBe(1060); // Orton chart, cone 04 = 1060 °C (REFERENCES.md; two web transcriptions of the 150 °C/h chart agree)
    expect(c.fahrenheit).toBe(1940); // Orton chart, cone 04 = 1940 °F (REFERENCES.md)
    expect(c.heatingRateCPerHour).toBe(150);
    expect(c.chart).toMatch(/150 °C\/h/);
  });

  test.each([
    ['06', 999], // Orton chart: cone 06 = 999 °C (REFERENCES.md, V(t))
    ['05', 1046], // Orton chart: cone 05 = 1046 °C (REFERENCES.md, V(t))
  ])('cone %s = %s °C', (cone, celsius) => {
    expect(coneTemperature(cone).celsius).toBe(celsius);
  });

  it('the current self-supporting chart at 60 °C/h gives cone 04 = 1945 °F (1063 °C)', () => {
    // Orton self-supporting cone chart, 108 °F/h column: cone 04 = 1945 °F (one web transcription, V(t));
    // °C value 1063 from memory, consistent with (1945 − 32)·5/9 = 1062.8.
    const c = coneTemperature('04', 'orton-self-supporting-60');
    expect(c.fahrenheit).toBe(1945);
    expect(c.celsius).toBe(1063);
    expect(c.heatingRateCPerHour).toBe(60);
  });

  it('tells cone 06 from cone 6 and rejects unknown cones', () => {
    expect(coneTemperature('6').celsius).toBe(1222); // Orton 150 °C/h chart: cone 6 = 1222 °C (V(t))
    expect(coneTemperature('06').celsius).toBe(999);
    expect(() => coneTemperature('11')).toThrow(AnalysisInputError);
    expect(() => coneTemperature('4.5')).toThrow(AnalysisInputError);
  });
});

describe('both charts are internally consistent', () => {
  test.each(Object.values(CONE_CHARTS).map((chart) => [chart.id, chart] as const))('%s', (_id, chart) => {
    let previous = -Infinity;
    for (const cone of CONE_IDS) {
      const row = chart.rows[cone];
      // The chart prints °C and °F separately; each pair agrees with °F = °C·9/5 + 32 to the rounding
      // of the printed values (within 1 °F), which catches transcription slips.
      expect(Math.abs(row.fahrenheit - (row.celsius * 9) / 5 - 32)).toBeLessThanOrEqual(1);
      // Cone numbers run 022 (coolest) to 10 (hottest): temperatures must rise monotonically.
      expect(row.celsius).toBeGreaterThan(previous);
      previous = row.celsius;
    }
  });
});

describe('firingNote and firingBand', () => {
  it('says cone 04 earthenware is porous (common practice, no source)', () => {
    expect(firingBand('04')).toBe('porous-earthenware');
    const note = firingNote('04');
    expect(note).toMatch(/porous/);
    expect(note).toMatch(/cone 04 \(~1060 °C\)/);
  });

  it('warns that hotter firing vitrifies the clay and stops seepage', () => {
    expect(firingBand('6')).toBe('vitrifying');
    expect(firingNote('6')).toMatch(/vitrifies/);
    expect(firingNote('10')).toMatch(/1305 °C/); // Orton 150 °C/h chart: cone 10 = 1305 °C (V(t))
  });

  it('flags very low cones as underfired', () => {
    expect(firingBand('018')).toBe('underfired');
    expect(() => firingNote('nope')).toThrow(AnalysisInputError);
  });
});
