/**
 * The `inStatement` access option and writeCheckedInStatement (server/http/access.ts, route.ts): a
 * write whose own statement applies the owner rule sends no separate check when it succeeds, and
 * every failure before the statement has settled access is answered as the up-front check would
 * answer it. Project rule (DEVELOPERS.md "Requests, errors, permissions", no outside source):
 * outsiders get 404 for a record, whatever else is wrong with their request.
 */
import express from 'express';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { access, type ResourceResolver } from '../../server/http/access';
import { handle, mountRoutes, route, writeCheckedInStatement } from '../../server/http/route';
import { AppError } from '../../server/lib/app-error';
import { createLogger } from '../../server/lib/logger';
import { errorHandler } from '../../server/middleware/error-handler';
import { validate } from '../../server/middleware/validate';

const OWNED = '11111111-1111-4111-8111-111111111111';
const OTHERS = '22222222-2222-4222-8222-222222222222';
const ds = {} as DataSource;

/** An app with one write route on `thing`; `settles` says whether the fake statement settles access as the real one does. */
function app(opts: { settles: boolean }) {
  const checks: string[] = [];
  const writes: string[] = [];
  const resolvers: Record<string, ResourceResolver> = {
    thing: async (_ds, _userId, id) => {
      checks.push(id);
      return id === OWNED ? 'owner' : null;
    },
  };
  const a = express();
  a.use(express.json());
  a.use((req, _res, next) => {
    req.user = { id: 'u1', role: 'grower' } as Express.User;
    next();
  });
  a.use(
    mountRoutes(
      [
        route(
          'post',
          '/things/:thingId/logs',
          access.owner('thing', 'thingId', { inStatement: true }),
          validate(z.object({ n: z.number() })),
          writeCheckedInStatement(async (req, gate) => {
            const id = String(req.params.thingId);
            // The real statement writes only into an owned record and settles access when it finds one.
            if (!opts.settles) writes.push(id);
            else if (id === OWNED) {
              gate.settled = true;
              writes.push(id);
            } else throw AppError.notFound('thing');
            return { status: 201, body: { data: { wrote: id } } };
          }),
        ),
      ],
      ds,
      resolvers,
    ),
  );
  a.use(errorHandler(createLogger('silent')));
  return { app: a, checks, writes };
}

describe('an inStatement owner rule', () => {
  it('sends no separate check when the statement settles access', async () => {
    const t = app({ settles: true });
    const res = await request(t.app).post(`/things/${OWNED}/logs`).send({ n: 1 });
    expect(res.status).toBe(201);
    expect(t.checks).toEqual([]);
  });

  it('answers an outsider with the check’s 404, also when the body is invalid (never the 400)', async () => {
    const t = app({ settles: true });
    const denied = await request(t.app).post(`/things/${OTHERS}/logs`).send({ n: 1 });
    expect(denied.status).toBe(404);
    expect(denied.body.error).toMatchObject({ code: 'not_found', message: 'thing was not found.' });
    const invalid = await request(t.app).post(`/things/${OTHERS}/logs`).send({ n: 'one' });
    expect(invalid.status).toBe(404);
    expect(t.checks).toEqual([OTHERS, OTHERS]);
    expect(t.writes).toEqual([]);
  });

  it('gives the owner the validation error, after the check', async () => {
    const t = app({ settles: true });
    const res = await request(t.app).post(`/things/${OWNED}/logs`).send({ n: 'one' });
    expect(res.status).toBe(400);
    expect(res.body.error.reason).toBe('invalid_fields');
    expect(t.checks).toEqual([OWNED]);
  });

  it('answers 404 for a malformed id without a check', async () => {
    const t = app({ settles: true });
    expect((await request(t.app).post('/things/nope/logs').send({ n: 1 })).status).toBe(404);
    expect(t.checks).toEqual([]);
  });

  it('still runs the check before answering when a handler forgets to settle, and sends nothing of its result to an outsider', async () => {
    const t = app({ settles: false });
    expect((await request(t.app).post(`/things/${OWNED}/logs`).send({ n: 1 })).status).toBe(201);
    const res = await request(t.app).post(`/things/${OTHERS}/logs`).send({ n: 1 });
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain('wrote');
    expect(t.checks).toEqual([OWNED, OTHERS]);
  });
});

describe('mountRoutes with an inStatement rule', () => {
  it('refuses the rule without a writeCheckedInStatement handler last, and that handler without the rule', () => {
    const rule = access.owner('trial', 'trialId', { inStatement: true });
    const write = writeCheckedInStatement(async () => ({ status: 201, body: {} }));
    expect(() => mountRoutes([route('post', '/trials/:trialId/x', rule, handle(async () => {}))], ds, {})).toThrow(/inStatement/);
    expect(() => mountRoutes([route('post', '/trials/:trialId/x', rule, write, handle(async () => {}))], ds, {})).toThrow(/inStatement/);
    expect(() => mountRoutes([route('post', '/trials/:trialId/x', access.owner('trial', 'trialId'), write)], ds, {})).toThrow(/inStatement/);
    expect(() => mountRoutes([route('post', '/trials/:trialId/x', rule, validate(z.object({})), write)], ds, {})).not.toThrow();
  });
});
