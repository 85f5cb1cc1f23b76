/**
 * The send ledger (table notification_sends): what makes notification e-mails idempotent.
 *
 * One row per (user, kind, subject, day), enforced by the unique index notification_sends_key.
 * A sender first claims its items (insert 'pending', or take over a claim that was released or
 * has been 'pending' longer than STALE_CLAIM_MS), sends one e-mail with the items it won, then
 * marks them 'sent'. A second sender, a retried job or a re-run sweep finds the rows and skips
 * them. A failed send releases its claims so the retry can take them at once.
 *
 * The one window left: a crash after the e-mail went out and before it was marked sent. The
 * claim then goes stale and the items are sent again after 15 minutes (at least once, never
 * silently lost).
 */
import type { NotificationKind } from '@shared/schemas/notifications';
import type { DataSource } from 'typeorm';
import { STALE_CLAIM_MS } from './queues';

export interface LedgerItem {
  subjectKey: string;
  /** YYYY-MM-DD */
  day: string;
  payload: Record<string, unknown>;
}

export interface Claim {
  id: string;
  subjectKey: string;
  day: string;
}

/** Claims the items not yet sent nor freshly claimed by someone else; returns those won. */
export async function claimItems(ds: DataSource, userId: string, kind: NotificationKind, items: LedgerItem[], now: Date): Promise<Claim[]> {
  const unique = [...new Map(items.map((i) => [`${i.subjectKey}|${i.day}`, i])).values()];
  if (!unique.length) return [];
  const rows = (await ds.query(
    `INSERT INTO notification_sends (user_id, kind, subject_key, day, status, claimed_at, attempts, payload)
     SELECT $1, $2, k.subject_key, k.day, 'pending', $3, 1, k.payload
       FROM jsonb_to_recordset($4::jsonb) AS k(subject_key text, day date, payload jsonb)
     ON CONFLICT (user_id, kind, subject_key, day) DO UPDATE
        SET claimed_at = EXCLUDED.claimed_at, attempts = notification_sends.attempts + 1, payload = EXCLUDED.payload
      WHERE notification_sends.status = 'pending'
        AND (notification_sends.claimed_at IS NULL OR notification_sends.claimed_at < $5)
     RETURNING id, subject_key AS "subjectKey", to_char(day, 'YYYY-MM-DD') AS day`,
    [userId, kind, now, JSON.stringify(unique.map((i) => ({ subject_key: i.subjectKey, day: i.day, payload: i.payload }))), new Date(now.getTime() - STALE_CLAIM_MS)],
  )) as Claim[];
  return rows;
}

export async function markSent(ds: DataSource, claims: Claim[], now: Date): Promise<void> {
  if (!claims.length) return;
  await ds.query(`UPDATE notification_sends SET status = 'sent', sent_at = $2 WHERE id = ANY($1::uuid[])`, [claims.map((c) => c.id), now]);
}

/** Gives claims back after a failed send, so the next attempt takes them without waiting. */
export async function releaseClaims(ds: DataSource, claims: Claim[]): Promise<void> {
  if (!claims.length) return;
  await ds.query(`UPDATE notification_sends SET claimed_at = NULL WHERE id = ANY($1::uuid[]) AND status = 'pending'`, [claims.map((c) => c.id)]);
}

/**
 * Users with at least one item that is neither sent nor freshly claimed: the ones a sweep must
 * enqueue. Keeps a sweep that runs every 15 minutes from queueing work that would do nothing.
 */
export async function usersWithOpenItems(ds: DataSource, kind: NotificationKind, items: { userId: string; subjectKey: string; day: string }[], now: Date): Promise<string[]> {
  if (!items.length) return [];
  const settled = (await ds.query(
    `SELECT s.user_id AS "userId", s.subject_key AS "subjectKey", to_char(s.day, 'YYYY-MM-DD') AS day
       FROM notification_sends s
       JOIN jsonb_to_recordset($2::jsonb) AS k(user_id uuid, subject_key text, day date)
         ON s.user_id = k.user_id AND s.subject_key = k.subject_key AND s.day = k.day
      WHERE s.kind = $1 AND (s.status = 'sent' OR s.claimed_at >= $3)`,
    [kind, JSON.stringify(items.map((i) => ({ user_id: i.userId, subject_key: i.subjectKey, day: i.day }))), new Date(now.getTime() - STALE_CLAIM_MS)],
  )) as { userId: string; subjectKey: string; day: string }[];
  const done = new Set(settled.map((s) => `${s.userId}|${s.subjectKey}|${s.day}`));
  return [...new Set(items.filter((i) => !done.has(`${i.userId}|${i.subjectKey}|${i.day}`)).map((i) => i.userId))];
}

/** The payload of the latest sent item of a subject before `day` (the previous digest's flags). */
export async function previousPayload(ds: DataSource, userId: string, kind: NotificationKind, subjectKey: string, day: string): Promise<Record<string, unknown> | null> {
  const rows = (await ds.query(
    `SELECT payload FROM notification_sends WHERE user_id = $1 AND kind = $2 AND subject_key = $3 AND day < $4 AND status = 'sent' ORDER BY day DESC LIMIT 1`,
    [userId, kind, subjectKey, day],
  )) as { payload: Record<string, unknown> }[];
  return rows[0]?.payload ?? null;
}
