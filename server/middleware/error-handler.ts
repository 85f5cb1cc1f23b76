import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AnalysisInputError } from '@shared/analysis/input-error';
import { AppError } from '../lib/app-error';
import type { Logger } from '../lib/logger';

/** PostgreSQL error codes that mean "the database is not reachable right now". */
const unavailableCodes = new Set(['57P01', '57P02', '57P03', '08000', '08003', '08006', '08001', 'ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ECONNABORTED', 'ENOTCONN']);

function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as { code?: string; message?: string; driverError?: { code?: string } } | null;
  if (!e) return false;
  const code = e.code ?? e.driverError?.code;
  if (code && unavailableCodes.has(code)) return true;
  // pg's own words when a pooled client's socket died under it (no code on these).
  return /Connection terminated|connect ECONNREFUSED|the database system is (starting up|shutting down)|is not queryable/i.test(e.message ?? '');
}

/**
 * The database is up but every connection is taken: pg-pool gave up waiting for a free client
 * (`connectionTimeoutMillis`, server/db/data-source.ts), the server refuses new connections
 * (53300 too_many_connections) or a connection attempt timed out. Nothing was done; a retry soon
 * is the right answer, so this is a 503 with Retry-After, not a 500.
 */
const busyCodes = new Set(['53300', 'ETIMEDOUT']);

function isDatabaseBusy(err: unknown): boolean {
  const e = err as { code?: string; message?: string; driverError?: { code?: string } } | null;
  if (!e) return false;
  const code = e.code ?? e.driverError?.code;
  if (code && busyCodes.has(code)) return true;
  return /timeout exceeded when trying to connect|sorry, too many clients already/i.test(e.message ?? '');
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', `No API route for ${req.method} ${req.path}.`));
};

export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) {
      logger.error({ err, path: req.path }, 'error after response started');
      res.destroy();
      return;
    }
    if (err instanceof AppError) {
      res.status(err.status).json({ error: { code: err.code, message: err.message, reason: err.reason, params: err.params, details: err.details } });
      return;
    }
    if (err instanceof AnalysisInputError) {
      res.status(400).json({ error: { code: 'validation_failed', message: err.message } });
      return;
    }
    // body-parser and multer errors carry a status and a type.
    const e = err as { status?: number; statusCode?: number; type?: string; code?: string; message?: string };
    const status = e.status ?? e.statusCode;
    if (e.type === 'entity.too.large' || e.code === 'LIMIT_FILE_SIZE') {
      res.status(413).json({ error: { code: 'payload_too_large', message: 'The request is larger than allowed.', reason: 'request_too_large' } });
      return;
    }
    if (e.type === 'entity.parse.failed') {
      res.status(400).json({ error: { code: 'validation_failed', message: 'The request body is not valid JSON.', reason: 'invalid_json' } });
      return;
    }
    if (status && status >= 400 && status < 500) {
      res.status(status).json({ error: { code: 'validation_failed', message: e.message ?? 'Bad request.' } });
      return;
    }
    if (isDatabaseUnavailable(err)) {
      logger.warn({ err: e.message, path: req.path }, 'database unavailable');
      res.setHeader('Retry-After', '5');
      res.status(503).json({
        error: { code: 'service_unavailable', message: 'The database is not reachable right now. Nothing was saved; please try again in a few seconds.' },
      });
      return;
    }
    if (isDatabaseBusy(err)) {
      logger.warn({ err: e.message, path: req.path }, 'database busy');
      res.setHeader('Retry-After', '5');
      res.status(503).json({
        error: {
          code: 'service_unavailable',
          reason: 'database_busy',
          message: 'Seepwise is very busy right now. Nothing was saved; please try again in a few seconds.',
        },
      });
      return;
    }
    logger.error({ err, path: req.path, method: req.method }, 'unhandled error');
    res.status(500).json({ error: { code: 'internal_error', message: 'Something went wrong on our side. It has been logged.' } });
  };
}
