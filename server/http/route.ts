import { Router, type RequestHandler } from 'express';
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

/** Mounts every spec with its authorization check in front of its handlers. */
export function mountRoutes(specs: RouteSpec[], ds: DataSource, resolvers: Record<string, ResourceResolver>) {
  const router = Router();
  for (const spec of specs) {
    router[spec.method](spec.path, authorize(spec.access, ds, resolvers), ...spec.handlers);
  }
  return router;
}
