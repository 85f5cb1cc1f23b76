/**
 * A number typed into a text box, read the same in every language: "2.5" and "2,5" are both two
 * and a half (Spanish writes a decimal comma, and the number pad of a Spanish phone offers one).
 * Grouping is not accepted ("1,234.5", "1.234,5" → NaN), so a typo is never read as another
 * number. Empty or non-numeric text → NaN; callers say in words what is wrong.
 */
export function parseDecimal(text: string): number {
  const s = text.trim().replace(/\s+/g, '').replace(/^−/, '-');
  if (s === '') return Number.NaN;
  if (!/^[-+]?(\d+([.,]\d*)?|[.,]\d+)$/.test(s)) return Number.NaN;
  return Number(s.replace(',', '.'));
}

/** As parseDecimal, for react-hook-form's `setValueAs`: an empty box stays empty (undefined). */
export function decimalOrUndefined(v: unknown): number | undefined {
  if (typeof v === 'number') return v;
  const s = String(v ?? '').trim();
  return s === '' ? undefined : parseDecimal(s);
}
