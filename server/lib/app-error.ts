import type { ErrorCode } from '@shared/api-error';

const statusFor: Record<ErrorCode, number> = {
  validation_failed: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  csrf_invalid: 403,
  rate_limited: 429,
  payload_too_large: 413,
  unsupported_media_type: 415,
  service_unavailable: 503,
  internal_error: 500,
};

/** An expected failure: becomes `{ error: { code, message, reason?, params?, details } }` with its status. */
export class AppError extends Error {
  readonly status: number;
  /** The exact case, stable snake_case, for the client to translate (shared/api-error.ts). */
  reason?: string;
  params?: Record<string, string | number>;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.status = statusFor[code];
  }

  /** Names the exact case: `throw new AppError('conflict', 'This cohort is full…').because('cohort_full')`. */
  because(reason: string, params?: Record<string, string | number>): this {
    this.reason = reason;
    this.params = params;
    return this;
  }

  static notFound(what: string) {
    return new AppError('not_found', `${what} was not found.`).because('not_found');
  }
  static forbidden(message?: string) {
    return message ? new AppError('forbidden', message) : new AppError('forbidden', 'You do not have permission to do that.').because('not_allowed');
  }
  static validation(message: string, details?: unknown) {
    return new AppError('validation_failed', message, details);
  }
}
