// Exact unit definitions: NIST Handbook 44, Appendix C, and the SI Brochure (REFERENCES.md, V):
// inch = 25.4 mm; US gallon = 231 in³ = 3.785411784 L; pound = 0.45359237 kg; foot = 0.3048 m;
// ft² = 0.09290304 m²; °F = °C·9/5 + 32.
import fc from 'fast-check';
import { describe, expect, it, test } from 'vitest';
import {
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatQuantity,
  fromDisplay,
  KG_PER_POUND,
  LITRES_PER_US_GALLON,
  M2_PER_SQUARE_FOOT,
  M_PER_FOOT,
  MM_PER_INCH,
  type Quantity,
  toDisplay,
  unitLabel,
} from '@shared/units';
import { quantitySchema, unitSystemSchema } from '@shared/schemas/units';

describe('exact definitions', () => {
  test.each([
    ['volume', 3.785411784], // US gallon = 3.785411784 L (NIST Handbook 44 App. C)
    ['mass', 0.45359237], // pound = 0.45359237 kg (NIST Handbook 44 App. C)
    ['length-small', 25.4], // inch = 25.4 mm (NIST Handbook 44 App. C)
    ['length', 0.3048], // foot = 0.3048 m (NIST Handbook 44 App. C)
    ['area', 0.09290304], // square foot = 0.09290304 m² (NIST Handbook 44 App. C)
    ['rate', 3.785411784], // gal/day = 3.785411784 L/day (from the gallon)
    ['speed', 0.44704], // mile per hour = 0.44704 m/s (NIST SP 811 App. B: mile = 1,609.344 m, exact)
  ] as const)('1 US unit of %s is exactly %s SI units', (quantity, si) => {
    expect(fromDisplay(1, quantity, 'us')).toBe(si);
  });

  it('US gallon = 231 cubic inches', () => {
    // 231 in³ × (2.54 cm)³ = 231 × 16.387064 cm³ = 3785.411784 cm³ (NIST Handbook 44 App. C)
    expect(231 * (MM_PER_INCH / 100) ** 3).toBeCloseTo(LITRES_PER_US_GALLON, 12);
  });

  it('ft² = (0.3048 m)² and 1 inch of water over 1 ft² = 2.359737216 L', () => {
    expect(M_PER_FOOT ** 2).toBeCloseTo(M2_PER_SQUARE_FOOT, 15);
    expect(MM_PER_INCH * M2_PER_SQUARE_FOOT).toBeCloseTo(2.359737216, 12); // REFERENCES.md units (exact)
  });

  test.each([
    [0, 32], // freezing point of water (definition of the Fahrenheit scale)
    [100, 212], // boiling point at standard pressure
    [-40, -40], // the two scales cross at −40
    [1060, 1940], // Orton cone 04 as printed on the 150 °C/h chart (both scales on the chart)
  ])('%s °C = %s °F', (c, f) => {
    expect(celsiusToFahrenheit(c)).toBeCloseTo(f, 10);
    expect(fahrenheitToCelsius(f)).toBeCloseTo(c, 10);
    expect(toDisplay(c, 'temperature', 'us')).toBeCloseTo(f, 10);
    expect(fromDisplay(f, 'temperature', 'us')).toBeCloseTo(c, 10);
  });

  it('shows 1 kg as 2.204623 lb (1/0.45359237; NIST SP 811 lists 1 kg = 2.204 623 lb, from memory)', () => {
    expect(toDisplay(1, 'mass', 'us')).toBeCloseTo(2.204623, 6);
    expect(KG_PER_POUND).toBe(0.45359237);
  });
});

describe('toDisplay / fromDisplay', () => {
  const quantities = quantitySchema.options;

  it('is the identity in the metric system', () => {
    for (const q of quantities) {
      expect(toDisplay(12.5, q, 'metric')).toBe(12.5);
      expect(fromDisplay(12.5, q, 'metric')).toBe(12.5);
    }
  });

  it('round-trips every quantity (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<Quantity>(...quantities),
        fc.constantFrom('metric' as const, 'us' as const),
        fc.double({ min: -1e9, max: 1e9, noNaN: true }),
        (q, system, value) => {
          const back = fromDisplay(toDisplay(value, q, system), q, system);
          expect(Math.abs(back - value)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(value)));
        },
      ),
    );
  });

  it('converts 10 L to 2.641720524 gal (10 / 3.785411784)', () => {
    expect(toDisplay(10, 'volume', 'us')).toBeCloseTo(2.641720524, 9);
  });

  it('throws on NaN', () => {
    expect(() => toDisplay(Number.NaN, 'volume', 'us')).toThrow();
  });
});

describe('labels and schema', () => {
  test.each([
    ['volume', 'L', 'gal'],
    ['mass', 'kg', 'lb'],
    ['length-small', 'mm', 'in'],
    ['length', 'm', 'ft'],
    ['area', 'm²', 'ft²'],
    ['temperature', '°C', '°F'],
    ['rate', 'L/day', 'gal/day'],
  ] as const)('%s is labelled %s / %s', (q, metric, us) => {
    expect(unitLabel(q, 'metric')).toBe(metric);
    expect(unitLabel(q, 'us')).toBe(us);
  });

  it('formats a value with its label', () => {
    expect(formatQuantity(10, 'volume', 'us')).toEqual({ value: 2.64, label: 'gal', text: '2.64 gal' });
    expect(formatQuantity(21.456, 'temperature', 'metric', 1).text).toBe('21.5 °C');
  });

  test.each([
    ['metric', true],
    ['us', true],
    ['imperial', false],
    ['', false],
  ])('unitSystemSchema accepts %j: %s', (value, ok) => {
    expect(unitSystemSchema.safeParse(value).success).toBe(ok);
  });
});
