import { z } from 'zod';

/** The one error shape every failing API request returns. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.unknown().optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

/** Machine-readable error codes, snake_case. */
export const errorCodes = [
  'validation_failed',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'csrf_invalid',
  'rate_limited',
  'payload_too_large',
  'unsupported_media_type',
  'service_unavailable',
  'internal_error',
] as const;
export type ErrorCode = (typeof errorCodes)[number];

/** A field-level validation problem, as sent in `details` for `validation_failed`. */
export const fieldIssueSchema = z.object({ path: z.string(), message: z.string() });
export type FieldIssue = z.infer<typeof fieldIssueSchema>;
