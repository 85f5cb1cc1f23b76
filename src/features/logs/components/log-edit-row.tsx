import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { LogKind } from '@shared/schemas/logs';
import type { Quantity } from '@shared/units';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ApiRequestError } from '@/lib/api-client';
import { parseDecimal } from '@/lib/parse-number';
import type { LogColumnHeader } from './log-columns';
import { useLogMessages } from './schema-messages';
import { useUnits } from '@/lib/units';
import type { LogRow } from '../api/get-logs';
import { useUpdateLog } from '../api/log-mutations';

/** The fields an owner corrects most: amounts and notes. Dates and plots are fixed by deleting and re-entering. */
const editable: Record<LogKind, { field: string; label: LogColumnHeader; quantity?: Quantity; text?: boolean }[]> = {
  'water-events': [
    { field: 'volumeL', label: 'volume', quantity: 'volume' },
    { field: 'notes', label: 'note', text: true },
  ],
  'moisture-readings': [{ field: 'value', label: 'reading' }],
  harvests: [
    { field: 'freshKg', label: 'fresh', quantity: 'mass' },
    { field: 'marketableKg', label: 'marketable', quantity: 'mass' },
    { field: 'count', label: 'count' },
  ],
  observations: [{ field: 'text', label: 'note', text: true }],
};

export function LogEditRow({ trialId, kind, row, colSpan, onDone }: { trialId: string; kind: LogKind; row: LogRow; colSpan: number; onDone: () => void }) {
  const units = useUnits();
  const { t } = useTranslation('logs');
  const { t: tc } = useTranslation('common');
  const m = useLogMessages();
  const update = useUpdateLog(trialId, kind);
  const fields = editable[kind];
  const [values, setValues] = useState<Record<string, string>>(() =>
    Object.fromEntries(
      fields.map((f) => {
        const v = row[f.field];
        if (v === null || v === undefined) return [f.field, ''];
        return [f.field, typeof v === 'number' && f.quantity ? String(Number(units.show(v, f.quantity).toFixed(3))) : String(v)];
      }),
    ),
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const save = async () => {
    const patch: Record<string, unknown> = {};
    const bad: Record<string, string> = {};
    for (const f of fields) {
      const raw = values[f.field] ?? '';
      if (f.text) patch[f.field] = raw;
      else if (raw === '') patch[f.field] = null;
      else {
        const n = parseDecimal(raw);
        if (!Number.isFinite(n)) bad[f.field] = t(($) => $.form.notANumber);
        patch[f.field] = f.quantity ? units.toSI(n, f.quantity) : n;
      }
    }
    if (Object.keys(bad).length) {
      setErrors(bad);
      return;
    }
    try {
      await update.mutateAsync({ id: row.id, patch });
      onDone();
    } catch (err) {
      if (err instanceof ApiRequestError) {
        setErrors(err.fieldErrors);
        setMessage(err.message);
      } else setMessage(t(($) => $.form.failed));
    }
  };
  return (
    <tr className="border-t border-sand-100 bg-sand-50">
      <td colSpan={colSpan} className="px-3 py-2">
        <div className="flex flex-wrap items-end gap-3">
          {fields.map((f) => (
            <label key={f.field} className="block text-sm font-medium">
              {t(($) => $.col[f.label])}
              {f.quantity ? ` (${units.label(f.quantity)})` : ''}
              <input
                className="mt-1 block rounded-lg border border-sand-300 bg-white px-2 py-1.5"
                inputMode={f.text ? 'text' : 'decimal'}
                value={values[f.field] ?? ''}
                aria-invalid={errors[f.field] ? true : undefined}
                onChange={(e) => setValues((v) => ({ ...v, [f.field]: e.target.value }))}
              />
              {errors[f.field] ? <span className="block text-xs text-red-800">{m(errors[f.field])}</span> : null}
            </label>
          ))}
          <Button size="sm" onClick={() => void save()} disabled={update.isPending}>
            {tc(($) => $.actions.save)}
          </Button>
          <Button size="sm" variant="ghost" onClick={onDone}>
            {tc(($) => $.actions.cancel)}
          </Button>
        </div>
        {message ? (
          <Alert tone="error" className="mt-2">
            {message}
          </Alert>
        ) : null}
      </td>
    </tr>
  );
}
