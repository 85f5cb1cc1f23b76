import compression from 'compression';
import type { Request, RequestHandler, Response } from 'express';
import { constants } from 'node:zlib';

const contentType = (res: Response) => String(res.getHeader('Content-Type') ?? '').toLowerCase();
const isCsv = (res: Response) => contentType(res).startsWith('text/csv');
/** The API's JSON: built per request, so its compression is paid on every response (nothing to cache). */
const isJson = (res: Response) => contentType(res).startsWith('application/json');
/** Server-sent events must reach the client as each one is written: never through a compressor's buffer. */
const isEventStream = (res: Response) => contentType(res).startsWith('text/event-stream');

/**
 * Brotli, gzip or deflate (whichever the client prefers) for text responses — the built client's HTML, JS, CSS and manifest, the API's
 * JSON, CSV exports — when the client accepts it, via the `compression` middleware. Its own filter
 * decides by Content-Type (compressible types only: images, zip bundles and uploads pass as they
 * are), skips bodies under 1 kB and responses marked `Cache-Control: no-transform`.
 *
 * CSV exports stream from `COPY ... TO STDOUT` (server/services/export.service.ts): the compressor
 * is a stream in between, so back-pressure still reaches PostgreSQL and memory stays flat; they use
 * the fastest levels (gzip 1, brotli 1), because one export is tens of MB and the CPU is shared with everything else
 * (level 1 still shrinks CSV several times over). The API's JSON uses the same fast levels: it is
 * compressed afresh on every request, and on a large answer (a 500-trial cohort's results) gzip 6
 * cost about three times the CPU of gzip 1 for a body only about 10 % smaller (bench/FINDINGS.md,
 * section 2). Everything else — the built client's HTML, JS, CSS and manifest — keeps the
 * middleware's defaults (gzip 6, brotli 4): those bytes go to every first visit.
 */
export function compressResponses(): RequestHandler {
  const fast = compression({ level: constants.Z_BEST_SPEED, brotli: { params: { [constants.BROTLI_PARAM_QUALITY]: 1 } }, filter: (req: Request, res: Response) => (isCsv(res) || isJson(res)) && compression.filter(req, res) });
  const standard = compression({ filter: (req: Request, res: Response) => !isCsv(res) && !isJson(res) && !isEventStream(res) && compression.filter(req, res) });
  // Both wrap the response; their filters, run when the headers go out, pick at most one.
  return (req, res, next) => fast(req, res, (err?: unknown) => (err ? next(err) : standard(req, res, next)));
}
