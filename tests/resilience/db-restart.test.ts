/**
 * PostgreSQL goes away and comes back while a grower keeps logging water through the API. The
 * app is never restarted: it refuses writes with 503 + Retry-After while the database is gone,
 * answers again within 5 s of its return (both the TypeORM pool and the session pool), and
 * every write it acknowledged is in the database afterwards.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrate, startOwnCluster, type OwnCluster } from './cluster';
import { HttpClient, makeTrial, serveApp, sleep, sql, type HttpResult, type ServedApp } from './support';

let pgc: OwnCluster;
let app: ServedApp;
let dbUrl: string;

beforeAll(async () => {
  // Its own cluster: this test stops and starts the server under the app.
  pgc = await startOwnCluster('restart', 54360);
  dbUrl = pgc.createDatabase('seepwise_restart');
  await migrate(dbUrl);
  app = await serveApp(dbUrl);
});

afterAll(async () => {
  await app?.close();
  pgc?.destroy();
});

interface Attempt {
  marker: string;
  phase: 'before' | 'outage' | 'after';
  res: HttpResult | null;
  /** Network error (the app itself did not answer): must never happen. */
  failure?: string;
}

describe('PostgreSQL restarted under a stream of writes', () => {
  it('keeps the app up, refuses with 503 + Retry-After while down, recovers within 5 s, and loses no acknowledged write', async () => {
    const grower = new HttpClient(app.url);
    await grower.signUp(`restart.${Date.now()}@example.test`);
    const plantingDate = new Date(Date.now() - 30 * 86_400_000).toISOString().slice(0, 10);
    const { trialId, plots } = await makeTrial(grower, plantingDate);

    let phase: Attempt['phase'] = 'before';
    let stopWriting = false;
    const attempts: Attempt[] = [];
    // One writer, one write at a time, as a phone in the garden would send them.
    const writer = (async () => {
      for (let i = 0; i < 3000 && !stopWriting; i++) {
        const marker = `rw-${i}`;
        const attempt: Attempt = { marker, phase, res: null };
        attempts.push(attempt);
        try {
          attempt.res = await grower.post(`/api/trials/${trialId}/water-events`, {
            plotId: plots[i % plots.length]!.id,
            occurredAt: new Date(Date.now() - 3600_000).toISOString(),
            kind: 'surface',
            volumeL: 1 + (i % 7),
            notes: marker,
          });
        } catch (err) {
          attempt.failure = (err as Error).message;
        }
        await sleep(15);
      }
    })();

    const waitForWrites = async (n: number) => {
      for (let i = 0; i < 400 && attempts.filter((a) => a.res && a.res.status < 300).length < n; i++) await sleep(25);
    };
    await waitForWrites(15);

    phase = 'outage';
    await pgc.stopServer();
    // The database stays away long enough for writes to be refused.
    await sleep(1500);
    await pgc.startServer();
    const back = Date.now();

    // Functional deadline: poll until the app answers with the database again, or 5 s pass.
    let healthy = false;
    while (Date.now() - back < 5000) {
      const health = await fetch(`${app.url}/api/health`).catch(() => null);
      const account = await grower.get('/api/account').catch(() => null);
      if (health?.status === 200 && account?.status === 200) {
        healthy = true;
        break;
      }
      await sleep(100);
    }
    expect(healthy).toBe(true);
    phase = 'after';
    const okBefore = attempts.filter((a) => a.res && a.res.status < 300).length;
    await waitForWrites(okBefore + 15);
    stopWriting = true;
    await writer;

    // The app always answered: no connection errors, no 500s.
    expect(attempts.filter((a) => a.failure)).toEqual([]);
    const statuses = new Set(attempts.map((a) => a.res!.status));
    expect([...statuses].filter((s) => ![200, 201, 503].includes(s)), `the app logged: ${app.errorLog.join('\n')}`).toEqual([]);

    // While the database was gone writes were refused with the one error shape and a retry hint.
    const refused = attempts.filter((a) => a.res!.status === 503);
    expect(refused.length).toBeGreaterThan(0);
    for (const r of refused) {
      expect(r.res!.headers.get('retry-after')).toMatch(/^\d+$/);
      expect(r.res!.body.error).toMatchObject({ code: 'service_unavailable', message: expect.stringMatching(/try again/i) });
      expect(Object.keys(r.res!.body)).toEqual(['error']);
    }
    // Writes succeeded again after the return, without restarting the app.
    expect(attempts.filter((a) => a.phase === 'after' && a.res!.status === 201).length).toBeGreaterThanOrEqual(1);

    // Every acknowledged write is in the database.
    const acknowledged = attempts.filter((a) => a.res!.status === 201).map((a) => a.marker);
    const stored = new Set((await sql<{ notes: string }>(dbUrl, 'SELECT notes FROM water_events WHERE trial_id = $1', [trialId])).map((r) => r.notes));
    expect(acknowledged.filter((m) => !stored.has(m))).toEqual([]);
    expect(acknowledged.length).toBeGreaterThanOrEqual(30);
  });

  it('serves the very first requests after an idle restart from fresh connections (no stale pooled clients)', async () => {
    const grower = new HttpClient(app.url);
    await grower.signUp(`idle.${Date.now()}@example.test`);
    const plantingDate = new Date(Date.now() - 30 * 86_400_000).toISOString().slice(0, 10);
    const { trialId, plots } = await makeTrial(grower, plantingDate);
    // Both pools now hold idle connections to the old server processes.
    await pgc.restartServer();
    const account = await grower.get('/api/account');
    expect(account.status).toBe(200);
    const write = await grower.post(`/api/trials/${trialId}/water-events`, {
      plotId: plots[0]!.id,
      occurredAt: new Date(Date.now() - 60_000).toISOString(),
      kind: 'surface',
      volumeL: 2,
      notes: 'after-idle-restart',
    });
    expect(write.status).toBe(201);
    expect(await sql(dbUrl, 'SELECT 1 FROM water_events WHERE notes = $1', ['after-idle-restart'])).toHaveLength(1);
  });
});
