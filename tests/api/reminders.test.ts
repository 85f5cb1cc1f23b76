// Refill reminders, frost warnings, the weekly digest, preferences and unsubscribe links, on a
// real database with pg-boss and the SMTP sink. The clock is the app's test clock; the jobs
// are called with an explicit `now` or drained from pg-boss, never waited for by the clock.
// The 25 % default threshold and "frost at ≤ 0 °C" are common practice, no source.
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { parseEnv } from '../../server/config/env';
import { runDigestSweep, runFrostSweep, runRefillSweep, sendUserNotifications } from '../../server/jobs/notifications';
import { QUEUES, SCHEDULES } from '../../server/jobs/queues';
import { startJobRunner, type JobRunner } from '../../server/jobs/runner';
import { createLogger } from '../../server/lib/logger';
import { createMailer, type Mailer } from '../../server/lib/mailer';
import { unsubscribeToken, type NotificationContext } from '../../server/services/reminders.service';
import type { CapturedMail } from '../../server/infra/smtp-sink';
import { makePairedTrial } from '../helpers/notebook-fixtures';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
let ctx: NotificationContext;
const runners: JobRunner[] = [];

beforeAll(async () => {
  t = await startTestApp();
  ctx = jobContext();
});
afterAll(async () => {
  await t.close();
});
afterEach(async () => {
  while (runners.length) await runners.pop()!.stop();
});
// Sweeps look at every user: earlier tests' growers stop being recipients, so each test hears only its own.
beforeEach(async () => {
  await t.ds.query('UPDATE users SET email_verified_at = NULL');
});

function jobContext(mailer?: Mailer): NotificationContext {
  return {
    ds: t.ds,
    env: parseEnv({ NODE_ENV: 'test', DATABASE_URL: t.databaseUrl, LOG_LEVEL: 'silent' }),
    logger: createLogger('silent'),
    mailer: mailer ?? createMailer(t.sink.url, 'Seepwise <test@seepwise.invalid>'),
    publicUrl: 'http://seepwise.test',
    now: () => t.clock.now ?? new Date(),
  };
}

async function runner(opts: { schedule?: boolean; work?: boolean } = {}) {
  const r = await startJobRunner(ctx, { connectionString: t.databaseUrl, schedule: opts.schedule ?? false, work: opts.work ?? false, pollingIntervalSeconds: 0.5 });
  runners.push(r);
  return r;
}

/** The pot was filled with 10 L at midnight garden time (UTC−7 at −106.7°). */
const FILLED = Date.parse('2026-06-01T07:00:00Z');
const at = (days: number) => new Date(FILLED + days * 86_400_000);

/**
 * A grower with a confirmed address, an active paired trial and one pot filled with 10 L whose
 * seep test lost 4 L over 24 h (4 L/day). The trial's second pot has no refill (level unknown).
 */
async function grower(opts: { verified?: boolean; language?: 'en' | 'es' } = {}) {
  t.clock.now = at(0);
  const a = new ApiAgent(t.app);
  const user = await a.signUp({ email: uniqueEmail('reminders') });
  if (opts.verified !== false) await t.ds.query('UPDATE users SET email_verified_at = now() WHERE id = $1', [user.id]);
  if (opts.language) await t.ds.query('UPDATE users SET language = $2 WHERE id = $1', [user.id, opts.language]);
  const { trial, garden, pots } = await makePairedTrial(a);
  const pot = pots[0] as { id: string; plotId: string; label: string };
  const seep = await a.post(`/api/pots/${pot.id}/seep-tests`, { testedOn: '2026-05-20', setting: 'in_bed', litresLost: 4, hours: 24 });
  expect(seep.status).toBe(201);
  const refill = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: pot.plotId, occurredAt: new Date(FILLED).toISOString(), kind: 'olla_refill', volumeL: 10, potId: pot.id });
  expect(refill.status).toBe(201);
  return { a, user, trial: trial as { id: string }, garden: garden as { id: string }, pot, otherPot: pots[1] as { id: string } };
}

