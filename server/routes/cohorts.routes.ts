import { z } from 'zod';
import { createCohortInputSchema, inviteInputSchema, joinCohortInputSchema, updateCohortInputSchema } from '@shared/schemas/cohorts';
import type { AppContext } from '../context';
import { access } from '../http/access';
import { handle, route, type RouteSpec } from '../http/route';
import { validate } from '../middleware/validate';
import { cohortsService } from '../services/cohorts.service';

const tokenBody = z.object({ token: z.string().min(20).max(200) });

export function cohortRoutes(ctx: AppContext): RouteSpec[] {
  const svc = cohortsService(ctx);
  const p = (v: string | string[] | undefined) => String(v);
  return [
    route('get', '/cohorts', access.signedIn, handle(async (req, res) => res.json({ data: await svc.listFor(req.user!.id) }))),
    route(
      'post',
      '/cohorts',
      access.educator,
      validate(createCohortInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await svc.create(req.user!, req.body) })),
    ),
    route(
      'post',
      '/cohorts/join',
      access.signedIn,
      validate(joinCohortInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await svc.joinByCode(req.user!, req.body.code, req.body.role) })),
    ),
    route('get', '/cohorts/:cohortId', access.cohortMember(), handle(async (req, res) => res.json({ data: await svc.get(p(req.params.cohortId), req.user!.id) }))),
    route(
      'patch',
      '/cohorts/:cohortId',
      access.cohortLead(),
      validate(updateCohortInputSchema),
      handle(async (req, res) => res.json({ data: await svc.update(p(req.params.cohortId), req.user!.id, req.body) })),
    ),
    route(
      'post',
      '/cohorts/:cohortId/join-code',
      access.cohortLead(),
      handle(async (req, res) => res.json({ data: await svc.rotateJoinCode(p(req.params.cohortId), req.user!.id) })),
    ),
    route('get', '/cohorts/:cohortId/members', access.cohortMember(), handle(async (req, res) => res.json({ data: await svc.members(p(req.params.cohortId), req.user!.id) }))),
    route(
      'delete',
      '/cohorts/:cohortId/members/:membershipId',
      access.cohortLead(),
      handle(async (req, res) => {
        await svc.removeMember(p(req.params.cohortId), p(req.params.membershipId));
        res.status(204).end();
      }),
    ),
    route(
      'post',
      '/cohorts/:cohortId/leave',
      access.cohortMember(),
      handle(async (req, res) => {
        await svc.leave(p(req.params.cohortId), req.user!.id);
        res.status(204).end();
      }),
    ),
    route('get', '/cohorts/:cohortId/invitations', access.cohortLead(), handle(async (req, res) => res.json({ data: await svc.listInvitations(p(req.params.cohortId)) }))),
    route(
      'post',
      '/cohorts/:cohortId/invitations',
      access.cohortLead(),
      validate(inviteInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await svc.invite(p(req.params.cohortId), req.user!, req.body.email, req.body.role) })),
    ),
    route(
      'post',
      '/invitations/preview',
      access.public,
      validate(tokenBody),
      handle(async (req, res) => res.json({ data: await svc.previewInvitation(req.body.token) })),
    ),
    route(
      'post',
      '/invitations/accept',
      access.signedIn,
      validate(tokenBody),
      handle(async (req, res) => res.status(201).json({ data: await svc.acceptInvitation(req.user!, req.body.token) })),
    ),
  ];
}
