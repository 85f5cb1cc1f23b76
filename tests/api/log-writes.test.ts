/**
 * Log-entry writes (POST /api/trials/:trialId/<kind>): the SQL one signed-in write sends, and the
 * answers that must not change with it — outsiders, refusals with reason codes, idempotent
 * replays, audit entries and the rollup trigger. Project rules, no outside source: the access
 * rules are DEVELOPERS.md "Requests, errors, permissions"; the within-trial rule is
 * server/services/logs.service.ts; auditing shared or closed trials is server/services/audit.ts.
 */
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makePairedTrial } from '../helpers/notebook-fixtures';
import { sqlStatements, statementHead } from '../helpers/sql-statements';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  // Logs dated in the 2026 season must not count as "in the future".
  t.clock.now = new Date('2026-09-30T12:00:00Z');
});
afterAll(async () => {
  await t.close();
});

async function grower() {
  const a = new ApiAgent(t.app);
  await a.signUp({ email: uniqueEmail() });
  return a;
}

/** A grower's paired trial shared into a cohort (so its edits are audited), with the cohort's lead and an observer. */
async function sharedTrial() {
  const lead = new ApiAgent(t.app);
  await lead.signUp({ email: uniqueEmail('lead'), role: 'educator' });
  const cohort = (await lead.post('/api/cohorts', { name: 'Write checks' })).body.data;
  const a = await grower();
  expect((await a.post('/api/cohorts/join', { code: cohort.joinCode })).status).toBeLessThan(300);
  const observer = await grower();
  expect((await observer.post('/api/cohorts/join', { code: cohort.joinCode, role: 'observer' })).status).toBeLessThan(300);
  const fx = await makePairedTrial(a);
  expect((await a.post(`/api/trials/${fx.trial.id}/shares`, { cohortId: cohort.id })).status).toBe(201);
  return { a, lead, observer, ...fx };
}

const count = async (table: string, trialId: string) => ((await t.ds.query(`SELECT count(*)::int AS n FROM ${table} WHERE trial_id = $1`, [trialId])) as { n: number }[])[0]!.n;
const audits = async (trialId: string) =>
  (await t.ds.query(`SELECT action, entity_type, entity_id, actor_id, changes FROM audit_entries WHERE trial_id = $1 AND entity_type = 'water_event' ORDER BY at`, [trialId])) as {
    action: string;
    entity_type: string;
    entity_id: string;
    actor_id: string;
    changes: Record<string, unknown>;
  }[];
const dataVersion = async (trialId: string) => Number(((await t.ds.query('SELECT data_version FROM trials WHERE id = $1', [trialId])) as { data_version: number }[])[0]!.data_version);

