import type { Request, RequestHandler } from 'express';
import { AppError } from '../lib/app-error';
import { randomToken, safeEqual } from './tokens';

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

/** The session's CSRF token (synchronizer-token pattern), created on first use. */
export function csrfTokenFor(req: Request): string {
  req.session.csrfToken ??= randomToken(24);
  return req.session.csrfToken;
}

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Every state-changing request carries the session's token in X-CSRF-Token. A cross-site form
 * or fetch cannot read it, so it cannot forge one.
 */
export const requireCsrf: RequestHandler = (req, _res, next) => {
  if (safeMethods.has(req.method)) return next();
  const sent = req.get('x-csrf-token');
  const expected = req.session?.csrfToken;
  if (!sent || !expected || !safeEqual(sent, expected)) {
    return next(new AppError('csrf_invalid', 'This request is missing its security token. Reload the page and try again.'));
  }
  next();
};
