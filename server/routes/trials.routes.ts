import { z } from 'zod';
import { createPlotInputSchema, updatePlotInputSchema } from '@shared/schemas/plots';
import { createTrialInputSchema, randomiseInputSchema, shareTrialInputSchema, trialStatusInputSchema, updateTrialInputSchema } from '@shared/schemas/trials';
import type { AppContext } from '../context';
import { access } from '../http/access';
import { handle, respondAfterAccess, route, type RouteSpec } from '../http/route';
import { validate } from '../middleware/validate';
import { analysisService } from '../services/analysis.service';
import { trialsService } from '../services/trials.service';

const listTrialsQuery = z.object({ gardenId: z.uuid().optional() });
const cohortParam = z.object({ trialId: z.uuid(), cohortId: z.uuid() });

export function trialRoutes(ctx: AppContext): RouteSpec[] {
  const svc = trialsService(ctx);
  const analysis = analysisService(ctx);
  const id = (v: unknown) => String(v);
  return [
    route(
      'get',
      '/trials',
      access.signedIn,
      validate(listTrialsQuery, 'query'),
      handle(async (req, res) => res.json({ data: await svc.list(req.user!.id, (res.locals.query as z.infer<typeof listTrialsQuery>).gardenId) })),
    ),
    route(
      'post',
      '/gardens/:gardenId/trials',
      access.owner('garden', 'gardenId'),
      validate(createTrialInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await svc.create(id(req.params.gardenId), req.user!.id, req.body) })),
    ),
    route(
      'get',
      '/trials/:trialId',
      access.reader('trial', 'trialId'),
      handle(async (req, res) => res.json({ data: await svc.get(id(req.params.trialId), res.locals.accessLevel) })),
    ),
    route(
      'patch',
      '/trials/:trialId',
      access.owner('trial', 'trialId'),
      validate(updateTrialInputSchema),
      handle(async (req, res) => res.json({ data: await svc.update(id(req.params.trialId), req.user!.id, req.body) })),
    ),
    route(
      'delete',
      '/trials/:trialId',
      access.owner('trial', 'trialId'),
      handle(async (req, res) => {
        await svc.remove(id(req.params.trialId));
        res.status(204).end();
      }),
    ),
    route(
      'post',
      '/trials/:trialId/status',
      access.owner('trial', 'trialId'),
      validate(trialStatusInputSchema),
      handle(async (req, res) => res.json({ data: await svc.setStatus(id(req.params.trialId), req.user!.id, req.body.status) })),
    ),
    route(
      'get',
      '/trials/:trialId/analysis',
      // The aggregates start while the access check runs; nothing is sent unless it passes.
      access.reader('trial', 'trialId', { concurrent: true }),
      respondAfterAccess((req) => analysis.forTrial(id(req.params.trialId))),
    ),
    route('get', '/trials/:trialId/audit', access.owner('trial', 'trialId'), handle(async (req, res) => res.json({ data: await svc.auditTrail(id(req.params.trialId)) }))),
    route('get', '/trials/:trialId/plots', access.reader('trial', 'trialId'), handle(async (req, res) => res.json({ data: await svc.listPlots(id(req.params.trialId)) }))),
    route(
      'post',
      '/trials/:trialId/plots',
      access.owner('trial', 'trialId'),
      validate(createPlotInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await svc.createPlot(id(req.params.trialId), req.user!.id, req.body) })),
    ),
    route(
      'patch',
      '/plots/:plotId',
      access.owner('plot', 'plotId'),
      validate(updatePlotInputSchema),
      handle(async (req, res) => res.json({ data: await svc.updatePlot(id(req.params.plotId), req.user!.id, req.body) })),
    ),
    route(
      'delete',
      '/plots/:plotId',
      access.owner('plot', 'plotId'),
      handle(async (req, res) => {
        await svc.removePlot(id(req.params.plotId), req.user!.id);
        res.status(204).end();
      }),
    ),
    route(
      'post',
      '/trials/:trialId/randomise',
      access.owner('trial', 'trialId'),
      validate(randomiseInputSchema),
      handle(async (req, res) => res.json({ data: await svc.randomise(id(req.params.trialId), req.user!.id, req.body.seed) })),
    ),
    route('get', '/trials/:trialId/shares', access.owner('trial', 'trialId'), handle(async (req, res) => res.json({ data: await svc.listShares(id(req.params.trialId)) }))),
    route(
      'post',
      '/trials/:trialId/shares',
      access.owner('trial', 'trialId'),
      validate(shareTrialInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await svc.share(id(req.params.trialId), req.user!.id, req.body.cohortId) })),
    ),
    route(
      'delete',
      '/trials/:trialId/shares/:cohortId',
      access.owner('trial', 'trialId'),
      validate(cohortParam, 'params'),
      handle(async (req, res) => res.json({ data: await svc.withdraw(id(req.params.trialId), id(req.params.cohortId)) })),
    ),
  ];
}