describe('a log write', () => {
  it('sends two SQL statements: the session with its user, then one statement that checks, writes and audits', async () => {
    const { a, trial, plots, pots } = await sharedTrial();
    const olla = plots.find((p) => p.treatment === 'olla')!;
    const pot = pots.find((p: { plotId: string }) => p.plotId === olla.id);
    // The session store touches a session at most once per 5 minutes; this request takes that touch.
    expect((await a.get(`/api/trials/${trial.id}`)).status).toBe(200);
    const body = { plotId: olla.id, potId: pot.id, occurredAt: '2026-06-04T07:00:00Z', kind: 'olla_refill', volumeL: 6.5, idempotencyKey: 'count-key-0001' };

    let first!: { status: number; body: { data: Record<string, unknown> } };
    const sent = await sqlStatements(async () => {
      first = await a.post(`/api/trials/${trial.id}/water-events`, body);
    });
    expect(first.status).toBe(201);
    expect(sent.map(statementHead)).toEqual(['SELECT s.sess, u.id', 'WITH … INSERT INTO water_events']);

    // A replay of the same key: the same two statements, and the first record back.
    let again!: { status: number; body: { data: Record<string, unknown>; meta: { created: boolean } } };
    const replay = await sqlStatements(async () => {
      again = await a.post(`/api/trials/${trial.id}/water-events`, body);
    });
    expect(again.status).toBe(200);
    expect(again.body.meta.created).toBe(false);
    expect(again.body.data).toEqual(first.body.data);
    expect(replay.map(statementHead)).toEqual(['SELECT s.sess, u.id', 'WITH … INSERT INTO water_events']);

    // The other kinds share the path.
    for (const [kind, table, entry] of [
      ['moisture-readings', 'moisture_readings', { plotId: olla.id, takenAt: '2026-06-04T07:05:00Z', method: 'vwc', depthCm: 15, value: 21 }],
      ['harvests', 'harvests', { plotId: olla.id, harvestedOn: '2026-07-20', freshKg: 1.2 }],
      ['observations', 'observations', { observedAt: '2026-06-04T07:10:00Z', text: 'First flowers' }],
    ] as const) {
      let res!: { status: number };
      const kindSent = await sqlStatements(async () => {
        res = await a.post(`/api/trials/${trial.id}/${kind}`, entry);
      });
      expect(res.status).toBe(201);
      expect(kindSent.map(statementHead)).toEqual(['SELECT s.sess, u.id', `WITH … INSERT INTO ${table}`]);
    }
  });

  it('answers outsiders as before (401 signed out, 404 for another grower, a cohort reader or a malformed id) and writes nothing', async () => {
    const { lead, observer, trial, plots } = await sharedTrial();
    const body = { plotId: plots[0]!.id, occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 5 };
    const stranger = await grower();
    const anonymous = new ApiAgent(t.app);
    await anonymous.refreshCsrf();
    expect((await anonymous.post(`/api/trials/${trial.id}/water-events`, body)).status).toBe(401);
    for (const outsider of [stranger, lead, observer]) {
      const res = await outsider.post(`/api/trials/${trial.id}/water-events`, body);
      expect(res.status).toBe(404);
      expect(res.body.error).toMatchObject({ code: 'not_found', reason: 'not_found' });
      // A body that fails validation still gets the 404, not a 400 that would confirm the trial exists.
      expect((await outsider.post(`/api/trials/${trial.id}/water-events`, { ...body, volumeL: -1 })).status).toBe(404);
      expect((await outsider.post(`/api/trials/${trial.id}/harvests`, {})).status).toBe(404);
    }
    expect((await stranger.post('/api/trials/not-a-uuid/water-events', body)).status).toBe(404);
    expect((await stranger.post('/api/trials/00000000-0000-4000-8000-000000000000/water-events', body)).status).toBe(404);
    expect(await count('water_events', trial.id)).toBe(0);
    expect(await count('harvests', trial.id)).toBe(0);
  });

  it('refuses a plot of another trial, a pot of another plot, a date outside the trial and a closed trial, with reason codes, and writes nothing', async () => {
    const a = await grower();
    const { trial, plots, pots } = await makePairedTrial(a);
    const other = await makePairedTrial(a, { title: 'Peppers' });
    const olla = plots.filter((p) => p.treatment === 'olla');
    const potOfSecond = pots.find((p: { plotId: string }) => p.plotId === olla[1]!.id);
    const base = { plotId: olla[0]!.id, occurredAt: '2026-06-01T07:00:00Z', kind: 'olla_refill', volumeL: 5 };
    const refusal = async (kind: string, body: object) => {
      const res = await a.post(`/api/trials/${trial.id}/${kind}`, body);
      expect(res.status).toBe(400);
      return { reason: res.body.error.reason, details: res.body.error.details };
    };
    expect(await refusal('water-events', { ...base, plotId: other.plots[0]!.id })).toEqual({
      reason: 'plot_not_in_trial',
      details: [{ path: 'plotId', message: 'That plot is not part of this trial.', reason: 'plot_not_in_trial' }],
    });
    expect(await refusal('water-events', { ...base, potId: potOfSecond.id })).toEqual({
      reason: 'pot_not_in_plot',
      details: [{ path: 'potId', message: 'That pot does not sit in this plot.', reason: 'pot_not_in_plot' }],
    });
    // Planted 2026-05-01, still running, in a garden on UTC (the default zone). The clock says 2026-09-30 12:00 UTC; the
    // last day allowed is the garden's tomorrow (2026-10-01; time-zones.test.ts checks other zones).
    expect(await refusal('water-events', { ...base, occurredAt: '2026-04-30T23:59:00Z' })).toEqual({
      reason: 'date_outside_trial',
      details: [{ path: 'occurredAt', message: '2026-04-30 is outside this trial (planted 2026-05-01, still running); future dates are refused too.', reason: 'date_outside_trial' }],
    });
    expect((await refusal('harvests', { plotId: olla[0]!.id, harvestedOn: '2026-10-02', freshKg: 1 })).reason).toBe('date_outside_trial');
    // Year 0 passes the ISO format check; it is outside the trial like any other day (a 400, not a database error).
    expect((await refusal('water-events', { ...base, occurredAt: '0000-06-01T07:00:00Z' })).reason).toBe('date_outside_trial');
    expect((await refusal('harvests', { plotId: olla[0]!.id, harvestedOn: '0000-06-01', freshKg: 1 })).reason).toBe('date_outside_trial');
    expect((await a.post(`/api/trials/${trial.id}/harvests`, { plotId: olla[0]!.id, harvestedOn: '2026-10-01', freshKg: 1 })).status).toBe(201);
    // An end date moves the last allowed day.
    expect((await a.patch(`/api/trials/${trial.id}`, { endDate: '2026-08-31' })).status).toBe(200);
    expect((await refusal('moisture-readings', { plotId: olla[0]!.id, takenAt: '2026-09-01T06:00:00Z', method: 'vwc', depthCm: 10, value: 20 })).details[0].message).toBe(
      '2026-09-01 is outside this trial (planted 2026-05-01, ends 2026-08-31); future dates are refused too.',
    );
    expect((await a.post(`/api/trials/${trial.id}/moisture-readings`, { plotId: olla[0]!.id, takenAt: '2026-08-31T23:00:00Z', method: 'vwc', depthCm: 10, value: 20 })).status).toBe(201);
    // An observation names no plot, or one of this trial's.
    expect((await refusal('observations', { plotId: other.plots[0]!.id, observedAt: '2026-06-01T07:00:00Z', text: 'Wilting' })).reason).toBe('plot_not_in_trial');
    expect(await count('water_events', trial.id)).toBe(0);
    expect(await count('observations', trial.id)).toBe(0);

    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'closed' })).status).toBe(200);
    const closed = await a.post(`/api/trials/${trial.id}/water-events`, base);
    expect(closed.status).toBe(409);
    expect(closed.body.error).toMatchObject({ code: 'conflict', reason: 'trial_closed' });
    expect(await count('water_events', trial.id)).toBe(0);
  });

  it('audits a write to a shared trial once, with the input as sent, and bumps the trial’s data version once', async () => {
    const { a, trial, plots } = await sharedTrial();
    const mine = await grower();
    const unshared = await makePairedTrial(mine);
    const body = { plotId: plots[0]!.id, occurredAt: '2026-06-02T07:00:00Z', kind: 'surface', volumeL: 11.2, idempotencyKey: 'audit-key-0001' };
    const v0 = await dataVersion(trial.id);
    const res = await a.post(`/api/trials/${trial.id}/water-events`, body);
    expect(res.status).toBe(201);
    expect(await dataVersion(trial.id)).toBe(v0 + 1);
    const me = (await a.refreshCsrf()).user!;
    const expected = {
      action: 'create',
      entity_type: 'water_event',
      entity_id: res.body.data.id,
      actor_id: me.id,
      // The validated input: defaults filled in (source, fertiliser, potId, notes).
      changes: { ...body, source: 'mains', fertiliser: false, potId: null, notes: '' },
    };
    expect(await audits(trial.id)).toEqual([expected]);
    // A replay adds neither a row, an audit entry nor a data-version bump.
    expect((await a.post(`/api/trials/${trial.id}/water-events`, body)).status).toBe(200);
    expect(await audits(trial.id)).toEqual([expected]);
    expect(await dataVersion(trial.id)).toBe(v0 + 1);
    expect(await count('water_events', trial.id)).toBe(1);
    // A refused write bumps nothing.
    expect((await a.post(`/api/trials/${trial.id}/water-events`, { ...body, idempotencyKey: undefined, occurredAt: '2027-06-02T07:00:00Z' })).status).toBe(400);
    expect(await dataVersion(trial.id)).toBe(v0 + 1);
    // A trial that is neither shared nor closed is not audited.
    expect((await mine.post(`/api/trials/${unshared.trial.id}/water-events`, { ...body, plotId: unshared.plots[0]!.id })).status).toBe(201);
    expect(await audits(unshared.trial.id)).toEqual([]);
  });

  it('answers a replayed key with the first record even when the replay’s own fields would now be refused, but not once the trial is closed', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const body = { plotId: plots[0]!.id, occurredAt: '2026-06-02T07:00:00Z', kind: 'surface', volumeL: 8, idempotencyKey: 'replay-key-0001' };
    const first = await a.post(`/api/trials/${trial.id}/water-events`, body);
    expect(first.status).toBe(201);
    // The key names the record already stored; the replay's body is not checked again (as an offline outbox expects).
    const changed = await a.post(`/api/trials/${trial.id}/water-events`, { ...body, occurredAt: '2026-01-01T07:00:00Z', volumeL: 9 });
    expect(changed.status).toBe(200);
    expect(changed.body).toEqual({ data: first.body.data, meta: { created: false } });
    // The same key in another trial is another record.
    const second = await makePairedTrial(a, { title: 'Second bed' });
    expect((await a.post(`/api/trials/${second.trial.id}/water-events`, { ...body, plotId: second.plots[0]!.id })).status).toBe(201);
    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'closed' })).status).toBe(200);
    const closed = await a.post(`/api/trials/${trial.id}/water-events`, body);
    expect(closed.status).toBe(409);
    expect(closed.body.error.reason).toBe('trial_closed');
    expect(await count('water_events', trial.id)).toBe(1);
  });

  it('keeps one record when the same key arrives twice at once', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const body = { plotId: plots[0]!.id, occurredAt: '2026-06-03T07:00:00Z', kind: 'surface', volumeL: 4, idempotencyKey: 'race-key-00001' };
    const answers = await Promise.all(Array.from({ length: 6 }, () => a.post(`/api/trials/${trial.id}/water-events`, body)));
    expect(answers.map((r) => r.status).sort()).toEqual([200, 200, 200, 200, 200, 201]);
    expect(new Set(answers.map((r) => r.body.data.id)).size).toBe(1);
    expect(await count('water_events', trial.id)).toBe(1);
  });

  it('answers with the record another request is committing under the same key (the insert waits for it, then reads it)', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const other = new pg.Client({ connectionString: t.databaseUrl });
    await other.connect();
    try {
      await other.query('BEGIN');
      const { rows } = await other.query(
        `INSERT INTO water_events (trial_id, plot_id, occurred_at, kind, volume_l, idempotency_key) VALUES ($1, $2, '2026-06-03T07:00:00Z', 'surface', 4, 'race-key-00002') RETURNING id`,
        [trial.id, plots[0]!.id],
      );
      const pending = a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: '2026-06-03T07:00:00Z', kind: 'surface', volumeL: 4, idempotencyKey: 'race-key-00002' }).then((r) => r);
      // Wait (polling, not timing) until the request's INSERT waits for the open transaction's row.
      let waiting = 0;
      for (let i = 0; i < 500 && waiting === 0; i++) {
        waiting = ((await t.ds.query(`SELECT count(*)::int AS n FROM pg_stat_activity WHERE datname = current_database() AND wait_event_type = 'Lock'`)) as { n: number }[])[0]!.n;
        if (!waiting) await new Promise((r) => setTimeout(r, 20));
      }
      expect(waiting).toBe(1);
      await other.query('COMMIT');
      const res = await pending;
      expect(res.status).toBe(200);
      expect(res.body.meta.created).toBe(false);
      expect(res.body.data.id).toBe(rows[0].id);
      expect(await count('water_events', trial.id)).toBe(1);
    } finally {
      await other.end();
    }
  });
});

