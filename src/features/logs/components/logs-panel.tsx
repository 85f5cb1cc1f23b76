import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { logKinds, type LogKind } from '@shared/schemas/logs';
import type { Plot } from '@shared/schemas/plots';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { InputField, SelectField } from '@/components/ui/field';
import { formatDate, formatDateTime, formatNumber } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { cn } from '@/lib/utils';
import { useLogs, type LogRow } from '../api/get-logs';
import { useDeleteLog } from '../api/log-mutations';
import { logColumns } from './log-columns';
import { LogEditRow } from './log-edit-row';
import { LogForm } from './log-form';
import { ObservationPhotos } from './observation-photos';

const PAGE_SIZE = 25;

const waterKinds = ['olla_refill', 'surface'] as const;
const sources = ['mains', 'rainwater', 'well', 'greywater', 'other'] as const;
const methods = ['vwc', 'tensiometer', 'probe_index'] as const;
const known = <T extends string>(list: readonly T[], v: unknown): T | undefined => list.find((x) => x === v);

/** A stored value as the reader sees it: dates, numbers and the enum values in their language. */
function cellText(row: LogRow, field: string, t: TFunction<'logs'>, timeZone: string): string {
  const v = row[field];
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'boolean') return v ? t(($) => $.yes) : t(($) => $.no);
  // Times show on the garden's clock, so the day beside a record is the day it counts on.
  if (field.endsWith('At')) return formatDateTime(String(v), timeZone);
  if (field === 'harvestedOn') return formatDate(String(v));
  if (typeof v === 'number') return formatNumber(v, 2);
  const kind = field === 'kind' ? known(waterKinds, v) : undefined;
  if (kind) return t(($) => $.waterKinds[kind]);
  const source = field === 'source' ? known(sources, v) : undefined;
  if (source) return t(($) => $.sources[source]);
  const method = field === 'method' ? known(methods, v) : undefined;
  if (method) return t(($) => $.methods[method]);
  return String(v);
}

/**
 * The trial's records of one kind: filtered by date range and plot, sorted and paginated on the
 * server; owners add and delete records here (deletes in shared trials are audited).
 */
