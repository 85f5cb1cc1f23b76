/**
 * The notification jobs, callable directly with an explicit `now` (tests, scripts) or from
 * pg-boss (runner.ts):
 *
 * - runRefillSweep / runFrostSweep / runDigestSweep find the users with something to hear
 *   about that the ledger has not settled yet, and enqueue one send job per user and kind.
 * - sendUserNotifications recomputes that user's items at its own `now`, claims them in the
 *   ledger, sends one grouped e-mail with the items it won and marks them sent.
 */
import { getCaution } from '@shared/content/cautions';
import type { NotificationKind } from '@shared/schemas/notifications';
import { notificationTemplates, type MailContent, type NoticeFooter } from '../mail/templates';
import {
  digestCohorts,
  dueRefills,
  frostGardens,
  recipientSql,
  unsubscribeHref,
  weekOf,
  type DigestCohort,
  type NotificationContext,
} from '../services/reminders.service';
import type { Enqueue, SendJob } from './queues';
import { claimItems, markSent, previousPayload, releaseClaims, usersWithOpenItems, type Claim, type LedgerItem } from './send-ledger';

export interface SendResult {
  /** Items this call won in the ledger (0: nothing new, or someone else has them). */
  claimed: number;
  sent: boolean;
}

export interface SweepResult {
  /** Items found due, sent or not. */
  due: number;
  /** Users handed on to a send job. */
  users: number;
}

interface Recipient {
  id: string;
  email: string;
  displayName: string;
  language: 'en' | 'es';
  unitSystem: 'metric' | 'us';
}

/** The user, when they may get this kind by e-mail now: confirmed address, not disabled, kind on. */
async function recipient(ctx: NotificationContext, userId: string, kind: NotificationKind): Promise<Recipient | null> {
  const rows = (await ctx.ds.query(
    `SELECT u.id, u.email, u.display_name AS "displayName", u.language, u.unit_system AS "unitSystem"
       FROM users u LEFT JOIN notification_preferences np ON np.user_id = u.id
      WHERE u.id = $1 AND ${recipientSql(kind)}`,
    [userId],
  )) as Recipient[];
  return rows[0] ?? null;
}

function footer(ctx: NotificationContext, userId: string, kind: NotificationKind): NoticeFooter {
  return { unsubscribeHref: unsubscribeHref(ctx, userId, kind), preferencesHref: `${ctx.publicUrl}/account` };
}

const won = (claims: Claim[]) => {
  const keys = new Set(claims.map((c) => `${c.subjectKey}|${c.day}`));
  return (subjectKey: string, day: string) => keys.has(`${subjectKey}|${day}`);
};

const round1 = (v: number) => Math.round(v * 10) / 10;

/** What one kind of e-mail holds for a user: ledger items and how to write the message from the ones won. */
async function compose(ctx: NotificationContext, user: Recipient, kind: NotificationKind, now: Date): Promise<{ items: LedgerItem[]; write: (claims: Claim[]) => MailContent | null }> {
  const foot = footer(ctx, user.id, kind);
  if (kind === 'refill') {
    const due = await dueRefills(ctx.ds, now, user.id);
    return {
      items: due.map((d) => ({ subjectKey: d.potId, day: d.day, payload: { trialId: d.trialId, levelPct: round1(d.levelPct), levelL: round1(d.levelL), thresholdPct: d.thresholdPct } })),
      write(claims) {
        const isWon = won(claims);
        const pots = due.filter((d) => isWon(d.potId, d.day));
        if (!pots.length) return null;
        return notificationTemplates.refillReminder(
          user.language,
          user.unitSystem,
          user.displayName,
          pots[0]!.thresholdPct,
          pots.map((p) => ({
            potLabel: p.potLabel,
            trialTitle: p.trialTitle,
            gardenName: p.gardenName,
            levelPct: p.levelPct,
            levelL: p.levelL,
            dryOn: p.dryOn,
            dry: p.dry,
            basis: p.basis,
            loggedHref: `${ctx.publicUrl}/trials/${p.trialId}/round?pot=${p.potId}`,
          })),
          foot,
        );
      },
    };
  }

  if (kind === 'frost') {
    const gardens = await frostGardens(ctx.ds, now, { userId: user.id, recipientsOnly: true });
    return {
      items: gardens.flatMap((g) => g.nights.map((n) => ({ subjectKey: g.gardenId, day: n.day, payload: { tMinC: n.tMinC, forecast: n.forecast } }))),
      write(claims) {
        const isWon = won(claims);
        const warned = gardens.map((g) => ({ ...g, nights: g.nights.filter((n) => isWon(g.gardenId, n.day)) })).filter((g) => g.nights.length);
        if (!warned.length) return null;
        const caution = getCaution('frost');
        return notificationTemplates.frostWarning(
          user.language,
          user.unitSystem,
          user.displayName,
          warned.map((g) => ({ gardenName: g.gardenName, potsInGround: g.potsInGround, nights: g.nights })),
          { body: caution.body[user.language], defersTo: caution.defersTo[user.language] },
          foot,
        );
      },
    };
  }

  // Weekly digest: one item per cohort per week; flags are "new" when the previous digest did not carry them.
  const week = weekOf(now);
  const cohorts = await digestCohorts(ctx, now, { leadId: user.id, flags: true });
  const prepared: { cohort: DigestCohort; flags: string[]; newFlags: Set<string> }[] = [];
  for (const cohort of cohorts) {
    const flags = cohort.trials.flatMap((t) => t.flags.map((f) => f.key));
    const before = await previousPayload(ctx.ds, user.id, 'digest', cohort.cohortId, week);
    const seen = new Set(Array.isArray(before?.flags) ? (before.flags as string[]) : []);
    prepared.push({ cohort, flags, newFlags: new Set(flags.filter((f) => !seen.has(f))) });
  }
  return {
    items: prepared.map((p) => ({
      subjectKey: p.cohort.cohortId,
      day: week,
      payload: { flags: p.flags, entries: p.cohort.trials.reduce((s, t) => s + t.entries, 0), quiet: p.cohort.trials.filter((t) => t.quiet).length },
    })),
    write(claims) {
      const isWon = won(claims);
      const sent = prepared.filter((p) => isWon(p.cohort.cohortId, week));
      if (!sent.length) return null;
      return notificationTemplates.weeklyDigest(
        user.language,
        user.displayName,
        now.toISOString().slice(0, 10),
        sent.map(({ cohort, newFlags }) => ({
          cohortName: cohort.cohortName,
          href: `${ctx.publicUrl}/cohorts/${cohort.cohortId}`,
          trialsShared: cohort.trials.length,
          active: cohort.trials.filter((t) => t.entries > 0).map((t) => ({ label: t.label, entries: t.entries })),
          quiet: cohort.trials.filter((t) => t.quiet).map((t) => ({ label: t.label, lastLogOn: t.lastLogAt ? new Date(t.lastLogAt).toISOString().slice(0, 10) : null })),
          newFlags: cohort.trials.flatMap((t) => t.flags.filter((f) => newFlags.has(f.key)).map((f) => ({ label: t.label, kind: f.kind, message: f.message }))),
        })),
        foot,
      );
    },
  };
}

