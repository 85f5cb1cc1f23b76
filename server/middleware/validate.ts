import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { AppError } from '../lib/app-error';

type Part = 'body' | 'query' | 'params';

/** Turns zod issues into `{ path, message }` pairs for field-level messages. */
export function zodIssues(error: z.ZodError) {
  return error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
}

/**
 * Validates one part of the request with a shared zod schema and replaces it with the parsed
 * value (defaults applied, unknown keys stripped). Parsed query lands on `res.locals.query`
 * because Express 5 makes `req.query` read-only.
 */
export function validate<S extends z.ZodType>(schema: S, part: Part = 'body'): RequestHandler {
  return (req, res, next) => {
    const result = schema.safeParse(req[part]);
    if (!result.success) {
      next(AppError.validation('Some fields need attention.', zodIssues(result.error)));
      return;
    }
    if (part === 'query') res.locals.query = result.data;
    else if (part === 'params') res.locals.params = result.data;
    else req.body = result.data;
    next();
  };
}
