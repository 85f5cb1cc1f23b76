import type { RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import { AppError } from '../lib/app-error';

/**
 * Who may call a route. Every API route declares one of these in its route spec; the
 * permission-matrix test reads the same specs.
 *
 * - public: anyone, signed in or not.
 * - signed-in: any signed-in account.
 * - role: signed-in with one of the roles (others get 403).
 * - cohort-lead / cohort-member: the route's `:cohortId` names a cohort the caller leads / belongs
 *   to (lead, contributor or observer). Outsiders get 404, so a cohort's existence is not revealed.
 * - resource with `concurrent`: the same check and the same answers, but the route's read starts
 *   while the check runs (one round trip less before the answer). Only for a handler made with
 *   `respondAfterAccess` (server/http/route.ts; mountRoutes refuses anything else), which sends
 *   nothing of its result unless the check passed, and answers a failed check at once.
 * - resource with `inStatement`: the handler's own SQL statement applies the same rule (an INSERT
 *   that writes only where the caller owns the record), so a request that succeeds sends no
 *   separate check first. Only for a handler made with `writeCheckedInStatement` (route.ts;
 *   mountRoutes refuses anything else). 401 and malformed ids are answered here as always, and any
 *   failure before the handler has settled access (a validation error, the statement finding no
 *   record it may write) is answered only after the usual check: an outsider gets the same 404 as
 *   with a check up front, never a 400 that would confirm the record exists.
 */
export type Access =
  | { kind: 'public' }
  | { kind: 'signed-in' }
  | { kind: 'role'; roles: ('grower' | 'educator' | 'admin')[] }
  | { kind: 'cohort-lead'; param: string }
  | { kind: 'cohort-member'; param: string }
  | { kind: 'resource'; resource: ResourceKind; param: string; level: 'owner' | 'reader'; concurrent?: true; inStatement?: true };

/**
 * An `inStatement` access check handed to the handler: it sets `settled` once its statement has
 * shown the caller may write there; until then every failure is answered after `check()`, the
 * check the rule would have run up front.
 */
export interface AccessGate {
  settled: boolean;
  check: () => Promise<void>;
}

/** Resources owned by a grower (filled in by the notebook: garden, trial, plot, pot...). */
export type ResourceKind = string;

/**
 * Resolves whether a user may reach a resource: 'owner' for the owner, 'reader' when it can be
 * read through a cohort, null otherwise. Registered by the features that own the tables.
 */
export type ResourceResolver = (ds: DataSource, userId: string, id: string) => Promise<'owner' | 'reader' | null>;

export const access = {
  public: { kind: 'public' } as Access,
  signedIn: { kind: 'signed-in' } as Access,
  admin: { kind: 'role', roles: ['admin'] } as Access,
  educator: { kind: 'role', roles: ['educator', 'admin'] } as Access,
  cohortLead: (param = 'cohortId'): Access => ({ kind: 'cohort-lead', param }),
  cohortMember: (param = 'cohortId'): Access => ({ kind: 'cohort-member', param }),
  owner: (resource: ResourceKind, param: string, opts: { inStatement?: boolean } = {}): Access => ({
    kind: 'resource',
    resource,
    param,
    level: 'owner',
    ...(opts.inStatement ? { inStatement: true as const } : {}),
  }),
  reader: (resource: ResourceKind, param: string, opts: { concurrent?: boolean } = {}): Access => ({
    kind: 'resource',
    resource,
    param,
    level: 'reader',
    ...(opts.concurrent ? { concurrent: true as const } : {}),
  }),
};

const uuidRe = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function authorize(rule: Access, ds: DataSource, resolvers: Record<string, ResourceResolver>): RequestHandler {
  return (req, res, next) => {
    if (rule.kind === 'public') return next();
    const user = req.user;
    if (!user) return next(new AppError('unauthenticated', 'Please sign in to do that.').because('sign_in_required'));
    if (rule.kind === 'signed-in') return next();
    if (rule.kind === 'role') {
      return rule.roles.includes(user.role) ? next() : next(AppError.forbidden('Your account role cannot do that.').because('role_not_allowed'));
    }
    const id = req.params[rule.param];
    const what = rule.kind === 'resource' ? rule.resource : 'Cohort';
    if (typeof id !== 'string' || !uuidRe.test(id)) return next(AppError.notFound(what));
    const check = async () => {
      if (rule.kind === 'cohort-lead' || rule.kind === 'cohort-member') {
        const rows = (await ds.query(
          `SELECT c.lead_id = $2 AS is_lead, m.role AS member_role
             FROM cohorts c LEFT JOIN cohort_memberships m ON m.cohort_id = c.id AND m.user_id = $2
            WHERE c.id = $1`,
          [id, user.id],
        )) as { is_lead: boolean; member_role: string | null }[];
        const row = rows[0];
        const ok = row && (row.is_lead || (rule.kind === 'cohort-member' && row.member_role !== null));
        if (!ok) throw AppError.notFound('Cohort');
        res.locals.cohortRole = row.is_lead ? 'lead' : row.member_role;
        return;
      }
      const resolver = resolvers[rule.resource];
      if (!resolver) throw new Error(`No access resolver for ${rule.resource}`);
      const level = await resolver(ds, user.id, id);
      if (!level || (rule.level === 'owner' && level !== 'owner')) throw AppError.notFound(rule.resource);
      res.locals.accessLevel = level;
    };
    if (rule.kind === 'resource' && rule.inStatement) {
      // The handler's statement checks; settleAccess (route.ts) runs `check` if it fails before that.
      const gate: AccessGate = { settled: false, check };
      res.locals.accessGate = gate;
      return next();
    }
    if (rule.kind === 'resource' && rule.concurrent) {
      // The handler (respondAfterAccess) awaits this before it answers; a failure is answered there.
      const checked = check();
      checked.catch(() => {});
      res.locals.accessChecked = checked;
      return next();
    }
    check().then(() => next(), next);
  };
}
