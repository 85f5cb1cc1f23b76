import { formatDateTime } from '@/lib/format';
import { useAudit } from '../api/get-audit';

function describe(changes: Record<string, unknown>): string {
  return Object.entries(changes)
    .map(([k, v]) => (Array.isArray(v) && v.length === 2 ? `${k}: ${JSON.stringify(v[0])} → ${JSON.stringify(v[1])}` : `${k}: ${JSON.stringify(v)}`))
    .join('; ');
}

/** Who changed what in this trial while it was closed or shared. */
export function AuditList({ trialId }: { trialId: string }) {
  const audit = useAudit(trialId);
  if (audit.isPending) return <p role="status">Loading the history…</p>;
  const rows = audit.data ?? [];
  return (
    <section aria-labelledby="audit-heading" className="space-y-3">
      <h2 id="audit-heading">History of changes</h2>
      <p className="text-sm text-ink-muted">Status changes, and every edit or deletion made while the trial was closed or shared with a cohort.</p>
      {rows.length === 0 ? (
        <p className="text-sm">Nothing recorded yet.</p>
      ) : (
        <ol className="space-y-2">
          {rows.map((r) => (
            <li key={r.id} className="rounded-lg border border-sand-200 bg-white px-3 py-2 text-sm">
              <span className="font-medium">{formatDateTime(r.at)}</span> · {r.actor ?? 'someone'} · {r.action} {r.entityType.replace('_', ' ')}
              <p className="break-words text-ink-muted">{describe(r.changes)}</p>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
