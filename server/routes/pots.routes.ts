import { z } from 'zod';
import { createPotInputSchema, createSeepTestInputSchema, updatePotInputSchema } from '@shared/schemas/pots';
import type { AppContext } from '../context';
import { access } from '../http/access';
import { handle, route, type RouteSpec } from '../http/route';
import { validate } from '../middleware/validate';
import { potsService } from '../services/pots.service';

const listPotsQuery = z.object({ trialId: z.uuid().optional() });

export function potRoutes(ctx: AppContext): RouteSpec[] {
  const svc = potsService(ctx);
  const id = (v: unknown) => String(v);
  return [
    route(
      'get',
      '/pots',
      access.signedIn,
      validate(listPotsQuery, 'query'),
      handle(async (req, res) => res.json({ data: await svc.list(req.user!.id, (res.locals.query as z.infer<typeof listPotsQuery>).trialId) })),
    ),
    route('post', '/pots', access.signedIn, validate(createPotInputSchema), handle(async (req, res) => res.status(201).json({ data: await svc.create(req.user!.id, req.body) }))),
    route('get', '/pots/:potId', access.owner('pot', 'potId'), handle(async (req, res) => res.json({ data: await svc.get(id(req.params.potId)) }))),
    route(
      'patch',
      '/pots/:potId',
      access.owner('pot', 'potId'),
      validate(updatePotInputSchema),
      handle(async (req, res) => res.json({ data: await svc.update(id(req.params.potId), req.user!.id, req.body) })),
    ),
    route(
      'delete',
      '/pots/:potId',
      access.owner('pot', 'potId'),
      handle(async (req, res) => {
        await svc.remove(id(req.params.potId));
        res.status(204).end();
      }),
    ),
    route(
      'post',
      '/pots/:potId/seep-tests',
      access.owner('pot', 'potId'),
      validate(createSeepTestInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await svc.addSeepTest(id(req.params.potId), req.body) })),
    ),
    route(
      'delete',
      '/seep-tests/:seepTestId',
      access.owner('seep-test', 'seepTestId'),
      handle(async (req, res) => {
        await svc.removeSeepTest(id(req.params.seepTestId));
        res.status(204).end();
      }),
    ),
  ];
}
