import { toNestErrors, validateFieldsNatively } from '@hookform/resolvers';
import type { FieldError, FieldValues, Path, Resolver, UseFormSetError } from 'react-hook-form';
import type { z } from 'zod';
import { currentLanguage, i18n } from '@/i18n';
import { ApiRequestError } from './api-client';
import { issueMessage } from './validation-messages';

/**
 * A form's own words for a field: one message for any problem with it, or a function that words
 * some issues and leaves the rest (returning undefined) to the general messages.
 */
export type FieldMessage = string | ((issue: z.core.$ZodIssue) => string | undefined);

/** Stands in for zod's built-in English during a parse, so a message the schema wrote itself can be told apart. */
const ZOD_DEFAULT = '\u0000zod-default';

/**
 * zodResolver, but every message is in the reader's language (src/locales/<lang>/common.json,
 * `validation`): the form's own `messages` per field first; then, in English, a message the
 * shared schema wrote itself (its wording is kept); otherwise the general message for the
 * issue (too short, not an e-mail address, a number from … to …). Zod's global error map cannot
 * do this: a schema's own message outranks it.
 */
export function localizedZodResolver<Input extends FieldValues, Output>(
  schema: z.ZodType<Output, Input>,
  messages: Partial<Record<string, FieldMessage>> = {},
): Resolver<Input, unknown, Output> {
  return async (values, _context, options) => {
    const result = await schema.safeParseAsync(values, { error: () => ZOD_DEFAULT });
    if (result.success) {
      if (options.shouldUseNativeValidation) validateFieldsNatively({}, options);
      return { values: result.data, errors: {} };
    }
    const errors: Record<string, FieldError> = Object.create(null) as Record<string, FieldError>;
    for (const issue of result.error.issues) {
      const path = issue.path.join('.');
      if (errors[path]) continue;
      errors[path] = { type: issue.code, message: localizedIssueMessage(issue, messages[path]) };
    }
    return { values: {}, errors: toNestErrors(errors, options) };
  };
}

function localizedIssueMessage(issue: z.core.$ZodIssue, own: FieldMessage | undefined): string {
  const mine = typeof own === 'function' ? own(issue) : own;
  if (mine) return mine;
  const authored = issue.message && issue.message !== ZOD_DEFAULT;
  if (authored && currentLanguage() === 'en') return issue.message;
  return issueMessage(issue);
}

/**
 * Puts a failed request's field-level messages onto the form and returns the message to show
 * above it (src/lib/api-client.ts words both in the reader's language where it knows the case,
 * else shows the server's own words); empty when the message already sits on a field.
 */
export function applyServerErrors<T extends FieldValues>(err: unknown, setError: UseFormSetError<T>): string {
  if (err instanceof ApiRequestError) {
    const fields = Object.entries(err.fieldErrors);
    for (const [path, message] of fields) setError(path as Path<T>, { type: 'server', message });
    // Said once is enough: when the field already carries the very same words, no banner repeats them.
    return fields.some(([, message]) => message === err.message) ? '' : err.message;
  }
  return i18n.t(($) => $.apiErrors.unexpected);
}
