/**
 * Typed numbers in both languages: English writes "2.5", Spanish "2,5" (CLDR number symbols for
 * "es": decimal separator ","; for "en": "."). Intl.NumberFormat, which reads the same CLDR data,
 * is the outside reference: what the app prints in each language must read back as the same number.
 */
import { describe, expect, it } from 'vitest';
import { parseDecimal } from '@/lib/parse-number';
import { optionalTypedNumber, typedNumber } from '@/features/pots/components/typed-number';
import { typedNumber as plannerTypedNumber } from '@/features/planner/components/typed-number';

describe('parseDecimal', () => {
  it('reads a decimal point and a decimal comma alike', () => {
    expect(parseDecimal('2.5')).toBe(2.5);
    expect(parseDecimal('2,5')).toBe(2.5);
    expect(parseDecimal(' 12 ')).toBe(12);
    expect(parseDecimal('-3,25')).toBe(-3.25);
    expect(parseDecimal('−3.25')).toBe(-3.25);
    expect(parseDecimal(',5')).toBe(0.5);
  });

  it('reads back what the app prints in each language (Intl.NumberFormat, CLDR)', () => {
    for (const locale of ['en', 'es', 'es-MX', 'en-US']) {
      const text = new Intl.NumberFormat(locale, { maximumFractionDigits: 2, useGrouping: false }).format(1.75);
      expect(parseDecimal(text), `${locale}: ${text}`).toBe(1.75);
    }
  });

  it('refuses empty text, words and grouped numbers instead of guessing', () => {
    for (const s of ['', '   ', 'abc', '1,234.5', '1.234,5', '2,5,1', '1e3', '--2']) expect(parseDecimal(s), s).toBeNaN();
  });
});

describe('typed-number schemas accept a decimal comma', () => {
  it('pots', () => {
    expect(typedNumber('the capacity').parse('7,5')).toBe(7.5);
    expect(optionalTypedNumber('the height').parse('')).toBeNull();
    expect(optionalTypedNumber('the height').parse('30,2')).toBe(30.2);
    expect(typedNumber('the capacity').safeParse('7,5,0').success).toBe(false);
  });
  it('planner', () => {
    expect(plannerTypedNumber('the bed length').parse('2,25')).toBe(2.25);
    expect(plannerTypedNumber('the bed length').safeParse('').success).toBe(false);
  });
});
