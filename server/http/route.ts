import { Router, type ErrorRequestHandler, type Request, type RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import { authorize, type Access, type AccessGate, type ResourceResolver } from './access';

export type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';

/** One API route: method, path (under /api), who may call it, and its handlers. */
export interface RouteSpec {
  method: Method;
  path: string;
  access: Access;
  handlers: RequestHandler[];
}

export function route(method: Method, path: string, rule: Access, ...handlers: RequestHandler[]): RouteSpec {
  return { method, path, access: rule, handlers };
}

/** Wraps an async handler so a rejection reaches the error middleware. */
export function handle(fn: (...args: Parameters<RequestHandler>) => Promise<unknown>): RequestHandler {
  return (req, res, next) => {
    fn(req, res, next).catch(next);
  };
}

const AFTER_ACCESS = Symbol('respondAfterAccess');

/**
 * A GET handler that starts its read while a `concurrent` access check runs (access.ts), and
 * answers `{ data }` only once the check has passed. A failed check is answered at once, as the
 * check would have answered it, and the read's result (or error) is dropped. `read` gets the request
 * only, so it cannot send anything itself.
 */
export function respondAfterAccess(read: (req: Request) => Promise<unknown>): RequestHandler {
  const handler: RequestHandler = (req, res, next) => {
    const work = Promise.resolve().then(() => read(req));
    work.catch(() => {});
    const checked = (res.locals.accessChecked as Promise<void> | undefined) ?? Promise.resolve();
    checked
      .then(() => work)
      .then((data) => void res.json({ data }))
      .catch(next);
  };
  return Object.assign(handler, { [AFTER_ACCESS]: true });
}

const IN_STATEMENT = Symbol('writeCheckedInStatement');

/**
 * The last handler of a route whose access rule is `inStatement` (access.ts). `write` runs a
 * statement that writes only where the rule allows and sets `gate.settled` once that statement has
 * shown the caller may write there; a failure before that is answered after the usual check
 * (settleAccess). Should `write` return without settling, the usual check still runs before
 * anything is sent.
 */
export function writeCheckedInStatement(write: (req: Request, gate: AccessGate) => Promise<{ status: number; body: unknown }>): RequestHandler {
  const handler: RequestHandler = (req, res, next) => {
    const gate = res.locals.accessGate as AccessGate | undefined;
    if (!gate) return next(new Error(`${req.method} ${req.path}: writeCheckedInStatement needs an inStatement access rule`));
    write(req, gate)
      .then(async (out) => {
        if (!gate.settled) {
          gate.settled = true;
          await gate.check();
        }
        res.status(out.status).json(out.body);
      })
      .catch(next);
  };
  return Object.assign(handler, { [IN_STATEMENT]: true });
}

/** Behind an inStatement route's handlers: a failure before access was settled is answered as the usual check answers. */
const settleAccess: ErrorRequestHandler = (err, _req, res, next) => {
  const gate = res.locals.accessGate as AccessGate | undefined;
  if (!gate || gate.settled) return next(err);
  gate.settled = true;
  gate.check().then(() => next(err), next);
};

/** Mounts every spec with its authorization check in front of its handlers. */
export function mountRoutes(specs: RouteSpec[], ds: DataSource, resolvers: Record<string, ResourceResolver>) {
  const router = Router();
  for (const spec of specs) {
    if (spec.access.kind === 'resource' && spec.access.concurrent) {
      const [only, ...rest] = spec.handlers;
      if (rest.length || !only || !(AFTER_ACCESS in only)) {
        throw new Error(`${spec.method.toUpperCase()} ${spec.path}: a concurrent access check needs a single respondAfterAccess handler`);
      }
    }
    const inStatement = spec.access.kind === 'resource' && spec.access.inStatement === true;
    const last = spec.handlers.at(-1);
    if (inStatement !== Boolean(last && IN_STATEMENT in last) || spec.handlers.slice(0, -1).some((h) => IN_STATEMENT in h)) {
      throw new Error(`${spec.method.toUpperCase()} ${spec.path}: an inStatement access rule and a writeCheckedInStatement handler (last) go together`);
    }
    router[spec.method](spec.path, authorize(spec.access, ds, resolvers), ...spec.handlers, ...(inStatement ? [settleAccess] : []));
  }
  return router;
}
