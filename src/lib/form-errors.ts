import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiRequestError } from './api-client';

/**
 * Puts a failed request's field-level messages onto the form and returns the message to show
 * above it (the server's own words, or a generic one for unexpected failures).
 */
export function applyServerErrors<T extends FieldValues>(err: unknown, setError: UseFormSetError<T>): string {
  if (err instanceof ApiRequestError) {
    for (const [path, message] of Object.entries(err.fieldErrors)) setError(path as Path<T>, { type: 'server', message });
    return err.message;
  }
  return 'Something went wrong. Please try again.';
}
