import { z } from 'zod';
import { parseDecimal as parse } from '@/lib/parse-number';

/**
 * A number typed into a text box: a decimal comma is accepted, an empty box and text that is
 * not a number each get a message in words. `rules` adds the range checks in display units.
 */
export function typedNumber(what: string, rules: (n: z.ZodNumber) => z.ZodType<number, number> = (n) => n) {
  return z
    .string()
    .transform((text, ctx) => {
      if (!text.trim()) {
        ctx.addIssue({ code: 'custom', message: `Enter ${what}.` });
        return z.NEVER;
      }
      const n = parse(text);
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: `Write ${what} as a number, like 2.5.` });
        return z.NEVER;
      }
      return n;
    })
    .pipe(rules(z.number()));
}

/** As typedNumber, but an empty box means "not known" (null). */
export function optionalTypedNumber(what: string, rules: (n: z.ZodNumber) => z.ZodType<number, number> = (n) => n) {
  return z
    .string()
    .transform((text, ctx) => {
      if (!text.trim()) return null;
      const n = parse(text);
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: `Write ${what} as a number, like 2.5, or leave it empty.` });
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
