import { cohortResultsQuerySchema, createExclusionInputSchema, exclusionParamsSchema, type CohortResultsQuery } from '@shared/schemas/cohort-results';
import type { AppContext } from '../context';
import { access } from '../http/access';
import { handle, route, type RouteSpec } from '../http/route';
import { validate } from '../middleware/validate';
import { cohortResultsService } from '../services/cohort-results.service';

export function cohortResultRoutes(ctx: AppContext): RouteSpec[] {
  const svc = cohortResultsService(ctx);
  const id = (v: unknown) => String(v);
  return [
    // Lead, contributors and observers all see the same pseudonymised page.
    route(
      'get',
      '/cohorts/:cohortId/results',
      access.cohortMember(),
      validate(cohortResultsQuerySchema, 'query'),
      handle(async (req, res) => res.json({ data: await svc.results(id(req.params.cohortId), req.user!.id, res.locals.query as CohortResultsQuery) })),
    ),
    route(
      'post',
      '/cohorts/:cohortId/exclusions',
      access.cohortLead(),
      validate(createExclusionInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await svc.exclude(id(req.params.cohortId), req.user!.id, req.body) })),
    ),
    route(
      'delete',
      '/cohorts/:cohortId/exclusions/:trialId',
      access.cohortLead(),
      validate(exclusionParamsSchema, 'params'),
      handle(async (req, res) => {
        await svc.include(id(req.params.cohortId), id(req.params.trialId));
        res.status(204).end();
      }),
    ),
  ];
}
