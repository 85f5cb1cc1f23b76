import { Router, type Request, type RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import { authorize, type Access, type ResourceResolver } from './access';

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
    router[spec.method](spec.path, authorize(spec.access, ds, resolvers), ...spec.handlers);
  }
  return router;
}
