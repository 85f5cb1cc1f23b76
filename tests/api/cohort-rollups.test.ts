/**
 * The cohort results route reads per-trial log rollups (server/services/log-rollups.ts) instead of
 * re-aggregating raw logs. Its answer must stay identical to a fresh recomputation from the raw
 * rows (`recomputeCohortResultsFromRawRows`, the queries the route used before the rollups) after
 * every kind of write: log create/edit/delete, the Round, CSV import, plot and trial edits, plot and
 * trial deletion, share withdrawal and re-sharing, exclusions, a write made outside the services,
 * the calendar moving on, and a garden changing its time zone (weeks are the garden's). The reference here is the raw-row SQL itself; the published numbers
 * that check the pooling end to end are in cohort-results.test.ts.
 *
 * Float sums: PostgreSQL adds double-precision values in whatever order it scans them, in both the
 * raw queries and the rollups, so sums may differ in the last bits; numbers are compared to a
 * relative 1e-9 (common practice, no source), everything else exactly.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cohortResultsQuerySchema, cohortResultsSchema, type CohortResults } from '@shared/schemas/cohort-results';
import { recomputeCohortResultsFromRawRows } from '@server/services/cohort-results.service';
import { parseEnv } from '@server/config/env';
import { QUEUES } from '@server/jobs/queues';
import { runRollupSweep } from '@server/jobs/rollup-sweep';
import { startJobRunner } from '@server/jobs/runner';
import { createLogger } from '@server/lib/logger';
import { createMailer } from '@server/lib/mailer';
import { makePairedTrial } from '../helpers/notebook-fixtures';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  t.clock.now = new Date('2026-07-15T12:00:00Z');
});
afterAll(async () => {
  await t.close();
});

type Trial = Awaited<ReturnType<typeof makePairedTrial>>;

/** Every difference between two JSON values, numbers compared to a relative tolerance. */
function differences(a: unknown, b: unknown, path = '$', out: string[] = []): string[] {
  if (typeof a === 'number' && typeof b === 'number') {
    if (!(a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b)))) out.push(`${path}: ${a} ≠ ${b}`);
  } else if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) out.push(`${path}: length ${a.length} ≠ ${b.length}`);
    else a.forEach((x, i) => differences(x, b[i], `${path}[${i}]`, out));
  } else if (a && b && typeof a === 'object' && typeof b === 'object') {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
    for (const k of keys) differences((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${path}.${k}`, out);
  } else if (a !== b) out.push(`${path}: ${JSON.stringify(a)} ≠ ${JSON.stringify(b)}`);
  return out;
}

describe('cohort results from the log rollups', () => {
  let lead: ApiAgent;
  let leadId: string;
  let cohortId: string;
  let growerA: ApiAgent;
  let growerB: ApiAgent;
  let a1: Trial;
  let a2: Trial;
  let b1: Trial;

  /** The trial's data_version and the version its rollups were computed at (null: none). */
  async function versions(trialId: string) {
    const [row] = (await t.ds.query(
      `SELECT t.data_version::int AS current, s.data_version::int AS rolled FROM trials t LEFT JOIN trial_log_summaries s ON s.trial_id = t.id WHERE t.id = $1`,
      [trialId],
    )) as { current: number; rolled: number | null }[];
    return row!;
  }

  /** GET the results (the rollup path), recompute from the raw rows, and require the same answer. */
  async function expectRouteMatchesRawRows(query: Record<string, string> = {}): Promise<CohortResults> {
    const qs = new URLSearchParams(query).toString();
    const res = await lead.get(`/api/cohorts/${cohortId}/results${qs ? `?${qs}` : ''}`);
    expect(res.status).toBe(200);
    const viaRollups = cohortResultsSchema.parse(res.body.data);
    const fromRaw = await recomputeCohortResultsFromRawRows(t.ds, {
      cohortId,
      userId: leadId,
      now: t.clock.now!,
      query: cohortResultsQuerySchema.parse(query),
    });
    expect(differences(viaRollups, cohortResultsSchema.parse(JSON.parse(JSON.stringify(fromRaw))))).toEqual([]);
    // After the route ran, every shared trial's rollups are current.
    const stale = (await t.ds.query(
      `SELECT s.trial_id FROM trial_shares s JOIN trials t ON t.id = s.trial_id LEFT JOIN trial_log_summaries ls ON ls.trial_id = t.id
        WHERE s.cohort_id = $1 AND s.withdrawn_at IS NULL AND (ls.trial_id IS NULL OR ls.data_version <> t.data_version)`,
      [cohortId],
    )) as unknown[];
    expect(stale).toEqual([]);
    return viaRollups;
  }

  async function ok(res: Promise<{ status: number; body: unknown }>, status = 200) {
    const r = await res;
    if (r.status !== status) throw new Error(`expected ${status}, got ${r.status}: ${JSON.stringify(r.body)}`);
    return r.body as { data: Record<string, unknown> };
  }

  const plotOf = (trial: Trial, treatment: string, i = 0) => trial.plots.filter((p) => p.treatment === treatment)[i]!.id;

  /** A season of olla refills, surface watering, moisture and harvests through the Round. */
  async function season(a: ApiAgent, trial: Trial, scale: number, firstDay = 20) {
    const entries: object[] = [];
    for (let d = 0; d < 40; d += 3) {
      const day = new Date(Date.UTC(2026, 4, firstDay + d, 7)).toISOString();
      for (const p of trial.plots) {
        const olla = p.treatment === 'olla';
        entries.push({ type: 'water', entry: { plotId: p.id, occurredAt: day, kind: olla ? 'olla_refill' : 'surface', volumeL: (olla ? 6.5 : 9.25) * scale + d / 10 } });
        if (d % 6 === 0) entries.push({ type: 'moisture', entry: { plotId: p.id, takenAt: day, method: 'vwc', depthCm: 15, value: 18 + d / 4 } });
      }
    }
    for (const [i, p] of trial.plots.entries()) {
      if (i === 0) continue; // one plot without any harvest: "plots without harvest" must count it
      entries.push({ type: 'harvest', entry: { plotId: p.id, harvestedOn: '2026-07-01', freshKg: 1.2 * scale + i / 10 } });
    }
    await ok(a.post(`/api/trials/${trial.trial.id}/round`, { entries }), 201);
  }

  beforeAll(async () => {
    lead = new ApiAgent(t.app);
    leadId = (await lead.signUp({ email: uniqueEmail('rollup-lead'), displayName: 'Rollup lead', role: 'educator' })).id;
    const cohort = (await ok(lead.post('/api/cohorts', { name: 'Rollup cohort' }), 201)).data as { id: string; joinCode: string };
    cohortId = cohort.id;
    growerA = new ApiAgent(t.app);
    growerB = new ApiAgent(t.app);
    for (const [g, name] of [
      [growerA, 'rollup-a'],
      [growerB, 'rollup-b'],
    ] as const) {
      await g.signUp({ email: uniqueEmail(name), displayName: `Grower ${name}`, role: 'grower' });
      await ok(g.post('/api/cohorts/join', { code: cohort.joinCode, role: 'contributor' }), 201);
    }
    a1 = await makePairedTrial(growerA, { title: 'A one' });
    a2 = await makePairedTrial(growerA, { title: 'A two', plantingDate: '2026-05-25' });
    b1 = await makePairedTrial(growerB, { title: 'B one' });
    await season(growerA, a1, 1);
    await season(growerA, a2, 1.3, 26);
    await season(growerB, b1, 0.8);
    for (const [g, trial] of [
      [growerA, a1],
      [growerA, a2],
      [growerB, b1],
    ] as const) {
      await ok(g.post(`/api/trials/${trial.trial.id}/shares`, { cohortId }), 201);
    }
  });

  it('matches the raw rows on the first read, and builds the rollups from them', async () => {
    expect((await versions(a1.trial.id)).rolled).toBeNull();
    const r = await expectRouteMatchesRawRows();
    expect(r.trials.map((x) => x.trialId).sort()).toEqual([a1.trial.id, a2.trial.id, b1.trial.id].sort());
    const [weeks] = (await t.ds.query(`SELECT count(*)::int AS n, sum(events)::int AS events FROM trial_week_water WHERE trial_id = $1`, [a1.trial.id])) as {
      n: number;
      events: number;
    }[];
    // 14 watering days × 4 plots, over 6 ISO weeks and two kinds (olla, surface).
    expect(weeks!.events).toBe(56);
    expect(weeks!.n).toBeGreaterThan(6);
    const [a1v] = [await versions(a1.trial.id)];
    expect(a1v.rolled).toBe(a1v.current);
  });

  it('follows log creates, edits and deletes of every kind', async () => {
    await expectRouteMatchesRawRows();
    const before = await versions(a1.trial.id);
    const created = (await ok(
      growerA.post(`/api/trials/${a1.trial.id}/water-events`, { plotId: plotOf(a1, 'olla'), occurredAt: '2026-07-02T06:00:00Z', kind: 'olla_refill', volumeL: 40 }),
      201,
    )).data as { id: string };
    // The write moved the trial's version in its own transaction; the rollups are now behind it.
    const after = await versions(a1.trial.id);
    expect(after.current).toBeGreaterThan(before.current);
    expect(after.rolled).toBe(before.current);
    await expectRouteMatchesRawRows();

    await ok(growerA.patch(`/api/water-events/${created.id}`, { volumeL: 12.5, occurredAt: '2026-06-08T06:00:00Z' }));
    await expectRouteMatchesRawRows();
    await ok(growerA.patch(`/api/water-events/${created.id}`, { plotId: plotOf(a1, 'surface'), kind: 'surface' }));
    await expectRouteMatchesRawRows();
    await ok(growerA.delete(`/api/water-events/${created.id}`), 204);
    await expectRouteMatchesRawRows();

    const harvests = (await ok(growerB.get(`/api/trials/${b1.trial.id}/harvests`))).data as unknown as { id: string }[];
    await ok(growerB.patch(`/api/harvests/${harvests[0]!.id}`, { freshKg: 9.75 }));
    await expectRouteMatchesRawRows();
    for (const h of harvests.filter((x, i) => i > 0 && i < 3)) await ok(growerB.delete(`/api/harvests/${h.id}`), 204);
    await expectRouteMatchesRawRows();

    await ok(
      growerB.post(`/api/trials/${b1.trial.id}/moisture-readings`, { plotId: plotOf(b1, 'olla'), takenAt: '2026-07-03T06:00:00Z', method: 'tensiometer', depthCm: 20, value: 25 }),
      201,
    );
    const withTensiometer = await expectRouteMatchesRawRows();
    expect(withTensiometer.trials.find((x) => x.trialId === b1.trial.id)).toBeDefined();
  });

  it('follows CSV imports and writes made outside the services', async () => {
    const rows = Array.from({ length: 9 }, (_, i) => ({
      line: i + 2,
      plotLabel: a2.plots[i % 4]!.label,
      occurredAt: new Date(Date.UTC(2026, 5, 1 + i * 2, 18)).toISOString(),
      kind: a2.plots[i % 4]!.treatment === 'olla' ? 'olla_refill' : 'surface',
      volumeL: 3 + i,
    }));
    await ok(growerA.post(`/api/trials/${a2.trial.id}/import`, { kind: 'water-events', rows }), 201);
    await ok(
      growerA.post(`/api/trials/${a2.trial.id}/import`, {
        kind: 'harvests',
        rows: [{ line: 2, plotLabel: a2.plots[0]!.label, harvestedOn: '2026-07-10', freshKg: 2.5 }],
      }),
      201,
    );
    await expectRouteMatchesRawRows();

    // A script or psql session: the triggers catch it as well as the services.
    await t.ds.query(`UPDATE water_events SET volume_l = volume_l * 2 WHERE trial_id = $1 AND kind = 'surface'`, [a2.trial.id]);
    await expectRouteMatchesRawRows();
    await t.ds.query(`DELETE FROM moisture_readings WHERE trial_id = $1`, [a2.trial.id]);
    await expectRouteMatchesRawRows();
    await t.ds.query(`UPDATE plots SET treatment = NULL WHERE id = $1`, [plotOf(b1, 'surface', 1)]);
    await expectRouteMatchesRawRows();
    await t.ds.query(`UPDATE plots SET treatment = 'surface' WHERE id = $1`, [plotOf(b1, 'olla', 1)]);
    await expectRouteMatchesRawRows();
  });

  it('follows plot and trial edits, the calendar, exclusions and shares', async () => {
    await ok(growerA.patch(`/api/plots/${plotOf(a1, 'olla')}`, { areaM2: 3.5, blockKey: 'Z' }));
    await expectRouteMatchesRawRows();
    // The season is cut to planting … end (or today) when the rollups are read.
    await ok(growerA.patch(`/api/trials/${a1.trial.id}`, { plantingDate: '2026-05-27', endDate: '2026-06-18' }));
    await expectRouteMatchesRawRows();
    t.clock.now = new Date('2026-06-10T09:00:00Z');
    await expectRouteMatchesRawRows();
    t.clock.now = new Date('2026-08-20T09:00:00Z');
    await expectRouteMatchesRawRows({ excludeFlagged: 'true', includeSinglePairs: 'true', method: 'REML' });

    await ok(lead.post(`/api/cohorts/${cohortId}/exclusions`, { trialId: b1.trial.id, reason: 'Meter replaced mid-season' }), 201);
    const excluded = await expectRouteMatchesRawRows();
    expect(excluded.trials.find((x) => x.trialId === b1.trial.id)!.exclusion).not.toBeNull();
    await ok(lead.delete(`/api/cohorts/${cohortId}/exclusions/${b1.trial.id}`), 204);
    await expectRouteMatchesRawRows();

    await ok(growerA.delete(`/api/trials/${a2.trial.id}/shares/${cohortId}`));
    const withdrawn = await expectRouteMatchesRawRows();
    expect(withdrawn.trials.map((x) => x.trialId)).not.toContain(a2.trial.id);
    // Logged while withdrawn, then shared again: the rollups catch up.
    await ok(
      growerA.post(`/api/trials/${a2.trial.id}/water-events`, { plotId: plotOf(a2, 'olla'), occurredAt: '2026-07-20T06:00:00Z', kind: 'olla_refill', volumeL: 7 }),
      201,
    );
    await ok(growerA.post(`/api/trials/${a2.trial.id}/shares`, { cohortId }), 201);
    const reshared = await expectRouteMatchesRawRows();
    expect(reshared.trials.map((x) => x.trialId)).toContain(a2.trial.id);
  });

  it("follows a garden's time-zone change and a trial moved to another garden (weeks are the garden's)", async () => {
    /** The trial's water per ISO week as the rollups hold it. */
    const rolledWeeks = async (trialId: string) =>
      (await t.ds.query(
        `SELECT to_char(week_start, 'YYYY-MM-DD') AS week, sum(events)::int AS events FROM trial_week_water WHERE trial_id = $1 GROUP BY 1 ORDER BY 1`,
        [trialId],
      )) as { week: string; events: number }[];
    /**
     * The same from the raw rows by another route: PostgreSQL's date_trunc('week', …) (ISO weeks
     * start on Monday, PostgreSQL manual, "date_trunc") of the local time in the given zone.
     */
    const expectedWeeks = async (trialId: string, zone: string) =>
      (await t.ds.query(
        `SELECT to_char(date_trunc('week', occurred_at AT TIME ZONE $2), 'YYYY-MM-DD') AS week, count(*)::int AS events
           FROM water_events WHERE trial_id = $1 GROUP BY 1 ORDER BY 1`,
        [trialId, zone],
      )) as { week: string; events: number }[];

    await expectRouteMatchesRawRows();
    expect(await rolledWeeks(a2.trial.id)).toEqual(await expectedWeeks(a2.trial.id, 'UTC'));
    // Pacific/Honolulu is UTC−10 all year (IANA tz database): a 07:00Z Monday refill is Sunday there, the week before.
    const honolulu = await expectedWeeks(a2.trial.id, 'Pacific/Honolulu');
    expect(honolulu).not.toEqual(await expectedWeeks(a2.trial.id, 'UTC'));
    const before = await versions(a2.trial.id);
    await ok(growerA.patch(`/api/gardens/${a2.garden.id}`, { timeZone: 'Pacific/Honolulu' }));
    // The garden's update bumped every trial of the garden in the same transaction.
    expect((await versions(a2.trial.id)).current).toBeGreaterThan(before.current);
    await expectRouteMatchesRawRows();
    expect(await rolledWeeks(a2.trial.id)).toEqual(honolulu);

    // A change to another column leaves the rollups current.
    const settled = await versions(a2.trial.id);
    await ok(growerA.patch(`/api/gardens/${a2.garden.id}`, { notes: 'by the wash' }));
    expect((await versions(a2.trial.id)).current).toBe(settled.current);

    // psql: moving a trial to a garden in another zone bumps it too (Asia/Tokyo, UTC+9 all year).
    const tokyo = (await ok(growerB.post('/api/gardens', { name: 'Roof', latitudeDeg: 35.7, longitudeDeg: 139.7, elevationM: 40, soilTexture: 'loam', timeZone: 'Asia/Tokyo' }), 201))
      .data as { id: string };
    const b1Before = await versions(b1.trial.id);
    await t.ds.query(`UPDATE trials SET garden_id = $1 WHERE id = $2`, [tokyo.id, b1.trial.id]);
    expect((await versions(b1.trial.id)).current).toBeGreaterThan(b1Before.current);
    await expectRouteMatchesRawRows();
    expect(await rolledWeeks(b1.trial.id)).toEqual(await expectedWeeks(b1.trial.id, 'Asia/Tokyo'));
  });

  it('follows plot and trial deletion', async () => {
    const plot = plotOf(b1, 'surface');
    await t.ds.query(`DELETE FROM plots WHERE id = $1`, [plot]);
    expect(await t.ds.query(`SELECT 1 FROM plot_log_totals WHERE plot_id = $1`, [plot])).toEqual([]);
    await expectRouteMatchesRawRows();
    // A shared trial cannot be deleted through the API; withdraw it first.
    await ok(growerA.delete(`/api/trials/${a1.trial.id}/shares/${cohortId}`));
    await expectRouteMatchesRawRows();
    await ok(growerA.delete(`/api/trials/${a1.trial.id}`), 204);
    const r = await expectRouteMatchesRawRows();
    expect(r.trials.map((x) => x.trialId).sort()).toEqual([a2.trial.id, b1.trial.id].sort());
    expect(await t.ds.query(`SELECT 1 FROM trial_week_water WHERE trial_id = $1`, [a1.trial.id])).toEqual([]);
  });

  it('are refreshed in the background by the rollup sweep, for shared trials only, and through the job queue', async () => {
    const c1 = await makePairedTrial(growerB, { title: 'B sweep shared' });
    const c2 = await makePairedTrial(growerB, { title: 'B sweep private' });
    await season(growerB, c1, 0.9);
    await season(growerB, c2, 1.1);
    await ok(growerB.post(`/api/trials/${c1.trial.id}/shares`, { cohortId }), 201);
    // Everything else the earlier tests left behind is brought up to date first, so the counts below are this test's.
    await runRollupSweep(t.ds);
    await ok(growerB.post(`/api/trials/${b1.trial.id}/water-events`, { plotId: plotOf(b1, 'olla'), occurredAt: '2026-07-03T06:00:00Z', kind: 'olla_refill', volumeL: 7 }), 201);
    expect((await versions(b1.trial.id)).rolled).toBeLessThan((await versions(b1.trial.id)).current);

    // One stale shared trial (b1); c1 was swept above; the private c2 never is (nothing reads its rollups).
    expect(await runRollupSweep(t.ds, { batchSize: 1 })).toBe(1);
    for (const id of [b1.trial.id, c1.trial.id]) {
      const v = await versions(id);
      expect(v.rolled).toBe(v.current);
    }
    expect((await versions(c2.trial.id)).rolled).toBeNull();
    expect(await runRollupSweep(t.ds)).toBe(0);
    // The page then has nothing to recompute, and still equals the raw rows.
    await expectRouteMatchesRawRows();

    // Through pg-boss: the queue's handler is the sweep, in small batches (maxTrials per run bounds it).
    await ok(growerB.post(`/api/trials/${c1.trial.id}/water-events`, { plotId: plotOf(c1, 'surface'), occurredAt: '2026-07-04T06:00:00Z', kind: 'surface', volumeL: 9 }), 201);
    const runner = await startJobRunner(
      {
        ds: t.ds,
        env: parseEnv({ NODE_ENV: 'test', DATABASE_URL: t.databaseUrl, LOG_LEVEL: 'silent' }),
        logger: createLogger('silent'),
        mailer: createMailer(t.sink.url, 'Seepwise <test@seepwise.invalid>'),
        publicUrl: 'http://seepwise.test',
        now: () => t.clock.now ?? new Date(),
      },
      { connectionString: t.databaseUrl, schedule: false, work: false },
    );
    try {
      await runner.boss.send(QUEUES.rollupSweep, {});
      expect(await runner.drain(QUEUES.rollupSweep)).toBe(1);
      const v = await versions(c1.trial.id);
      expect(v.rolled).toBe(v.current);
      const [job] = (await t.ds.query(`SELECT state, output FROM pgboss.job WHERE name = $1 ORDER BY created_on DESC LIMIT 1`, [QUEUES.rollupSweep])) as {
        state: string;
      }[];
      expect(job!.state).toBe('completed');
    } finally {
      await runner.stop();
    }
  });
});
