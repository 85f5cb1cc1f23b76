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
 * (level 1 still shrinks CSV several times over).
 *
 * API JSON is built per request, so its compression is paid on every response: gzip 4 and brotli 1.
 * Measured on the trial analysis response (128 KB, benchmark figure 1, bench/FINDINGS.md §1): gzip 6
 * took 5.2 ms for 23.8 KB, gzip 4 1.2 ms for 26.1 KB; brotli 4 1.7 ms for 23.2 KB, brotli 3 1.0 ms
 * for 23.8 KB. On a 500-trial cohort's results (1.25 MB, figure 2, §2 session 3; medians on a loaded
 * machine): gzip 6 34 ms for 308 KB, gzip 4 23 ms for 327 KB, gzip 1 20 ms for 344 KB; brotli 4
 * 29 ms for 231 KB, brotli 3 19 ms for 260 KB, brotli 1 8 ms for 277 KB. Everything else (the built
 * client's files, HTML) keeps the middleware's defaults (gzip 6, brotli 4).
 */
export function compressResponses(): RequestHandler {
  const fast = compression({ level: constants.Z_BEST_SPEED, brotli: { params: { [constants.BROTLI_PARAM_QUALITY]: 1 } }, filter: (req: Request, res: Response) => isCsv(res) && compression.filter(req, res) });
  const json = compression({ level: 4, brotli: { params: { [constants.BROTLI_PARAM_QUALITY]: 1 } }, filter: (req: Request, res: Response) => isJson(res) && compression.filter(req, res) });
  const standard = compression({ filter: (req: Request, res: Response) => !isCsv(res) && !isJson(res) && !isEventStream(res) && compression.filter(req, res) });
  // All three wrap the response; their filters, run when the headers go out, pick at most one.
  return (req, res, next) =>
    fast(req, res, (err?: unknown) => (err ? next(err) : json(req, res, (err2?: unknown) => (err2 ? next(err2) : standard(req, res, next)))));
}
