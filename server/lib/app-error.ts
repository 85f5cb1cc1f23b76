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

/** An expected failure: becomes `{ error: { code, message, details } }` with its status. */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.status = statusFor[code];
  }

  static notFound(what: string) {
    return new AppError('not_found', `${what} was not found.`);
  }
  static forbidden(message = 'You do not have permission to do that.') {
    return new AppError('forbidden', message);
  }
  static validation(message: string, details?: unknown) {
    return new AppError('validation_failed', message, details);
  }
}
