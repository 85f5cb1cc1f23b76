import type { NextFunction, Request, Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import {
  changePasswordInputSchema,
  requestPasswordResetInputSchema,
  resetPasswordInputSchema,
  signInInputSchema,
  signUpInputSchema,
  updateAccountInputSchema,
  verifyEmailInputSchema,
  type SessionInfo,
} from '@shared/schemas/auth';
import { csrfTokenFor } from '../auth/csrf';
import type { AppContext } from '../context';
import type { UserEntity } from '../entities/user.entity';
import { access } from '../http/access';
import { handle, route, type RouteSpec } from '../http/route';
import { AppError } from '../lib/app-error';
import { validate } from '../middleware/validate';
import { presentAccount } from '../presenters/account.presenter';
import { authService } from '../services/auth.service';

export interface AuthLimits {
  /** Sign-in attempts per e-mail and address per window. */
  signInPerWindow: number;
  /** Reset requests per e-mail and address per window. */
  resetPerWindow: number;
  windowMs: number;
}

export const defaultAuthLimits: AuthLimits = { signInPerWindow: 10, resetPerWindow: 5, windowMs: 15 * 60 * 1000 };

function limiter(limit: number, windowMs: number, message: string, reason: string) {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Per address and account, so one attacker cannot lock everyone out and one account cannot be hammered.
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String((req.body as { email?: unknown })?.email ?? '').toLowerCase().trim()}`,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'rate_limited', message, reason } });
    },
  });
}

function sessionInfo(req: Request, user: UserEntity | null | undefined): SessionInfo {
  return { user: user ? presentAccount(user) : null, csrfToken: csrfTokenFor(req) };
}

function logIn(req: Request, user: UserEntity): Promise<void> {
  // passport regenerates the session id here (session fixation defence).
  return new Promise((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
}

export function authRoutes(ctx: AppContext, limits: AuthLimits = defaultAuthLimits): RouteSpec[] {
  const svc = authService(ctx);
  const signInLimiter = limiter(limits.signInPerWindow, limits.windowMs, 'Too many sign-in attempts. Wait 15 minutes and try again, or reset your password.', 'too_many_sign_ins');
  const resetLimiter = limiter(limits.resetPerWindow, limits.windowMs, 'Too many reset requests. Wait a while and try again.', 'too_many_reset_requests');

  return [
    route('get', '/auth/session', access.public, (req, res) => {
      res.json({ data: sessionInfo(req, req.user) });
    }),

    route(
      'post',
      '/auth/sign-up',
      access.public,
      validate(signUpInputSchema),
      handle(async (req, res) => {
        const user = await svc.signUp(req.body);
        await logIn(req, user);
        res.status(201).json({ data: sessionInfo(req, user) });
      }),
    ),

    route('post', '/auth/sign-in', access.public, validate(signInInputSchema), signInLimiter, (req: Request, res: Response, next: NextFunction) => {
      ctx.passport.authenticate('local', (err: unknown, user: UserEntity | false, info?: { message?: string }) => {
        if (err) return next(err);
        if (!user) {
          // One message for unknown e-mail and wrong password: no account enumeration.
          const disabled = info?.message === 'disabled';
          const message = disabled ? 'This account has been disabled. Contact your programme lead or the site admin.' : 'That e-mail and password do not match an account.';
          return next(new AppError('unauthenticated', message).because(disabled ? 'account_disabled' : 'bad_credentials'));
        }
        logIn(req, user)
          .then(() => res.json({ data: sessionInfo(req, user) }))
          .catch(next);
      })(req, res, next);
    }),

    route(
      'post',
      '/auth/sign-out',
      access.public,
      handle(async (req, res) => {
        // passport's logout destroys the old session in the store and starts a fresh anonymous one,
        // which carries the CSRF token for the next sign-in.
        await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
        res.json({ data: { user: null, csrfToken: csrfTokenFor(req) } });
      }),
    ),

    route(
      'post',
      '/auth/password-reset/request',
      access.public,
      validate(requestPasswordResetInputSchema),
      resetLimiter,
      handle(async (req, res) => {
        await svc.requestPasswordReset(req.body.email);
        res.status(202).json({ data: { message: 'If an account uses that address, a reset link is on its way. It works once, for one hour.' } });
      }),
    ),

    route(
      'post',
      '/auth/password-reset/confirm',
      access.public,
      validate(resetPasswordInputSchema),
      handle(async (req, res) => {
        await svc.resetPassword(req.body.token, req.body.password);
        res.json({ data: { message: 'Your password has been changed, and every other session signed out.' } });
      }),
    ),

    route(
      'post',
      '/auth/verify-email',
      access.public,
      validate(verifyEmailInputSchema),
      handle(async (req, res) => {
        await svc.verifyEmail(req.body.token);
        res.json({ data: { message: 'Thank you: your e-mail address is confirmed.' } });
      }),
    ),

    route(
      'post',
      '/auth/verify-email/resend',
      access.signedIn,
      handle(async (req, res) => {
        await svc.resendVerification(req.user!);
        res.status(202).json({ data: { message: 'A new confirmation link is on its way.' } });
      }),
    ),

    route('get', '/account', access.signedIn, (req, res) => {
      res.json({ data: presentAccount(req.user!) });
    }),

    route(
      'patch',
      '/account',
      access.signedIn,
      validate(updateAccountInputSchema),
      handle(async (req, res) => {
        const user = await svc.updateAccount(req.user!.id, req.body);
        res.json({ data: presentAccount(user) });
      }),
    ),

    route(
      'post',
      '/account/password',
      access.signedIn,
      validate(changePasswordInputSchema),
      handle(async (req, res) => {
        const user = req.user!;
        await svc.changePassword(user, req.body.currentPassword, req.body.newPassword);
        // Every other session is now void; this one signs in afresh.
        const fresh = { ...user, sessionsValidAfter: new Date() } as UserEntity;
        await logIn(req, fresh);
        res.json({ data: sessionInfo(req, fresh) });
      }),
    ),
  ];
}
