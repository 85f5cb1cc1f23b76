/**
 * respondAfterAccess and the `concurrent` access option (server/http/route.ts, access.ts): the read
 * starts while the access check runs, and nothing of it is sent unless the check passes.
 * Project rule (no source): a route's access check decides what is sent, whatever runs beside it.
 */
import type { NextFunction, Request, Response } from 'express';
import type { DataSource } from 'typeorm';
import { describe, expect, it } from 'vitest';
import { access } from '../../server/http/access';
import { handle, mountRoutes, respondAfterAccess, route } from '../../server/http/route';

function fakeResponse(accessChecked?: Promise<void>) {
  const sent: unknown[] = [];
  const res = { locals: { accessChecked }, json: (body: unknown) => sent.push(body) } as unknown as Response;
  return { res, sent };
}
const run = (handler: ReturnType<typeof respondAfterAccess>, res: Response) =>
  new Promise<unknown>((resolve) => {
    const next = ((err?: unknown) => resolve(err)) as NextFunction;
    handler({} as Request, res, next);
    // A handler that answers calls res.json; one that fails calls next.
    setTimeout(() => resolve('no next'), 50);
  });

describe('respondAfterAccess', () => {
  it('sends the read only after the access check passes', async () => {
    let pass!: () => void;
    const checked = new Promise<void>((resolve) => (pass = resolve));
    const { res, sent } = fakeResponse(checked);
    const done = run(respondAfterAccess(async () => ({ secret: 1 })), res);
    await new Promise((r) => setTimeout(r, 10));
    expect(sent).toEqual([]); // the read is done, the check is not: nothing sent yet
    pass();
    expect(await done).toBe('no next');
    expect(sent).toEqual([{ data: { secret: 1 } }]);
  });

  it('answers a failed check with its error and never sends the read, even when the read fails too', async () => {
    const denied = new Error('not found');
    for (const read of [async () => ({ secret: 1 }), async () => Promise.reject(new Error('read failed'))]) {
      const { res, sent } = fakeResponse(Promise.reject(denied));
      expect(await run(respondAfterAccess(read), res)).toBe(denied);
      expect(sent).toEqual([]);
    }
  });

  it('passes a failed read on once the check has passed', async () => {
    const failed = new Error('read failed');
    const { res, sent } = fakeResponse(Promise.resolve());
    expect(await run(respondAfterAccess(async () => Promise.reject(failed)), res)).toBe(failed);
    expect(sent).toEqual([]);
  });
});

describe('mountRoutes with a concurrent access check', () => {
  it('refuses any handler but a single respondAfterAccess', () => {
    const ds = {} as DataSource;
    const rule = access.reader('trial', 'trialId', { concurrent: true });
    expect(() => mountRoutes([route('get', '/trials/:trialId/x', rule, handle(async () => {}))], ds, {})).toThrow(/respondAfterAccess/);
    expect(() => mountRoutes([route('get', '/trials/:trialId/x', rule, respondAfterAccess(async () => 1), handle(async () => {}))], ds, {})).toThrow(/respondAfterAccess/);
    expect(() => mountRoutes([route('get', '/trials/:trialId/x', rule, respondAfterAccess(async () => 1))], ds, {})).not.toThrow();
  });
});
