import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import enTrials from '@/locales/en/trials.json';
import { formatDate, formatDateTime, formatNumber } from '@/lib/format';
import { useAudit } from '../api/get-audit';

type Field = keyof typeof enTrials.audit.fields;
const isField = (k: string): k is Field => Object.hasOwn(enTrials.audit.fields, k);
const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;
const ISO_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;

/** One recorded value in the reader's language: dates and numbers formatted, yes/no, known codes translated. */
function valueText(t: TFunction<'trials'>, key: string, v: unknown): string {
  if (v === null || v === undefined || v === '') return t(($) => $.audit.empty);
  if (typeof v === 'boolean') return v ? t(($) => $.audit.yes) : t(($) => $.audit.no);
  if (typeof v === 'number') return formatNumber(v, 3);
  if (Array.isArray(v)) return v.map((x) => valueText(t, key, x)).join(', ');
  if (typeof v === 'string') {
    if (key === 'status' && (v === 'draft' || v === 'active' || v === 'closed')) return t(($) => $.status[v]);
    if ((key === 'treatment' || key === 'treatments') && (v === 'olla' || v === 'surface')) return t(($) => $.treatments[v]);
    if (ISO_TIME.test(v)) return formatDateTime(v);
    if (ISO_DAY.test(v)) return formatDate(v);
    return `“${v}”`;
  }
  return JSON.stringify(v);
}

/** A field's name in the reader's language; an unknown one ("someField") split into words. */
function fieldText(t: TFunction<'trials'>, key: string): string {
  return isField(key) ? t(($) => $.audit.fields[key]) : key.replace(/([a-z])([A-Z])/g, '$1 $2').replace(/_/g, ' ').toLowerCase();
}

/** Updates and status changes record { field: [before, after] }; creations and deletions the record itself. */
function describe(t: TFunction<'trials'>, action: string, changes: Record<string, unknown>): string {
  const pairs = action === 'update' || action === 'status';
  return Object.entries(changes)
    .map(([k, v]) =>
      pairs && Array.isArray(v) && v.length === 2
        ? t(($) => $.audit.change, { field: fieldText(t, k), before: valueText(t, k, v[0]), after: valueText(t, k, v[1]) })
        : t(($) => $.audit.value, { field: fieldText(t, k), value: valueText(t, k, v) }),
    )
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
              <p className="break-words text-ink-muted">{describe(t, r.action, r.changes)}</p>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