const mailsTo = (email: string, subject: RegExp) => t.sink.messages.filter((m) => m.to.includes(email) && subject.test(m.subject));
const REFILL = /^Refill reminder/;
const FROST = /^Frost warning/;
const DIGEST = /weekly digest/i;

function linkFrom(mail: CapturedMail, prefix: string): string {
  const m = new RegExp(`${prefix.replace(/[.?]/g, '\\$&')}[^\\s"<>]*`).exec(mail.text);
  if (!m) throw new Error(`no link starting ${prefix} in: ${mail.text}`);
  return m[0];
}

describe('refill reminders', () => {
  it('sends nothing at +1 day, one e-mail at +2 days, and no second one when the sweep runs again that day', async () => {
    const g = await grower();
    // +1 day: 10 − 4 = 6 L, 60 % — above the 25 % default.
    t.clock.now = at(1);
    await runRefillSweep(ctx, at(1));
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(0);

    // +2 days: 2 L, 20 % — below.
    const result = await runRefillSweep(ctx, at(2));
    expect(result.users).toBe(1);
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);
    await runRefillSweep(ctx, at(2.2));
    await runRefillSweep(ctx, at(2.4));
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);

    const [mail] = mailsTo(g.user.email, REFILL);
    expect(mail!.subject).toBe('Refill reminder: 1 pot is running low');
    expect(mail!.text).toContain(`${g.pot.label} — Tomatoes 2026 (Back yard): about 20 %, 2.0 L left`);
    const logged = `http://seepwise.test/trials/${g.trial.id}/round?pot=${g.pot.id}`;
    expect(mail!.text).toContain(logged);
    expect(mail!.html).toContain(`href="${logged}"`);
    const unsubscribe = linkFrom(mail!, 'http://seepwise.test/unsubscribe?token=');
    expect(mail!.html).toContain(`href="${unsubscribe}"`);

    const rows = await t.ds.query(`SELECT kind, subject_key, to_char(day, 'YYYY-MM-DD') AS day, status, attempts FROM notification_sends WHERE user_id = $1`, [g.user.id]);
    // Garden day: 2026-06-03T07:00Z is midnight on 3 June at UTC−7.
    expect(rows).toEqual([{ kind: 'refill', subject_key: g.pot.id, day: '2026-06-03', status: 'sent', attempts: 1 }]);

    // The next garden day brings the next reminder (the pot was not refilled).
    await runRefillSweep(ctx, at(3));
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(2);
  });

  it('stops once the unsubscribe link from the e-mail is used, without signing in', async () => {
    const g = await grower();
    await runRefillSweep(ctx, at(2));
    const [mail] = mailsTo(g.user.email, REFILL);
    const token = decodeURIComponent(linkFrom(mail!, 'http://seepwise.test/unsubscribe?token=').split('token=')[1]!);

    const anonymous = new ApiAgent(t.app);
    expect((await anonymous.refreshCsrf()).user).toBeNull();
    const res = await anonymous.post('/api/notifications/unsubscribe', { token });
    expect(res.status).toBe(200);
    expect(res.body.data).toMatchObject({ kind: 'refill' });
    const [prefs] = await t.ds.query('SELECT refill_reminders, frost_warnings, weekly_digest FROM notification_preferences WHERE user_id = $1', [g.user.id]);
    expect(prefs).toEqual({ refill_reminders: false, frost_warnings: true, weekly_digest: true });

    await runRefillSweep(ctx, at(3));
    await runRefillSweep(ctx, at(4));
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);
  });

  it('sends nothing to a grower who unsubscribed before the first reminder', async () => {
    const g = await grower();
    const anonymous = new ApiAgent(t.app);
    await anonymous.refreshCsrf();
    const res = await anonymous.post('/api/notifications/unsubscribe', { token: unsubscribeToken(ctx.env.SESSION_SECRET, g.user.id, 'refill') });
    expect(res.status).toBe(200);
    const result = await runRefillSweep(ctx, at(2));
    expect(result.users).toBe(0);
    expect(await sendUserNotifications(ctx, { userId: g.user.id, kind: 'refill' }, at(2))).toEqual({ claimed: 0, sent: false });
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(0);
    expect(await t.ds.query('SELECT id FROM notification_sends WHERE user_id = $1', [g.user.id])).toEqual([]);
  });

  it('sends only to confirmed e-mail addresses', async () => {
    const g = await grower({ verified: false });
    await runRefillSweep(ctx, at(2));
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(0);
    await t.ds.query('UPDATE users SET email_verified_at = now() WHERE id = $1', [g.user.id]);
    await runRefillSweep(ctx, at(2));
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);
  });

  it('moves the reminder day when the grower changes the threshold', async () => {
    const g = await grower();
    const patch = await g.a.patch('/api/account/notifications', { refillThresholdPct: 65 });
    expect(patch.status).toBe(200);
    // +1 day: 60 % left, below 65 %.
    await runRefillSweep(ctx, at(1));
    const mails = mailsTo(g.user.email, REFILL);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toContain('below your reminder level (65 % of capacity)');
  });

  it('sends nothing while refill reminders are switched off', async () => {
    const g = await grower();
    expect((await g.a.patch('/api/account/notifications', { refillReminders: false })).status).toBe(200);
    await runRefillSweep(ctx, at(2));
    await runRefillSweep(ctx, at(3));
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(0);
    // Switching back on resumes them.
    expect((await g.a.patch('/api/account/notifications', { refillReminders: true })).status).toBe(200);
    await runRefillSweep(ctx, at(3));
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);
  });

  it('groups every low pot of a grower into one e-mail, in Spanish and gallons when the account says so', async () => {
    const g = await grower({ language: 'es' });
    await t.ds.query(`UPDATE users SET unit_system = 'us' WHERE id = $1`, [g.user.id]);
    // The second pot: filled with 10 L at the same time, seeping 4.5 L/day.
    const plot = (await t.ds.query('SELECT plot_id FROM pots WHERE id = $1', [g.otherPot.id]))[0].plot_id as string;
    await g.a.post(`/api/pots/${g.otherPot.id}/seep-tests`, { testedOn: '2026-05-20', setting: 'in_bed', litresLost: 4.5, hours: 24 });
    await g.a.post(`/api/trials/${g.trial.id}/water-events`, { plotId: plot, occurredAt: new Date(FILLED).toISOString(), kind: 'olla_refill', volumeL: 10, potId: g.otherPot.id });
    await runRefillSweep(ctx, at(2));
    const mails = t.sink.messages.filter((m) => m.to.includes(g.user.email) && m.subject.startsWith('Recordatorio'));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toBe('Recordatorio: 2 ollas se están quedando sin agua');
    // 2 L = 0.53 gal (1 US gal = 3.785411784 L, NIST Handbook 44 Appendix C).
    expect(mails[0]!.text).toContain('0,5 gal');
    expect(mails[0]!.text).toContain('Dejar de recibir estos correos: http://seepwise.test/unsubscribe?token=');
    // The pot that runs dry sooner comes first.
    expect(mails[0]!.text.indexOf('Pot 2')).toBeLessThan(mails[0]!.text.indexOf('Pot 1'));
    expect(await t.ds.query(`SELECT count(*)::int AS n FROM notification_sends WHERE user_id = $1 AND status = 'sent'`, [g.user.id])).toEqual([{ n: 2 }]);
  });

  it('escapes what growers typed when it goes into the HTML', async () => {
    const g = await grower();
    await t.ds.query(`UPDATE trials SET title = '<b>Tomatoes</b> & "beans"' WHERE id = $1`, [g.trial.id]);
    await runRefillSweep(ctx, at(2));
    const [mail] = mailsTo(g.user.email, REFILL);
    expect(mail!.html).toContain('&lt;b&gt;Tomatoes&lt;/b&gt; &amp; &quot;beans&quot;');
    expect(mail!.html).not.toContain('<b>Tomatoes</b>');
  });
});

