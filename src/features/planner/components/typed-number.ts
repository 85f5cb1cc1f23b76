import { z } from 'zod';
import { formatNumber as formatLocal } from '@/lib/format';
import { parseDecimal as parse } from '@/lib/parse-number';

/**
 * A number typed into a text box: a decimal comma is accepted, an empty box and text that is
 * not a number each get a message in words. `rules` adds the range checks in display units.
 */
export function typedNumber(what: string | { enter: string; notNumber: string }, rules: (n: z.ZodNumber) => z.ZodType<number, number> = (n) => n) {
  const m = typeof what === 'string' ? { enter: `Enter ${what}.`, notNumber: `Write ${what} as a number, like 2.5.` } : what;
  return z
    .string()
    .transform((text, ctx) => {
      if (!text.trim()) {
        ctx.addIssue({ code: 'custom', message: m.enter });
        return z.NEVER;
      }
      const n = parse(text);
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: m.notNumber });
        return z.NEVER;
      }
      return n;
    })
    .pipe(rules(z.number()));
}

/**
 * Checks one field inside a whole-form transform (for fields that matter only in some modes)
 * and reports its messages on that field. Returns null when it failed.
 */
export function checkField<T>(ctx: z.RefinementCtx, schema: z.ZodType<T, string>, value: string, path: string): T | null {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: [path, ...issue.path.map(String)] });
  return null;
}

/** A number for a text box: at most `digits` decimals, no trailing zeros. */
export function numberText(value: number, digits: number): string {
  return Number.isFinite(value) ? String(Number(value.toFixed(digits))) : '';
}

/** A number for reading in the reader's language (decimal comma in Spanish): grouped, at most `digits` decimals. */
export function formatNumber(value: number, digits: number): string {
  return formatLocal(value, digits);
}

/** The first message for each field of a failed parse, keyed by the field's name. */
export function fieldMessages(result: { success: boolean; error?: z.ZodError }): Record<string, string> {
  const out: Record<string, string> = {};
  if (result.success || !result.error) return out;
  for (const issue of result.error.issues) {
    const key = String(issue.path[0] ?? '');
    if (key && !(key in out)) out[key] = issue.message;
  }
  return out;
}
