/**
 * Two app instances (createApp twice, two loopback ports) on one database, as behind a load
 * balancer: a session started on one works on the other, a sign-out on one ends it on both,
 * and a background job queued by one instance's pg-boss runs exactly once, on either.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type PgBoss from 'pg-boss';
import { parseEnv } from '../../server/config/env';
import { createDataSource } from '../../server/db/data-source';
import { startJobRunner, type JobRunner } from '../../server/jobs/runner';
import { createLogger } from '../../server/lib/logger';
import { HttpClient, nullMailer, serveApp, SESSION_SECRET, sharedDatabase, sleep, type ServedApp } from './support';

let a: ServedApp;
let b: ServedApp;
let dbUrl: string;

beforeAll(async () => {
  dbUrl = await sharedDatabase('seepwise_two_instances');
  a = await serveApp(dbUrl);
  b = await serveApp(dbUrl);
});

afterAll(async () => {
  await a?.close();
  await b?.close();
});

describe('two app instances on one database', () => {
  it('shares sessions: signed in on A, the same cookie and CSRF token work on B, and signing out on B ends it on A', async () => {
    expect(a.url).not.toBe(b.url);
    const onA = new HttpClient(a.url);
    const email = `two.${Date.now()}@example.test`;
    await onA.signUp(email);
    const onB = new HttpClient(b.url);
    onB.cookie = onA.cookie;
    onB.csrf = onA.csrf;

    const me = await onB.get('/api/account');
    expect(me.status).toBe(200);
    expect((me.body.data as { email: string }).email).toBe(email);
    // A write on B with the token issued by A: the CSRF token lives in the shared session too.
    const garden = await onB.post('/api/gardens', { name: 'Made on B', latitudeDeg: 35.1, longitudeDeg: -106.6, elevationM: 1500, soilTexture: 'loam' });
    expect(garden.status).toBe(201);
    const seenOnA = await onA.get('/api/gardens');
    expect((seenOnA.body.data as { name: string }[]).map((g) => g.name)).toContain('Made on B');

    const cookie = onA.cookie;
    expect((await onB.post('/api/auth/sign-out')).status).toBe(200);
    const stale = new HttpClient(a.url);
    stale.cookie = cookie;
    expect((await stale.get('/api/account')).status).toBe(401);
  });

  it('runs a job queued by instance A exactly once across the workers of both instances', async () => {
    const env = parseEnv({ NODE_ENV: 'test', DATABASE_URL: dbUrl, LOG_LEVEL: 'silent', SESSION_SECRET });
    const runners: JobRunner[] = [];
    const dataSources = [createDataSource(dbUrl, { poolSize: 2 }), createDataSource(dbUrl, { poolSize: 2 })];
    try {
      // server/jobs/runner.ts is how each instance starts its pg-boss; the cron schedules stay off here.
      for (const ds of dataSources) {
        await ds.initialize();
        runners.push(
          await startJobRunner(
            { ds, env, logger: createLogger('silent'), mailer: nullMailer, publicUrl: 'http://seepwise.test', now: () => new Date() },
            { connectionString: dbUrl, schedule: false, work: false },
          ),
        );
      }
      const queue = 'resilience-once';
      const bosses: PgBoss[] = runners.map((r) => r.boss);
      await bosses[0]!.createQueue(queue);
      const ran: { id: string; by: 'A' | 'B' }[] = [];
      for (const [i, boss] of bosses.entries()) {
        await boss.work(queue, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async (jobs) => {
          for (const job of jobs) {
            ran.push({ id: job.id, by: i === 0 ? 'A' : 'B' });
            await sleep(40);
          }
        });
      }
      // Half due now, half scheduled a second ahead: all queued by A.
      const ids: string[] = [];
      for (let n = 0; n < 24; n++) {
        const id = await bosses[0]!.send(queue, { n }, n % 2 ? { startAfter: 1 } : {});
        ids.push(id!);
      }
      for (let i = 0; i < 300 && new Set(ran.map((r) => r.id)).size < ids.length; i++) await sleep(50);
      // Two more polling rounds, so a duplicate delivery would have time to show.
      await sleep(1200);

      const perJob = new Map<string, number>();
      for (const r of ran) perJob.set(r.id, (perJob.get(r.id) ?? 0) + 1);
      expect([...perJob.keys()].sort()).toEqual([...ids].sort());
      expect([...perJob.values()].every((n) => n === 1)).toBe(true);
      // Both workers really competed for the queue (each took some of the jobs).
      expect(ran.some((r) => r.by === 'A') && ran.some((r) => r.by === 'B')).toBe(true);
      for (const id of ids) expect((await bosses[1]!.getJobById(queue, id))?.state).toBe('completed');
    } finally {
      for (const r of runners) await r.stop();
      for (const ds of dataSources) if (ds.isInitialized) await ds.destroy();
    }
  });
});
