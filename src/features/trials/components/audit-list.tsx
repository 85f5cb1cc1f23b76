import { useTranslation } from 'react-i18next';
import { formatDateTime } from '@/lib/format';
import { useAudit } from '../api/get-audit';

function describe(changes: Record<string, unknown>): string {
  return Object.entries(changes)
    .map(([k, v]) => (Array.isArray(v) && v.length === 2 ? `${k}: ${JSON.stringify(v[0])} → ${JSON.stringify(v[1])}` : `${k}: ${JSON.stringify(v)}`))
    .join('; ');
}

/** Who changed what in this trial while it was closed or shared. */
export function AuditList({ trialId }: { trialId: string }) {
  const { t } = useTranslation('trials');
  const audit = useAudit(trialId);
  if (audit.isPending) return <p role="status">{t(($) => $.audit.loading)}</p>;
  const rows = audit.data ?? [];
  const actions = ['create', 'update', 'delete', 'status'] as const;
  const entities = ['trial', 'plot', 'water_event', 'moisture_reading', 'harvest', 'observation'] as const;
  const actionText = (a: string) => {
    const known = actions.find((x) => x === a);
    return known ? t(($) => $.audit.actions[known]) : a;
  };
  const entityText = (e: string) => {
    const known = entities.find((x) => x === e);
    return known ? t(($) => $.audit.entities[known]) : e.replace('_', ' ');
  };
  return (
    <section aria-labelledby="audit-heading" className="space-y-3">
      <h2 id="audit-heading">{t(($) => $.audit.title)}</h2>
      <p className="text-sm text-ink-muted">{t(($) => $.audit.intro)}</p>
      {rows.length === 0 ? (
        <p className="text-sm">{t(($) => $.audit.none)}</p>
      ) : (
        <ol className="space-y-2">
          {rows.map((r) => (
            <li key={r.id} className="rounded-lg border border-sand-200 bg-white px-3 py-2 text-sm">
              <span className="font-medium">{formatDateTime(r.at)}</span> · {r.actor ?? t(($) => $.audit.someone)} · {actionText(r.action)} {entityText(r.entityType)}
              <p className="break-words text-ink-muted">{describe(r.changes)}</p>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
