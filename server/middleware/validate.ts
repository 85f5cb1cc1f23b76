import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { AppError } from '../lib/app-error';

type Part = 'body' | 'query' | 'params';

/** What the client needs to word an issue itself: zod's code and the limits it names (shared/api-error.ts `fieldIssueSchema`). */
function issueFacts(i: z.core.$ZodIssue): Record<string, string | number | boolean> & { code: string } {
  const facts: Record<string, string | number | boolean> & { code: string } = { code: i.code };
  for (const k of ['origin', 'minimum', 'maximum', 'inclusive', 'format', 'expected', 'divisor'] as const) {
    const v = (i as unknown as Record<string, unknown>)[k];
    if (typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean') facts[k] = v;
    else if (typeof v === 'bigint') facts[k] = Number(v);
    else if (v instanceof Date) facts[k] = v.toISOString();
  }
  return facts;
}

/** Turns zod issues into `{ path, message, issue }` for field-level messages. */
export function zodIssues(error: z.ZodError) {
  return error.issues.map((i) => {
    // A schema's own check may name its case (`params: { reason }`), worded by the client like a service's field reason.
    const reason = i.code === 'custom' && typeof i.params?.reason === 'string' ? i.params.reason : undefined;
    return { path: i.path.map(String).join('.'), message: i.message, ...(reason ? { reason } : {}), issue: issueFacts(i) };
  });
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
      next(AppError.validation('Some fields need attention.', zodIssues(result.error)).because('invalid_fields'));
      return;
    }
    if (part === 'query') res.locals.query = result.data;
    else if (part === 'params') res.locals.params = result.data;
    else req.body = result.data;
    next();
  };
}