/**
 * A trial being closed while one of its logs is written, edited or deleted. Closed trials are
 * read-only (project rule, server/services/trials.service.ts `assertTrialWritable`); the writes and
 * the close take the same row lock on the trial (TRIAL_WRITE_LOCK, FOR NO KEY UPDATE), so they run
 * one after the other, in either order. Lock behaviour is PostgreSQL's: "13.3.2 Row-Level Locks"
 * (which modes conflict) and "13.2.1 Read Committed Isolation Level" (a waiting locker gets the
 * committed version of the row). No timing: each test holds a lock open on a connection of its own,
 * polls pg_stat_activity until the request is seen waiting for a lock (`wait_event_type = 'Lock'`) and
 * names the blocking backend (pg_blocking_pids), and only then lets go.
 */
describe('a close racing a log write', () => {
  /** A second connection, outside the app's pool, that holds locks across the test's steps. */
  async function holder() {
    const c = new pg.Client({ connectionString: t.databaseUrl });
    await c.connect();
    const { rows } = await c.query<{ pid: number }>('SELECT pg_backend_pid() AS pid');
    return { c, pid: rows[0]!.pid };
  }

  /** The backend waiting for a lock that backend `blocker` holds (polls; fails after ~10 s of nothing). */
  async function waitingOn(blocker: number) {
    for (let i = 0; i < 500; i++) {
      const rows = (await t.ds.query(
        `SELECT pid, query FROM pg_stat_activity WHERE datname = current_database() AND wait_event_type = 'Lock' AND $1 = ANY(pg_blocking_pids(pid))`,
        [blocker],
      )) as { pid: number; query: string }[];
      if (rows.length) {
        expect(rows).toHaveLength(1);
        return rows[0]!;
      }
      await new Promise((r) => setTimeout(r, 20));
    }
    throw new Error(`no backend came to wait for backend ${blocker}`);
  }

  const status = async (trialId: string) => ((await t.ds.query('SELECT status FROM trials WHERE id = $1', [trialId])) as { status: string }[])[0]!.status;

  /** One entry per kind, on plot `plotId` (observations name a plot too, so the insert checks its foreign key). */
  const entries = (plotId: string) =>
    [
      ['water-events', 'water_events', { plotId, occurredAt: '2026-06-05T07:00:00Z', kind: 'surface', volumeL: 3 }],
      ['moisture-readings', 'moisture_readings', { plotId, takenAt: '2026-06-05T07:05:00Z', method: 'vwc', depthCm: 15, value: 22 }],
      ['harvests', 'harvests', { plotId, harvestedOn: '2026-07-21', freshKg: 0.8 }],
      ['observations', 'observations', { plotId, observedAt: '2026-06-05T07:10:00Z', text: 'Leaves curling' }],
    ] as const;

  it('a write that comes while a close is uncommitted waits for it, then is refused as closed and writes nothing (every kind)', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    for (const [kind, table, entry] of entries(plots[0]!.id)) {
      const close = await holder();
      try {
        await close.c.query('BEGIN');
        await close.c.query(`UPDATE trials SET status = 'closed', updated_at = now() WHERE id = $1`, [trial.id]);
        const pending = a.post(`/api/trials/${trial.id}/${kind}`, entry).then((r) => r);
        // The write statement waits for the close's row lock on the trial (its CTE locks the trial row).
        expect((await waitingOn(close.pid)).query).toContain(`INSERT INTO ${table}`);
        await close.c.query('COMMIT');
        const res = await pending;
        expect(res.status).toBe(409);
        expect(res.body.error).toMatchObject({ code: 'conflict', reason: 'trial_closed' });
        expect(await count(table, trial.id)).toBe(0);
      } finally {
        await close.c.end();
      }
      // Reopen for the next kind.
      expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'active' })).status).toBe(200);
    }
  });

  it('a close that comes while a write holds the trial waits for it: the record is kept and the trial ends closed (every kind)', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    for (const [kind, table, entry] of entries(plots[0]!.id)) {
      // Hold the plot row FOR UPDATE: the write's foreign-key check on plot_id (FOR KEY SHARE) waits for
      // it after the statement has locked the trial row, so the write stops while holding the trial.
      const plotLock = await holder();
      try {
        await plotLock.c.query('BEGIN');
        await plotLock.c.query('SELECT 1 FROM plots WHERE id = $1 FOR UPDATE', [plots[0]!.id]);
        const writing = a.post(`/api/trials/${trial.id}/${kind}`, entry).then((r) => r);
        const write = await waitingOn(plotLock.pid);
        expect(write.query).toContain(`INSERT INTO ${table}`);
        const closing = a.post(`/api/trials/${trial.id}/status`, { status: 'closed' }).then((r) => r);
        // The close waits for the write, not for the plot's holder.
        expect((await waitingOn(write.pid)).query).toContain('FROM trials WHERE id = $1 FOR NO KEY UPDATE');
        await plotLock.c.query('COMMIT');
        const written = await writing;
        expect(written.status).toBe(201);
        expect((await closing).status).toBe(200);
        expect(await count(table, trial.id)).toBe(1);
        expect(await status(trial.id)).toBe('closed');
      } finally {
        await plotLock.c.end();
      }
      expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'active' })).status).toBe(200);
    }
  });

  /** A grower's trial with one 5 L surface watering, and a reader of that record's volume. */
  async function loggedSurfaceWater() {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const created = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: '2026-06-06T07:00:00Z', kind: 'surface', volumeL: 5 });
    expect(created.status).toBe(201);
    const logId = created.body.data.id as string;
    const volume = async () => ((await t.ds.query('SELECT volume_l::float8 AS v FROM water_events WHERE id = $1', [logId])) as { v: number }[])[0]?.v;
    return { a, trial, logId, volume };
  }

  it('an edit or a delete that comes while a close is uncommitted waits for it, then is refused as closed and changes nothing', async () => {
    const { a, trial, logId, volume } = await loggedSurfaceWater();
    for (const change of ['edit', 'delete'] as const) {
      const close = await holder();
      try {
        await close.c.query('BEGIN');
        await close.c.query(`UPDATE trials SET status = 'closed', updated_at = now() WHERE id = $1`, [trial.id]);
        const pending = (change === 'edit' ? a.patch(`/api/water-events/${logId}`, { volumeL: 7 }) : a.delete(`/api/water-events/${logId}`)).then((r) => r);
        // Its first statement locks the log's trial row and waits for the close.
        expect((await waitingOn(close.pid)).query).toContain('FROM trials t WHERE t.id = (SELECT l.trial_id FROM water_events l');
        await close.c.query('COMMIT');
        const res = await pending;
        expect(res.status).toBe(409);
        expect(res.body.error).toMatchObject({ code: 'conflict', reason: 'trial_closed' });
        expect(await volume()).toBe(5);
      } finally {
        await close.c.end();
      }
      expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'active' })).status).toBe(200);
    }
  });

  it('a close that comes while an edit or a delete holds the trial waits for it: the change is kept and the trial ends closed', async () => {
    const { a, trial, logId, volume } = await loggedSurfaceWater();
    for (const change of ['edit', 'delete'] as const) {
      // Hold the log row: the edit (SELECT … FOR UPDATE OF l) or the delete (DELETE) waits for it after
      // its first statement has locked the trial row.
      const logLock = await holder();
      try {
        await logLock.c.query('BEGIN');
        await logLock.c.query('SELECT 1 FROM water_events WHERE id = $1 FOR UPDATE', [logId]);
        const changing = (change === 'edit' ? a.patch(`/api/water-events/${logId}`, { volumeL: 7 }) : a.delete(`/api/water-events/${logId}`)).then((r) => r);
        const changer = await waitingOn(logLock.pid);
        expect(changer.query).toContain(change === 'edit' ? 'FOR UPDATE OF l' : 'DELETE FROM water_events');
        const closing = a.post(`/api/trials/${trial.id}/status`, { status: 'closed' }).then((r) => r);
        expect((await waitingOn(changer.pid)).query).toContain('FROM trials WHERE id = $1 FOR NO KEY UPDATE');
        await logLock.c.query('COMMIT');
        expect((await changing).status).toBe(change === 'edit' ? 200 : 204);
        expect((await closing).status).toBe(200);
        expect(await volume()).toBe(change === 'edit' ? 7 : undefined);
        expect(await status(trial.id)).toBe('closed');
      } finally {
        await logLock.c.end();
      }
      if (change === 'edit') expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'active' })).status).toBe(200);
    }
  });

  it('two writes to one trial at once both land (the trial lock is taken once, never upgraded, so they queue instead of deadlocking)', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    // Hold the plot row so the first write stops holding the trial row; the second write queues behind it.
    const plotLock = await holder();
    try {
      await plotLock.c.query('BEGIN');
      await plotLock.c.query('SELECT 1 FROM plots WHERE id = $1 FOR UPDATE', [plots[0]!.id]);
      const [first, second] = entries(plots[0]!.id);
      const one = a.post(`/api/trials/${trial.id}/${first[0]}`, first[2]).then((r) => r);
      const holding = await waitingOn(plotLock.pid);
      const two = a.post(`/api/trials/${trial.id}/${second[0]}`, second[2]).then((r) => r);
      expect((await waitingOn(holding.pid)).query).toContain(`INSERT INTO ${second[1]}`);
      await plotLock.c.query('COMMIT');
      expect((await one).status).toBe(201);
      expect((await two).status).toBe(201);
      expect(await count(first[1], trial.id)).toBe(1);
      expect(await count(second[1], trial.id)).toBe(1);
    } finally {
      await plotLock.c.end();
    }
  });

  it('a pot deleted while a refill naming it holds the trial: the delete waits for the trial first, so the refill lands and neither deadlocks', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const plot = plots[0]!;
    const pot = (await a.post('/api/pots', { label: 'Pot D', capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'wheel_thrown', plotId: plot.id })).body.data;
    const first = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plot.id, potId: pot.id, occurredAt: '2026-06-04T07:00:00Z', kind: 'olla_refill', volumeL: 6 });
    expect(first.status).toBe(201);
    // A refill in flight: it holds its trial (TRIAL_WRITE_LOCK) and has not yet named the pot.
    const refill = await holder();
    try {
      await refill.c.query('BEGIN');
      await refill.c.query('SELECT 1 FROM trials WHERE id = $1 FOR NO KEY UPDATE', [trial.id]);
      const pending = a.delete(`/api/pots/${pot.id}`).then((r) => r);
      // The delete waits for the trial row before it touches the pot ...
      expect((await waitingOn(refill.pid)).query).toContain('FROM trials');
      // ... so the refill can still name the pot (its foreign-key check locks the pot row). With the
      // pot deleted first this insert would wait for the delete while the delete waits for the trial.
      await refill.c.query(`INSERT INTO water_events (trial_id, plot_id, pot_id, occurred_at, kind, volume_l) VALUES ($1, $2, $3, '2026-06-05T07:00:00Z', 'olla_refill', 5)`, [trial.id, plot.id, pot.id]);
      await refill.c.query('COMMIT');
      const res = await pending;
      expect(res.status).toBe(204);
    } finally {
      await refill.c.end();
    }
    // Both refills stay in the trial, without their deleted pot.
    const rows = (await t.ds.query('SELECT volume_l, pot_id FROM water_events WHERE trial_id = $1 ORDER BY occurred_at', [trial.id])) as { volume_l: number; pot_id: string | null }[];
    expect(rows).toEqual([
      { volume_l: 6, pot_id: null },
      { volume_l: 5, pot_id: null },
    ]);
  });
});