describe('sending exactly once', () => {
  it('sends once when the send runs twice, or twice at the same moment', async () => {
    const g = await grower();
    const job = { userId: g.user.id, kind: 'refill' as const };
    const [first, second] = await Promise.all([sendUserNotifications(ctx, job, at(2)), sendUserNotifications(ctx, job, at(2))]);
    expect([first.sent, second.sent].sort()).toEqual([false, true]);
    expect(await sendUserNotifications(ctx, job, at(2.1))).toEqual({ claimed: 0, sent: false });
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);
  });

  it('still sends exactly once when the app restarts between scheduling and sending', async () => {
    const g = await grower();
    t.clock.now = at(2);
    const before = await runner();
    const swept = await runRefillSweep(ctx, at(2), before.enqueueSend);
    expect(swept.users).toBe(1);
    // The sweep running again before the job ran does not queue a second one.
    await runRefillSweep(ctx, at(2), before.enqueueSend);
    await before.stop();
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(0);

    const after = await runner();
    expect(await after.drain(QUEUES.send)).toBe(1);
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);
    // A job replayed by hand (or a retry) finds the ledger row and sends nothing.
    await after.enqueueSend({ userId: g.user.id, kind: 'refill' });
    expect(await after.drain(QUEUES.send)).toBe(1);
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);
  });

  it('lets the pg-boss workers run a sweep job and the send it queues', async () => {
    const g = await grower();
    t.clock.now = at(2);
    const r = await runner({ work: true });
    await r.boss.send(QUEUES.refillSweep, {});
    const mail = await t.sink.waitFor((m) => m.to.includes(g.user.email) && REFILL.test(m.subject), 20_000);
    expect(mail.text).toContain(`round?pot=${g.pot.id}`);
  });

  it('registers the cron schedules in the database', async () => {
    const r = await runner({ schedule: true });
    const schedules = await r.boss.getSchedules();
    expect(schedules.map((s) => [s.name, s.cron]).sort()).toEqual(SCHEDULES.map((s) => [s.queue, s.cron]).sort());
    expect(SCHEDULES.find((s) => s.queue === QUEUES.digestSweep)!.cron).toBe('0 7 * * 1');
  });

  it('releases the claim when the e-mail fails, so the retry sends it', async () => {
    const g = await grower();
    const failing = jobContext({
      send: () => Promise.reject(new Error('SMTP is down')),
    });
    await expect(sendUserNotifications(failing, { userId: g.user.id, kind: 'refill' }, at(2))).rejects.toThrow('SMTP is down');
    expect(await t.ds.query('SELECT status, claimed_at FROM notification_sends WHERE user_id = $1', [g.user.id])).toEqual([{ status: 'pending', claimed_at: null }]);
    expect(await sendUserNotifications(ctx, { userId: g.user.id, kind: 'refill' }, at(2))).toMatchObject({ sent: true });
    expect(await t.ds.query('SELECT status, attempts FROM notification_sends WHERE user_id = $1', [g.user.id])).toEqual([{ status: 'sent', attempts: 2 }]);
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);
  });

  it("leaves a fresh 'pending' claim alone and retries one older than 15 minutes", async () => {
    const g = await grower();
    const now = at(2);
    await t.ds.query(`INSERT INTO notification_sends (user_id, kind, subject_key, day, status, claimed_at) VALUES ($1, 'refill', $2, '2026-06-03', 'pending', $3)`, [
      g.user.id,
      g.pot.id,
      new Date(now.getTime() - 10 * 60_000),
    ]);
    expect(await sendUserNotifications(ctx, { userId: g.user.id, kind: 'refill' }, now)).toEqual({ claimed: 0, sent: false });
    expect((await runRefillSweep(ctx, now)).users).toBe(0);
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(0);

    const later = new Date(now.getTime() + 6 * 60_000);
    expect(await sendUserNotifications(ctx, { userId: g.user.id, kind: 'refill' }, later)).toMatchObject({ claimed: 1, sent: true });
    expect(mailsTo(g.user.email, REFILL)).toHaveLength(1);
  });

  it('refuses a send job without a user and a kind', async () => {
    const r = await runner();
    await r.boss.send(QUEUES.send, { userId: 'nobody' });
    expect(await r.drain(QUEUES.send)).toBe(1);
    const [job] = await t.ds.query(`SELECT state, output FROM pgboss.job WHERE name = $1 AND data->>'userId' = 'nobody'`, [QUEUES.send]);
    expect(job.state).toBe('retry');
    expect(job.output.message).toContain('needs { userId, kind }');
  });
});

