import { useState } from 'react';
import { logKinds, type LogKind } from '@shared/schemas/logs';
import type { Plot } from '@shared/schemas/plots';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { InputField, SelectField } from '@/components/ui/field';
import { formatDateTime } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { cn } from '@/lib/utils';
import { useLogs, type LogRow } from '../api/get-logs';
import { useDeleteLog } from '../api/log-mutations';
import { logColumns, logTitles } from './log-columns';
import { LogEditRow } from './log-edit-row';
import { LogForm } from './log-form';
import { ObservationPhotos } from './observation-photos';

const PAGE_SIZE = 25;

function cellText(row: LogRow, field: string): string {
  const v = row[field];
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (field.endsWith('At')) return formatDateTime(String(v));
  if (field === 'kind') return v === 'olla_refill' ? 'olla refill' : 'surface';
  return String(v);
}

/**
 * The trial's records of one kind: filtered by date range and plot, sorted and paginated on the
 * server; owners add and delete records here (deletes in shared trials are audited).
 */
export function LogsPanel({ trialId, plots, editable }: { trialId: string; plots: Plot[]; editable: boolean }) {
  const units = useUnits();
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
      <h2 id="logs-heading">Records</h2>
      <div role="tablist" aria-label="Kind of record" className="flex flex-wrap gap-2">
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
            {logTitles[k]}
          </button>
        ))}
      </div>
      {editable ? <LogForm key={kind} trialId={trialId} kind={kind} plots={plots} /> : null}
      <div className="flex flex-wrap items-end gap-3">
        <InputField label="From" type="date" value={from} onChange={(e) => (setFrom(e.target.value), setPage(1))} />
        <InputField label="To" type="date" value={to} onChange={(e) => (setTo(e.target.value), setPage(1))} />
        <SelectField label="Plot" value={plotId} onChange={(e) => (setPlotId(e.target.value), setPage(1))}>
          <option value="">All plots</option>
          {plots.map((p) => (
            <option key={p.id} value={p.id}>
              {p.label}
            </option>
          ))}
        </SelectField>
        <SelectField label="Order" value={sort} onChange={(e) => setSort(e.target.value as 'asc' | 'desc')}>
          <option value="desc">Newest first</option>
          <option value="asc">Oldest first</option>
        </SelectField>
      </div>
      {logs.isError ? <Alert tone="error">{logs.error.message}</Alert> : null}
      <div className="overflow-x-auto rounded-card border border-sand-200 bg-white" tabIndex={0} role="region" aria-label={`${logTitles[kind]} records (scrolls sideways)`}>
        <table className="w-full text-sm">
          <caption className="sr-only">{logTitles[kind]} records</caption>
          <thead className="bg-sand-100 text-left">
            <tr>
              {cols.map((c) => (
                <th key={c.field} scope="col" className={cn('px-3 py-2', c.numeric && 'text-right')}>
                  {c.header}
                  {c.quantity ? ` (${units.label(c.quantity)})` : ''}
                </th>
              ))}
              <th scope="col" className="px-3 py-2">
                By
              </th>
              {editable ? (
                <th scope="col" className="px-3 py-2">
                  <span className="sr-only">Actions</span>
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
                      {c.quantity && typeof row[c.field] === 'number' ? units.show(row[c.field] as number, c.quantity).toFixed(c.digits ?? 1) : cellText(row, c.field)}
                      {kind === 'observations' && c.field === 'text' ? <ObservationPhotos trialId={trialId} observationId={row.id} editable={editable} /> : null}
                    </td>
                  ))}
                  <td className="px-3 py-1.5 text-ink-muted">{row.enteredBy ?? '—'}</td>
                  {editable ? (
                    <td className="whitespace-nowrap px-3 py-1.5 text-right">
                      <Button variant="ghost" size="sm" onClick={() => setEditing(row.id)} aria-label="Edit this record">
                        Edit
                      </Button>
                      <Button variant="ghost" size="sm" onClick={() => setToDelete(row)} aria-label="Delete this record">
                        Delete
                      </Button>
                    </td>
                  ) : null}
                </tr>
              ),
            )}
          </tbody>
        </table>
        {logs.isSuccess && total === 0 ? <p className="px-3 py-4 text-ink-muted">No records match.</p> : null}
      </div>
      <nav aria-label="Pages" className="flex items-center gap-3">
        <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
          Previous
        </Button>
        <span className="text-sm" aria-live="polite">
          Page {page} of {pages} · {total} record{total === 1 ? '' : 's'}
        </span>
        <Button variant="secondary" size="sm" disabled={page >= pages} onClick={() => setPage((p) => p + 1)}>
          Next
        </Button>
      </nav>
      <ConfirmDialog
        open={toDelete !== null}
        title="Delete this record?"
        confirmLabel="Delete"
        tone="danger"
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onCancel={() => setToDelete(null)}
        onConfirm={() => toDelete && remove.mutate(toDelete.id, { onSuccess: () => setToDelete(null) })}
      >
        The totals and results are recomputed without it. In a shared trial the deletion is kept in the audit trail.
      </ConfirmDialog>
    </section>
  );
}
