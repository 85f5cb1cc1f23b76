import multer from 'multer';
import { listLogsQuerySchema, roundInputSchema, type ListLogsQuery, type LogKind } from '@shared/schemas/logs';
import type { AppContext } from '../context';
import { access } from '../http/access';
import { handle, route, writeCheckedInStatement, type RouteSpec } from '../http/route';
import { AppError } from '../lib/app-error';
import { validate } from '../middleware/validate';
import { logKinds, logsService } from '../services/logs.service';
import { PHOTO_MAX_BYTES, photosService } from '../services/photos.service';
import { roundService } from '../services/round.service';

/** The resource kind (for access checks) and URL parameter of a single log of each kind. */
const single: Record<LogKind, { resource: string; param: string }> = {
  'water-events': { resource: 'water-event', param: 'waterEventId' },
  'moisture-readings': { resource: 'moisture-reading', param: 'moistureReadingId' },
  harvests: { resource: 'harvest', param: 'harvestId' },
  observations: { resource: 'observation', param: 'observationId' },
};

/**
 * multer and busboy fail on the request itself (wrong field, two files, too many fields, a broken
 * multipart body, a NUL in a part header): a 400, not a 500. Size stays a 413 (error handler).
 */
function uploadError(err: unknown) {
  if (!err || (err as { code?: string }).code === 'LIMIT_FILE_SIZE') return err;
  return AppError.validation(`The upload could not be read (${(err as Error).message ?? 'malformed form'}). Send one image in the "photo" field.`).because('upload_unreadable');
}

export function logRoutes(ctx: AppContext): RouteSpec[] {
  const svc = logsService(ctx);
  const round = roundService(ctx);
  const photos = photosService(ctx);
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: PHOTO_MAX_BYTES, files: 1, fields: 5 } }).single('photo');
  const id = (v: unknown) => String(v);

  const perKind = (Object.keys(logKinds) as LogKind[]).flatMap((kind): RouteSpec[] => {
    const { resource, param } = single[kind];
    return [
      route(
        'get',
        `/trials/:trialId/${kind}`,
        access.reader('trial', 'trialId'),
        validate(listLogsQuerySchema, 'query'),
        handle(async (req, res) => {
          const { rows, meta } = await svc.list(kind, id(req.params.trialId), res.locals.query as ListLogsQuery);
          res.json({ data: rows, meta });
        }),
      ),
      route(
        'post',
        `/trials/:trialId/${kind}`,
        // The INSERT itself writes only into the caller's own trial (one statement; access.ts `inStatement`).
        access.owner('trial', 'trialId', { inStatement: true }),
        validate(logKinds[kind].schema),
        writeCheckedInStatement(async (req, gate) => {
          const { row, created } = await svc.create(kind, id(req.params.trialId), req.user!.id, req.body, gate);
          return { status: created ? 201 : 200, body: { data: row, meta: { created } } };
        }),
      ),
      route(
        'patch',
        `/${kind}/:${param}`,
        access.owner(resource, param),
        handle(async (req, res) => {
          if (typeof req.body !== 'object' || req.body === null || Array.isArray(req.body)) throw AppError.validation('Send the fields to change as a JSON object.').because('json_object_required');
          res.json({ data: await svc.update(kind, id(req.params[param]), req.user!.id, req.body as Record<string, unknown>) });
        }),
      ),
      route(
        'delete',
        `/${kind}/:${param}`,
        access.owner(resource, param),
        handle(async (req, res) => {
          await svc.remove(kind, id(req.params[param]), req.user!.id);
          res.status(204).end();
        }),
      ),
    ];
  });

  return [
    ...perKind,
    route('get', '/trials/:trialId/round', access.owner('trial', 'trialId'), handle(async (req, res) => res.json({ data: await round.get(id(req.params.trialId)) }))),
    route(
      'post',
      '/trials/:trialId/round',
      access.owner('trial', 'trialId'),
      validate(roundInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await round.save(id(req.params.trialId), req.user!.id, req.body) })),
    ),
    route(
      'get',
      '/observations/:observationId/photos',
      access.reader('observation', 'observationId'),
      handle(async (req, res) => res.json({ data: await photos.list(id(req.params.observationId)) })),
    ),
    route(
      'post',
      '/observations/:observationId/photos',
      access.owner('observation', 'observationId'),
      (req, res, next) => upload(req, res, (err: unknown) => next(uploadError(err))),
      handle(async (req, res) => {
        if (!req.file) throw AppError.validation('Attach a photo in the "photo" field.').because('photo_missing');
        res.status(201).json({ data: await photos.add(id(req.params.observationId), req.file.buffer) });
      }),
    ),
    route(
      'get',
      '/photos/:photoId',
      access.reader('photo', 'photoId'),
      handle(async (req, res) => {
        const p = await photos.open(id(req.params.photoId));
        res.setHeader('Content-Type', p.contentType);
        res.setHeader('Content-Length', String(p.bytes));
        res.setHeader('Content-Disposition', 'inline');
        res.setHeader('Cache-Control', 'private, max-age=3600');
        p.body.pipe(res);
      }),
    ),
    route(
      'delete',
      '/photos/:photoId',
      access.owner('photo', 'photoId'),
      handle(async (req, res) => {
        await photos.remove(id(req.params.photoId));
        res.status(204).end();
      }),
    ),
  ];
}