describe('frost warnings', () => {
  async function frostAt(tMinC: number) {
    const g = await grower();
    const frostDay = '2026-10-21';
    t.clock.now = new Date('2026-10-20T18:00:00Z'); // 11:00 on 20 October at the garden
    const put = await g.a.put(`/api/gardens/${g.garden.id}/weather`, { day: frostDay, tMinC, tMaxC: 12, forecast: true });
    expect(put.status).toBe(200);
    await runFrostSweep(ctx, t.clock.now);
    return g;
  }

  it('warns at 0 °C, by e-mail and in the app, once per garden and frost night', async () => {
    const g = await frostAt(0);
    const mails = mailsTo(g.user.email, FROST);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toBe('Frost warning: empty or lift your pots');
    expect(mails[0]!.text).toContain('Back yard (2 pots in the ground): 0.0 °C forecast for 21 October.');
    expect(mails[0]!.text).toContain('Empty the pots, or lift them out of the ground');
    expect(mails[0]!.text).toContain('check your local forecast');
    expect(mails[0]!.text).toContain('http://seepwise.test/unsubscribe?token=');

    const inApp = await g.a.get('/api/frost-warnings');
    expect(inApp.status).toBe(200);
    expect(inApp.body.data).toEqual([{ gardenId: g.garden.id, gardenName: 'Back yard', today: '2026-10-20', nights: [{ day: '2026-10-21', tMinC: 0, forecast: true }], potsInGround: 2 }]);

    await runFrostSweep(ctx, new Date('2026-10-21T08:00:00Z'));
    expect(mailsTo(g.user.email, FROST)).toHaveLength(1);
    // A new frost night is a new warning.
    await g.a.put(`/api/gardens/${g.garden.id}/weather`, { day: '2026-10-23', tMinC: -2, tMaxC: 9, forecast: true });
    await runFrostSweep(ctx, new Date('2026-10-21T08:00:00Z'));
    expect(mailsTo(g.user.email, FROST)).toHaveLength(2);
    expect(mailsTo(g.user.email, FROST)[1]!.text).toContain('-2.0 °C forecast for 23 October');
  });

  it('does not warn at 0.5 °C', async () => {
    const g = await frostAt(0.5);
    expect(mailsTo(g.user.email, FROST)).toHaveLength(0);
    expect((await g.a.get('/api/frost-warnings')).body.data).toEqual([]);
  });

  it('sends nothing when frost warnings are off', async () => {
    const g = await grower();
    await g.a.patch('/api/account/notifications', { frostWarnings: false });
    t.clock.now = new Date('2026-10-20T18:00:00Z');
    await g.a.put(`/api/gardens/${g.garden.id}/weather`, { day: '2026-10-20', tMinC: -4, tMaxC: 8 });
    await runFrostSweep(ctx, t.clock.now);
    expect(mailsTo(g.user.email, FROST)).toHaveLength(0);
    // The app still shows it.
    expect((await g.a.get('/api/frost-warnings')).body.data).toHaveLength(1);
  });
});