export function LogsPanel({ trialId, timeZone, plots, editable }: { trialId: string; timeZone: string; plots: Plot[]; editable: boolean }) {
  const units = useUnits();
  const { t } = useTranslation('logs');
  const { t: tc } = useTranslation('common');
  const [kind, setKind] = useState<LogKind>('water-events');
  const [page, setPage] = useState(1);
  const [sort, setSort] = useState<'asc' | 'desc'>('desc');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const [plotId, setPlotId] = useState('');
  const query = { page, pageSize: PAGE_SIZE, sort, from: from || undefined, to: to || undefined, plotId: plotId || undefined };
  const logs = useLogs(trialId, kind, query);
  const remove = useDeleteLog(trialId, kind);
  const [toDelete, setToDelete] = useState<LogRow | null>(null);
  const [editing, setEditing] = useState<string | null>(null);
  const cols = logColumns[kind];
  const total = logs.data?.meta?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));

  return (
    <section aria-labelledby="logs-heading" className="space-y-4">
      <h2 id="logs-heading">{t(($) => $.panel.title)}</h2>
      <div role="tablist" aria-label={t(($) => $.panel.kindTabs)} className="flex flex-wrap gap-2">
        {logKinds.map((k) => (
          <button
            key={k}
            role="tab"
            type="button"
            aria-selected={k === kind}
            className={cn('min-h-10 rounded-lg border px-3 text-sm font-medium', k === kind ? 'border-terracotta-500 bg-terracotta-50 text-terracotta-800' : 'border-sand-300 bg-white')}
            onClick={() => {
              setKind(k);
              setPage(1);
            }}
          >
            {t(($) => $.kinds[k])}
          </button>
        ))}
      </div>
      {editable ? <LogForm key={kind} trialId={trialId} timeZone={timeZone} kind={kind} plots={plots} /> : null}
      <div className="flex flex-wrap items-end gap-3">
        <InputField label={t(($) => $.panel.from)} type="date" value={from} onChange={(e) => (setFrom(e.target.value), setPage(1))} />
        <InputField label={t(($) => $.panel.to)} type="date" value={to} onChange={(e) => (setTo(e.target.value), setPage(1))} />
        <SelectField label={t(($) => $.panel.plot)} value={plotId} onChange={(e) => (setPlotId(e.target.value), setPage(1))}>
          <option value="">{t(($) => $.panel.allPlots)}</option>
          {plots.map((p) => (
            <option key={p.id} value={p.id}>
              {p.label}
            </option>
          ))}
        </SelectField>
        <SelectField label={t(($) => $.panel.order)} value={sort} onChange={(e) => setSort(e.target.value as 'asc' | 'desc')}>
          <option value="desc">{t(($) => $.panel.newest)}</option>
          <option value="asc">{t(($) => $.panel.oldest)}</option>
        </SelectField>
      </div>
      {logs.isError ? <Alert tone="error">{logs.error.message}</Alert> : null}
      <div
        className="relative overflow-x-auto rounded-card border border-sand-200 bg-white"
        tabIndex={0}
        role="region"
        aria-label={t(($) => $.panel.scrollRegion, { kind: t(($) => $.kinds[kind]) })}
      >
        <table className="w-full text-sm">
          <caption className="sr-only">{t(($) => $.panel.caption, { kind: t(($) => $.kinds[kind]) })}</caption>
          <thead className="bg-sand-100 text-left">
            <tr>
              {cols.map((c) => (
                <th key={c.field} scope="col" className={cn('px-3 py-2', c.numeric && 'text-right')}>
                  {t(($) => $.col[c.header])}
                  {c.quantity ? ` (${units.label(c.quantity)})` : ''}
                </th>
              ))}
              <th scope="col" className="px-3 py-2">
                {t(($) => $.col.by)}
              </th>
              {editable ? (
                <th scope="col" className="px-3 py-2">
                  <span className="sr-only">{t(($) => $.col.actions)}</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {(logs.data?.data ?? []).map((row) =>
              editing === row.id ? (
                <LogEditRow key={row.id} trialId={trialId} kind={kind} row={row} colSpan={cols.length + (editable ? 2 : 1)} onDone={() => setEditing(null)} />
              ) : (
                <tr key={row.id} className="border-t border-sand-100 align-top">
                  {cols.map((c) => (
                    <td key={c.field} className={cn('px-3 py-1.5', c.numeric && 'num')}>
                      {c.quantity && typeof row[c.field] === 'number' ? formatNumber(units.show(row[c.field] as number, c.quantity), c.digits ?? 1, c.digits ?? 1) : cellText(row, c.field, t, timeZone)}
                      {kind === 'observations' && c.field === 'text' ? <ObservationPhotos trialId={trialId} observationId={row.id} editable={editable} /> : null}
                    </td>
                  ))}
                  <td className="px-3 py-1.5 text-ink-muted">{row.enteredBy ?? '—'}</td>
                  {editable ? (
                    <td className="whitespace-nowrap px-3 py-1.5 text-right">
                      <Button variant="ghost" size="sm" onClick={() => setEditing(row.id)} aria-label={t(($) => $.panel.edit)}>
                        {tc(($) => $.actions.edit)}
                      </Button>
                      <Button variant="ghost" size="sm" onClick={() => setToDelete(row)} aria-label={t(($) => $.panel.delete)}>
                        {tc(($) => $.actions.delete)}
                      </Button>
                    </td>
                  ) : null}
                </tr>
              ),
            )}
          </tbody>
        </table>
        {logs.isSuccess && total === 0 ? <p className="px-3 py-4 text-ink-muted">{t(($) => $.panel.none)}</p> : null}
      </div>
      <nav aria-label={t(($) => $.panel.pages)} className="flex items-center gap-3">
        <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
          {t(($) => $.panel.previous)}
        </Button>
        <span className="text-sm" aria-live="polite">
          {t(($) => $.panel.pageOf, { page, pages })} · {t(($) => $.panel.records, { count: total })}
        </span>
        <Button variant="secondary" size="sm" disabled={page >= pages} onClick={() => setPage((p) => p + 1)}>
          {t(($) => $.panel.next)}
        </Button>
      </nav>
      <ConfirmDialog
        open={toDelete !== null}
        title={t(($) => $.panel.deleteTitle)}
        confirmLabel={tc(($) => $.actions.delete)}
        tone="danger"
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onCancel={() => setToDelete(null)}
        onConfirm={() => toDelete && remove.mutate(toDelete.id, { onSuccess: () => setToDelete(null) })}
      >
        {t(($) => $.panel.deleteBody)}
      </ConfirmDialog>
    </section>
  );
}
