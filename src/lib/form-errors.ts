import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiRequestError } from './api-client';

/**
 * Puts a failed request's field-level messages onto the form and returns the message to show
 * above it (the server's own words, or a generic one for unexpected failures); empty when the
 * message already sits on a field.
 */
export function applyServerErrors<T extends FieldValues>(err: unknown, setError: UseFormSetError<T>): string {
  if (err instanceof ApiRequestError) {
    const fields = Object.entries(err.fieldErrors);
    for (const [path, message] of fields) setError(path as Path<T>, { type: 'server', message });
    // Said once is enough: when the field already carries the very same words, no banner repeats them.
    return fields.some(([, message]) => message === err.message) ? '' : err.message;
  }
  return 'Something went wrong. Please try again.';
}
