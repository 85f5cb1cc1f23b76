import type { EntityManager } from 'typeorm';
import type { AuditEntryEntity } from '../entities/audit-entry.entity';

/** Field-by-field differences between two records: { field: [before, after] }. */
export function diff(before: Record<string, unknown>, after: Record<string, unknown>): Record<string, [unknown, unknown]> {
  const out: Record<string, [unknown, unknown]> = {};
  for (const key of Object.keys(after)) {
    const a = before[key] instanceof Date ? (before[key] as Date).toISOString() : before[key];
    const b = after[key] instanceof Date ? (after[key] as Date).toISOString() : after[key];
    if (JSON.stringify(a) !== JSON.stringify(b)) out[key] = [a, b];
  }
  return out;
}

/** Whether edits to this trial must be audited: it is closed, or shared into a cohort. */
export async function mustAudit(em: EntityManager, trialId: string): Promise<boolean> {
  const [row] = (await em.query(
    `SELECT t.status = 'closed' OR EXISTS (SELECT 1 FROM trial_shares s WHERE s.trial_id = t.id AND s.withdrawn_at IS NULL) AS audit
       FROM trials t WHERE t.id = $1`,
    [trialId],
  )) as { audit: boolean }[];
  return row?.audit ?? false;
}

export async function writeAudit(
  em: EntityManager,
  entry: { trialId: string; actorId: string; action: AuditEntryEntity['action']; entityType: string; entityId: string; changes: Record<string, unknown> },
) {
  await em.query(`INSERT INTO audit_entries (trial_id, actor_id, action, entity_type, entity_id, changes) VALUES ($1, $2, $3, $4, $5, $6)`, [
    entry.trialId,
    entry.actorId,
    entry.action,
    entry.entityType,
    entry.entityId,
    JSON.stringify(entry.changes),
  ]);
}