describe('weekly digest for cohort leads', () => {
  it('reports new entries, quiet trials and new flags, once a week', async () => {
    const lead = new ApiAgent(t.app);
    const leadUser = await lead.signUp({ email: uniqueEmail('lead'), role: 'educator' });
    await t.ds.query('UPDATE users SET email_verified_at = now() WHERE id = $1', [leadUser.id]);
    const busy = await grower(); // logged a refill on 1 June
    const quiet = await grower();
    const closed = await grower();
    const [cohort] = await t.ds.query(`INSERT INTO cohorts (name, lead_id, join_code) VALUES ('Dryland class', $1, 'DIGEST01') RETURNING id`, [leadUser.id]);
    for (const [i, g] of [busy, quiet, closed].entries()) {
      await t.ds.query(`INSERT INTO cohort_memberships (cohort_id, user_id, role, pseudonym) VALUES ($1, $2, 'contributor', $3)`, [cohort.id, g.user.id, `Grower D${i + 1}`]);
      await t.ds.query(`INSERT INTO trial_shares (trial_id, cohort_id, shared_at) VALUES ($1, $2, '2026-05-01T00:00:00Z')`, [g.trial.id, cohort.id]);
    }
    // The quiet grower's only entry is older than a week; the closed trial has no harvest.
    await t.ds.query(`UPDATE water_events SET occurred_at = '2026-05-20T07:00:00Z' WHERE trial_id = $1`, [quiet.trial.id]);
    await t.ds.query(`UPDATE trials SET status = 'closed' WHERE id = $1`, [closed.trial.id]);

    const monday = new Date('2026-06-08T07:00:00Z');
    await t.ds.query(`UPDATE water_events SET occurred_at = '2026-06-05T07:00:00Z' WHERE trial_id = $1`, [busy.trial.id]);
    await runDigestSweep(ctx, monday);
    await runDigestSweep(ctx, new Date('2026-06-10T07:00:00Z'));
    const mails = mailsTo(leadUser.email, DIGEST);
    expect(mails).toHaveLength(1);
    const text = mails[0]!.text;
    expect(mails[0]!.subject).toBe('Seepwise weekly digest: 1 new entry in your cohorts');
    expect(text).toContain('DRYLAND CLASS');
    expect(text).toContain('Grower D1 — Tomato: 1 new entry');
    expect(text).toContain('Grower D2 — Tomato: last entry on 20 May');
    // The cohort Results' own quality flags.
    expect(text).toContain('New quality flags:\n\n- Grower D3 — Tomato: The trial was closed without any harvest record.');
    // Pseudonyms only: no grower's name or trial title reaches the lead.
    expect(text).not.toContain('Tomatoes 2026');
    expect(text).not.toContain(busy.user.email.split('@')[0]);
    expect(text).toContain(`http://seepwise.test/cohorts/${cohort.id}`);
    expect(text).toContain('http://seepwise.test/unsubscribe?token=');

    // The next week: the same flags are no longer new.
    await runDigestSweep(ctx, new Date('2026-06-15T07:00:00Z'));
    const next = mailsTo(leadUser.email, DIGEST);
    expect(next).toHaveLength(2);
    expect(next[1]!.text).not.toContain('closed without any harvest record');
    expect(next[1]!.text).toContain('Grower D2 — Tomato: last entry on 20 May');
  });
});

