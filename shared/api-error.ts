import { z } from 'zod';

/** The one error shape every failing API request returns. */
/**
 * `code` is the category (and fixes the HTTP status); `reason`, when present, names the exact case
 * in stable snake_case (`cohort_full`, `email_taken`) so the client can show its own words in the
 * reader's language, with `params` for the placeholders. `message` is the server's English text,
 * the fallback for a reason the client does not know.
 */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    reason: z.string().optional(),
    params: z.record(z.string(), z.union([z.string(), z.number()])).optional(),
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

/**
 * A field-level validation problem, as sent in `details` for `validation_failed`: the English
 * message, plus either the `reason` of a service check or the schema's `issue` (zod's code and
 * limits) so the client can word it in the reader's language.
 */
export const fieldIssueSchema = z.object({
  path: z.string(),
  message: z.string(),
  reason: z.string().optional(),
  issue: z.record(z.string(), z.union([z.string(), z.number(), z.boolean()])).optional(),
});
export type FieldIssue = z.infer<typeof fieldIssueSchema>;
