/**
 * Units. Seepwise stores every quantity in SI-based units (L, kg, mm, m, m², °C, L/day)
 * and converts only for display and input.
 *
 * Exact definitions (NIST Handbook 44 Appendix C; SI Brochure; international yard and
 * pound agreement of 1959):
 *   1 in = 25.4 mm, 1 ft = 0.3048 m, 1 ft² = 0.09290304 m²,
 *   1 US gallon = 231 in³ = 3.785411784 L, 1 lb = 0.45359237 kg,
 *   °F = °C × 9/5 + 32.
 */
import { AnalysisInputError } from './analysis/input-error';

// Plain lists, no zod: the client's first page uses these conversions (the schemas are in shared/schemas/units.ts).
export const UNIT_SYSTEMS = ['metric', 'us'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export const QUANTITIES = ['volume', 'mass', 'length-small', 'length', 'area', 'temperature', 'rate', 'speed'] as const;
export type Quantity = (typeof QUANTITIES)[number];

export const MM_PER_INCH = 25.4;
export const M_PER_FOOT = 0.3048;
export const M2_PER_SQUARE_FOOT = 0.09290304;
export const LITRES_PER_US_GALLON = 3.785411784;
export const KG_PER_POUND = 0.45359237;
/** One mile per hour in metres per second: 1,609.344 m ÷ 3,600 s. */
export const M_PER_S_PER_MPH = 0.44704;

/** SI value of one US unit, for the quantities that convert by a factor. */
const US_FACTOR: Record<Exclude<Quantity, 'temperature'>, number> = {
  volume: LITRES_PER_US_GALLON,
  mass: KG_PER_POUND,
  'length-small': MM_PER_INCH,
  length: M_PER_FOOT,
  area: M2_PER_SQUARE_FOOT,
  rate: LITRES_PER_US_GALLON,
  speed: M_PER_S_PER_MPH,
};

export const UNIT_LABELS: Record<Quantity, Record<UnitSystem, string>> = {
  volume: { metric: 'L', us: 'gal' },
  mass: { metric: 'kg', us: 'lb' },
  'length-small': { metric: 'mm', us: 'in' },
  length: { metric: 'm', us: 'ft' },
  area: { metric: 'm²', us: 'ft²' },
  temperature: { metric: '°C', us: '°F' },
  rate: { metric: 'L/day', us: 'gal/day' },
  speed: { metric: 'm/s', us: 'mph' },
};

/** Unit symbols that are words in part ("L/day"): their Spanish form. Every other symbol is the same in both languages. */
const SPANISH_LABELS: Partial<Record<Quantity, Record<UnitSystem, string>>> = { rate: { metric: 'L/día', us: 'gal/día' } };

/** The unit's symbol; `lang` ('en' | 'es', default English) picks the Spanish form of "L/day". */
export function unitLabel(quantity: Quantity, system: UnitSystem, lang: string = 'en'): string {
  if (lang === 'es') return SPANISH_LABELS[quantity]?.[system] ?? UNIT_LABELS[quantity][system];
  return UNIT_LABELS[quantity][system];
}

export function celsiusToFahrenheit(celsius: number): number {
  return (celsius * 9) / 5 + 32;
}

export function fahrenheitToCelsius(fahrenheit: number): number {
  return ((fahrenheit - 32) * 5) / 9;
}

function checkValue(value: number): void {
  if (typeof value !== 'number' || Number.isNaN(value)) {
    throw new AnalysisInputError(`A value to convert must be a number (got ${String(value)}).`);
  }
}

/** Convert a stored SI value to the display unit of the system. */
export function toDisplay(value: number, quantity: Quantity, system: UnitSystem): number {
  checkValue(value);
  if (system === 'metric') return value;
  if (quantity === 'temperature') return celsiusToFahrenheit(value);
  return value / US_FACTOR[quantity];
}

/** Convert a value typed in the system's display unit to the stored SI value. */
export function fromDisplay(value: number, quantity: Quantity, system: UnitSystem): number {
  checkValue(value);
  if (system === 'metric') return value;
  if (quantity === 'temperature') return fahrenheitToCelsius(value);
  return value * US_FACTOR[quantity];
}

/** Value and label for display, e.g. { value: 2.64, label: 'gal' }. */
export function formatQuantity(value: number, quantity: Quantity, system: UnitSystem, fractionDigits = 2): { value: number; label: string; text: string } {
  const converted = toDisplay(value, quantity, system);
  const label = unitLabel(quantity, system);
  const rounded = Number(converted.toFixed(fractionDigits));
  return { value: rounded, label, text: `${rounded.toFixed(fractionDigits)} ${label}` };
}
