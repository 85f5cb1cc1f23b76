import { z } from 'zod';
import { parseDecimal as parse } from '@/lib/parse-number';

/** What a box says when it is empty or holds no number: English words by default, or the reader's language. */
export interface TypedNumberMessages {
  enter: string;
  notNumber: string;
  notNumberOrEmpty: string;
}

const english = (what: string): TypedNumberMessages => ({
  enter: `Enter ${what}.`,
  notNumber: `Write ${what} as a number, like 2.5.`,
  notNumberOrEmpty: `Write ${what} as a number, like 2.5, or leave it empty.`,
});
const messagesOf = (what: string | TypedNumberMessages) => (typeof what === 'string' ? english(what) : what);

/**
 * A number typed into a text box: a decimal comma is accepted, an empty box and text that is
 * not a number each get a message in words. `rules` adds the range checks in display units.
 */
export function typedNumber(what: string | TypedNumberMessages, rules: (n: z.ZodNumber) => z.ZodType<number, number> = (n) => n) {
  const m = messagesOf(what);
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

/** As typedNumber, but an empty box means "not known" (null). */
export function optionalTypedNumber(what: string | TypedNumberMessages, rules: (n: z.ZodNumber) => z.ZodType<number, number> = (n) => n) {
  const m = messagesOf(what);
  return z
    .string()
    .transform((text, ctx) => {
      if (!text.trim()) return null;
      const n = parse(text);
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: m.notNumberOrEmpty });
        return z.NEVER;
      }
      return n;
    })
    .pipe(rules(z.number()).nullable());
}

/** A display number for a text box: no trailing zeros, at most `digits` decimals, a dot as separator. */
export function numberText(value: number | null | undefined, digits: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return String(Number(value.toFixed(digits)));
}

/**
 * A shared input schema as the last step of a form's pipe: the form has already turned the
 * typed text into the schema's SI input, with every default filled in.
 */
export function finalCheck<O>(schema: z.ZodType<O, Partial<O>>): z.ZodType<O, O> {
  return schema as unknown as z.ZodType<O, O>;
}