describe('GET/PATCH /api/account/notifications', () => {
  it('starts from the defaults and changes only the fields sent', async () => {
    const g = await grower();
    expect((await g.a.get('/api/account/notifications')).body.data).toEqual({ refillReminders: true, refillThresholdPct: 25, frostWarnings: true, weeklyDigest: true });
    const res = await g.a.patch('/api/account/notifications', { weeklyDigest: false });
    expect(res.body.data).toEqual({ refillReminders: true, refillThresholdPct: 25, frostWarnings: true, weeklyDigest: false });
    await g.a.patch('/api/account/notifications', { refillThresholdPct: 40 });
    const [row] = await t.ds.query('SELECT refill_reminders, refill_threshold_pct, frost_warnings, weekly_digest FROM notification_preferences WHERE user_id = $1', [g.user.id]);
    expect(row).toEqual({ refill_reminders: true, refill_threshold_pct: 40, frost_warnings: true, weekly_digest: false });
  });

  it.each([
    [{ refillThresholdPct: 3 }, 'refillThresholdPct'],
    [{ refillThresholdPct: 95 }, 'refillThresholdPct'],
    [{ refillThresholdPct: 25.5 }, 'refillThresholdPct'],
    [{ refillThresholdPct: '30' }, 'refillThresholdPct'],
    [{ frostWarnings: 'no' }, 'frostWarnings'],
  ])('refuses %j with a message on %s and writes nothing', async (body, field) => {
    const g = await grower();
    const res = await g.a.patch('/api/account/notifications', body);
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(field);
    expect(await t.ds.query('SELECT user_id FROM notification_preferences WHERE user_id = $1', [g.user.id])).toEqual([]);
  });

  it('needs a session', async () => {
    const anonymous = new ApiAgent(t.app);
    await anonymous.refreshCsrf();
    expect((await anonymous.get('/api/account/notifications')).status).toBe(401);
    expect((await anonymous.patch('/api/account/notifications', { frostWarnings: false })).status).toBe(401);
  });
});