/**
 * Sends one user's e-mail of one kind: recompute the items at `now`, claim them, send one
 * message with the items won, mark them sent. Safe to call any number of times: items already
 * sent (or being sent) are skipped by the ledger's unique key. A failed send releases the
 * claims and throws, so pg-boss retries the job.
 */
export async function sendUserNotifications(ctx: NotificationContext, job: SendJob, now: Date = ctx.now()): Promise<SendResult> {
  const user = await recipient(ctx, job.userId, job.kind);
  if (!user) return { claimed: 0, sent: false };
  const { items, write } = await compose(ctx, user, job.kind, now);
  const claims = await claimItems(ctx.ds, user.id, job.kind, items, now);
  if (!claims.length) return { claimed: 0, sent: false };
  const mail = write(claims);
  if (!mail) {
    await releaseClaims(ctx.ds, claims);
    return { claimed: 0, sent: false };
  }
  try {
    await ctx.mailer.send({ to: user.email, ...mail });
  } catch (err) {
    await releaseClaims(ctx.ds, claims);
    throw err;
  }
  await markSent(ctx.ds, claims, now);
  ctx.logger.info({ userId: user.id, kind: job.kind, items: claims.length }, 'notification e-mail sent');
  return { claimed: claims.length, sent: true };
}

/** Hands each user on; one failure does not stop the others, but the sweep reports it (pg-boss retries). */
async function handOn(ctx: NotificationContext, kind: NotificationKind, users: string[], enqueue: Enqueue): Promise<void> {
  const failures: unknown[] = [];
  for (const userId of users) {
    try {
      await enqueue({ userId, kind });
    } catch (err) {
      failures.push(err);
      ctx.logger.warn({ err, userId, kind }, 'notification hand-on failed');
    }
  }
  if (failures.length) throw new Error(`${failures.length} of ${users.length} ${kind} notification(s) could not be handed on; the next run retries them.`);
}

const directly = (ctx: NotificationContext, now: Date): Enqueue => (job) => sendUserNotifications(ctx, job, now);

/** Pots below their owner's threshold today → one refill reminder job per owner with a pot not yet reminded today. */
export async function runRefillSweep(ctx: NotificationContext, now: Date = ctx.now(), enqueue: Enqueue = directly(ctx, now)): Promise<SweepResult> {
  const due = await dueRefills(ctx.ds, now);
  const users = await usersWithOpenItems(
    ctx.ds,
    'refill',
    due.map((d) => ({ userId: d.userId, subjectKey: d.potId, day: d.day })),
    now,
  );
  await handOn(ctx, 'refill', users, enqueue);
  return { due: due.length, users: users.length };
}

/** Gardens with a frost night ahead → one frost warning job per owner with a night not yet warned of. */
export async function runFrostSweep(ctx: NotificationContext, now: Date = ctx.now(), enqueue: Enqueue = directly(ctx, now)): Promise<SweepResult> {
  const gardens = await frostGardens(ctx.ds, now, { recipientsOnly: true });
  const items = gardens.flatMap((g) => g.nights.map((n) => ({ userId: g.userId, subjectKey: g.gardenId, day: n.day })));
  const users = await usersWithOpenItems(ctx.ds, 'frost', items, now);
  await handOn(ctx, 'frost', users, enqueue);
  return { due: items.length, users: users.length };
}

/** Leads of open cohorts with shared trials → one digest job per lead not yet sent this week's. */
export async function runDigestSweep(ctx: NotificationContext, now: Date = ctx.now(), enqueue: Enqueue = directly(ctx, now)): Promise<SweepResult> {
  const week = weekOf(now);
  const cohorts = await digestCohorts(ctx, now, { flags: false });
  const users = await usersWithOpenItems(
    ctx.ds,
    'digest',
    cohorts.map((c) => ({ userId: c.leadId, subjectKey: c.cohortId, day: week })),
    now,
  );
  await handOn(ctx, 'digest', users, enqueue);
  return { due: cohorts.length, users: users.length };
}
