/**
 * Every connection in the app's pool taken (a burst of slow requests, a long report): a request
 * that cannot get one within `connectionTimeoutMillis` (5 s, server/db/data-source.ts) is refused
 * with 503 + Retry-After and a reason the client words ("very busy, nothing was saved"), not a 500
 * that says something broke. Once a connection is free again the same request succeeds.
 */
import type pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('a busy database', () => {
  it('refuses with 503 + Retry-After while no connection is free, and answers again once one is', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const created = await a.post('/api/gardens', { name: 'Huerta del pozo', latitudeDeg: 31.4, longitudeDeg: -110.2, elevationM: 1200, soilTexture: 'sandy_loam' });
    expect(created.status).toBe(201);

    // Take every connection of the app's pool (startTestApp: poolSize 5).
    // TypeORM's postgres driver keeps its pg.Pool as `master`.
    const pool = (t.ds.driver as unknown as { master: pg.Pool }).master;
    const held: pg.PoolClient[] = [];
    for (let i = 0; i < 5; i++) held.push(await pool.connect());
    expect(pool.idleCount).toBe(0);
    let busy;
    try {
      busy = await a.post('/api/gardens', { name: 'Second bed', latitudeDeg: 31.4, longitudeDeg: -110.2, elevationM: 1200, soilTexture: 'loam' });
    } finally {
      for (const c of held) c.release();
    }
    expect(busy.status).toBe(503);
    expect(busy.headers['retry-after']).toBe('5');
    expect(busy.body.error).toMatchObject({ code: 'service_unavailable', reason: 'database_busy', message: expect.stringMatching(/Nothing was saved/) });

    // Nothing half-written: only the first garden exists; the same request now succeeds.
    const before = await a.get('/api/gardens');
    expect(before.body.data.map((g: { name: string }) => g.name)).toEqual(['Huerta del pozo']);
    const again = await a.post('/api/gardens', { name: 'Second bed', latitudeDeg: 31.4, longitudeDeg: -110.2, elevationM: 1200, soilTexture: 'loam' });
    expect(again.status).toBe(201);
  });
});