describe('POST /api/notifications/unsubscribe', () => {
  it.each([
    ['garbage', 'not-a-token'],
    ['a tampered signature', 'tamper'],
    ['another kind on the same signature', 'swap'],
    ['an empty token', ''],
  ])('refuses %s with 400 and writes nothing', async (_what, kind) => {
    const g = await grower();
    const good = unsubscribeToken(ctx.env.SESSION_SECRET, g.user.id, 'refill');
    const token = kind === 'tamper' ? `${good.slice(0, -2)}xx` : kind === 'swap' ? good.replace('.refill.', '.frost.') : kind;
    const anonymous = new ApiAgent(t.app);
    await anonymous.refreshCsrf();
    const res = await anonymous.post('/api/notifications/unsubscribe', { token });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain('token');
    expect(await t.ds.query('SELECT user_id FROM notification_preferences WHERE user_id = $1', [g.user.id])).toEqual([]);
  });

  it('turns off only the kind of the link, and can be used twice', async () => {
    const g = await grower();
    const anonymous = new ApiAgent(t.app);
    await anonymous.refreshCsrf();
    const token = unsubscribeToken(ctx.env.SESSION_SECRET, g.user.id, 'digest');
    expect((await anonymous.post('/api/notifications/unsubscribe', { token })).body.data.kind).toBe('digest');
    expect((await anonymous.post('/api/notifications/unsubscribe', { token })).status).toBe(200);
    expect((await g.a.get('/api/account/notifications')).body.data).toEqual({ refillReminders: true, refillThresholdPct: 25, frostWarnings: true, weeklyDigest: false });
  });
});

describe('GET /api/trials/:trialId/forecast', () => {
  it("lists the trial's pots most urgent first, with level, litres left, dry-at and basis", async () => {
    const g = await grower();
    t.clock.now = at(1);
    const res = await g.a.get(`/api/trials/${g.trial.id}/forecast`);
    expect(res.status).toBe(200);
    const data = res.body.data;
    expect(data).toMatchObject({ trialId: g.trial.id, thresholdPct: 25, et0: { source: 'default', mmPerDay: 5, days: 0 } });
    expect(data.pots).toHaveLength(2);
    expect(data.pots[0]).toMatchObject({ potId: g.pot.id, basis: 'seep-test', dailyDrawL: 4, levelL: 6, levelPct: 60, belowThreshold: false, dryAt: at(2.5).toISOString(), lastRefillL: 10, note: null, noteCode: null });
    // The pot without a refill comes last, with the reason.
    expect(data.pots[1]).toMatchObject({ potId: g.otherPot.id, basis: 'crop-need', levelL: null, note: expect.stringContaining('No refill logged yet'), noteCode: 'no_refill' });
    // Tomato 32 days after planting, 2 days into development: Kc = 0.6 + (2 / 40)(1.15 − 0.6) (FAO-56 Table 12
    // and eq. 66; stage lengths as in crop-coefficients.ts) × 5 mm/day × the wetted circle π (0.28 m)².
    expect(data.pots[1].dailyDrawL).toBeCloseTo((0.6 + (2 / 40) * 0.55) * 5 * Math.PI * 0.28 ** 2, 9);
  });

  it("is the owner's only", async () => {
    const g = await grower();
    const other = new ApiAgent(t.app);
    await other.signUp({ email: uniqueEmail('other') });
    expect((await other.get(`/api/trials/${g.trial.id}/forecast`)).status).toBe(404);
  });
});
