import { useState, type FormEvent } from 'react';
import { moistureRanges, type LogKind, type MoistureMethod, type WaterKind, type WaterSource } from '@shared/schemas/logs';
import type { Plot } from '@shared/schemas/plots';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { CautionNote } from '@/components/ui/caution-note';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { ApiRequestError } from '@/lib/api-client';
import { useUnits } from '@/lib/units';
import { useCreateLog } from '../api/log-mutations';

function localNow(): string {
  const d = new Date();
  d.setMinutes(d.getMinutes() - d.getTimezoneOffset());
  return d.toISOString().slice(0, 16);
}

/** A datetime-local value (the phone's local time) as an ISO instant. */
function toIso(local: string): string {
  return new Date(local).toISOString();
}

/**
 * One form for every kind of log. The server validates with the shared schema and answers with
 * field messages, shown beside the field; nothing is written when anything is wrong.
 */
export function LogForm({ trialId, kind, plots }: { trialId: string; kind: LogKind; plots: Plot[] }) {
  const units = useUnits();
  const create = useCreateLog(trialId, kind);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ tone: 'error' | 'success'; text: string } | null>(null);
  const [waterKind, setWaterKind] = useState<WaterKind>('olla_refill');
  const [source, setSource] = useState<WaterSource>('mains');
  const [method, setMethod] = useState<MoistureMethod>('vwc');
  const [fertiliser, setFertiliser] = useState(false);

  const submit = async (ev: FormEvent<HTMLFormElement>) => {
    ev.preventDefault();
    const form = ev.currentTarget;
    const f = new FormData(form);
    const str = (k: string) => String(f.get(k) ?? '').trim();
    const numOrNull = (k: string) => (str(k) === '' ? null : Number(str(k)));
    let body: Record<string, unknown>;
    const plotId = str('plotId') || null;
    switch (kind) {
      case 'water-events':
        body = {
          plotId,
          occurredAt: toIso(str('when')),
          kind: waterKind,
          volumeL: str('volume') === '' ? undefined : units.toSI(Number(str('volume')), 'volume'),
          source,
          fertiliser: f.get('fertiliser') === 'on',
          notes: str('notes'),
        };
        break;
      case 'moisture-readings':
        body = { plotId, takenAt: toIso(str('when')), method, depthCm: Number(str('depthCm')), value: numOrNull('value') };
        break;
      case 'harvests': {
        const m = numOrNull('marketable');
        body = {
          plotId,
          harvestedOn: str('day'),
          freshKg: str('fresh') === '' ? undefined : units.toSI(Number(str('fresh')), 'mass'),
          marketableKg: m === null ? null : units.toSI(m, 'mass'),
          count: numOrNull('count'),
          notes: str('notes'),
        };
        break;
      }
      case 'observations':
        body = { plotId, observedAt: toIso(str('when')), text: str('text') };
        break;
    }
    setErrors({});
    setMessage(null);
    try {
      await create.mutateAsync(body);
      setMessage({ tone: 'success', text: 'Saved.' });
      const keep = ['plotId', 'when', 'day', 'depthCm'];
      for (const el of Array.from(form.elements) as HTMLInputElement[]) if (el.name && !keep.includes(el.name) && el.type !== 'checkbox' && el.tagName !== 'SELECT') el.value = '';
    } catch (err) {
      if (err instanceof ApiRequestError) {
        setErrors(err.fieldErrors);
        setMessage({ tone: 'error', text: err.message });
      } else setMessage({ tone: 'error', text: 'Something went wrong. Please try again.' });
    }
  };

  const plotSelect = (
    <SelectField label="Plot" name="plotId" error={errors.plotId} defaultValue={plots[0]?.id}>
      {kind === 'observations' ? <option value="">Whole trial</option> : null}
      {plots.map((p) => (
        <option key={p.id} value={p.id}>
          {p.label} {p.treatment ? `(${p.treatment})` : ''}
        </option>
      ))}
    </SelectField>
  );
  const range = moistureRanges[method];
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 rounded-card border border-sand-200 bg-white p-4 sm:grid-cols-4" aria-label="Add a record">
      {message ? (
        <Alert tone={message.tone} className="sm:col-span-4">
          {message.text}
        </Alert>
      ) : null}
      {plotSelect}
      {kind === 'harvests' ? (
        <InputField label="Day picked" type="date" name="day" defaultValue={new Date().toISOString().slice(0, 10)} error={errors.harvestedOn} />
      ) : (
        <InputField label="When" type="datetime-local" name="when" defaultValue={localNow()} error={errors.occurredAt ?? errors.takenAt ?? errors.observedAt} />
      )}
      {kind === 'water-events' ? (
        <>
          <SelectField label="Kind" value={waterKind} onChange={(e) => setWaterKind(e.target.value as WaterKind)} error={errors.kind}>
            <option value="olla_refill">Olla refill</option>
            <option value="surface">Surface watering</option>
          </SelectField>
          <InputField label={`Volume (${units.label('volume')})`} name="volume" inputMode="decimal" error={errors.volumeL} />
          <SelectField label="Source" value={source} onChange={(e) => setSource(e.target.value as WaterSource)} error={errors.source}>
            <option value="mains">Mains / tap</option>
            <option value="rainwater">Rainwater</option>
            <option value="well">Well</option>
            <option value="greywater">Greywater</option>
            <option value="other">Other</option>
          </SelectField>
          <label className="flex items-center gap-2 self-end pb-2 text-sm">
            <input type="checkbox" name="fertiliser" className="size-4 accent-terracotta-600" checked={fertiliser} onChange={(e) => setFertiliser(e.target.checked)} /> Fertiliser or
            compost tea added
          </label>
          <InputField label="Note" name="notes" className="sm:col-span-2" />
          {source === 'greywater' ? <CautionNote id="greywater" className="sm:col-span-4" /> : null}
          {fertiliser && waterKind === 'olla_refill' ? <CautionNote id="cloggingFertiliser" className="sm:col-span-4" /> : null}
        </>
      ) : null}
      {kind === 'moisture-readings' ? (
        <>
          <SelectField label="Method" value={method} onChange={(e) => setMethod(e.target.value as MoistureMethod)} error={errors.method}>
            <option value="vwc">Volumetric water content (%)</option>
            <option value="tensiometer">Tensiometer (kPa)</option>
            <option value="probe_index">Handheld probe (1–10)</option>
          </SelectField>
          <InputField label="Depth (cm)" name="depthCm" inputMode="decimal" defaultValue="15" error={errors.depthCm} />
          <InputField label={`Reading (${range.unit})`} name="value" inputMode="decimal" hint={`${range.min}–${range.max} ${range.unit}`} error={errors.value} />
        </>
      ) : null}
      {kind === 'harvests' ? (
        <>
          <InputField label={`Fresh mass (${units.label('mass')})`} name="fresh" inputMode="decimal" error={errors.freshKg} />
          <InputField label={`Marketable (${units.label('mass')})`} name="marketable" inputMode="decimal" error={errors.marketableKg} />
          <InputField label="Count (fruits)" name="count" inputMode="numeric" error={errors.count} />
          <InputField label="Note" name="notes" className="sm:col-span-3" />
        </>
      ) : null}
      {kind === 'observations' ? <TextareaField label="What you saw" name="text" className="sm:col-span-4" error={errors.text} /> : null}
      <div className="sm:col-span-4">
        <Button type="submit" disabled={create.isPending}>
          {create.isPending ? 'Saving…' : 'Save record'}
        </Button>
      </div>
    </form>
  );
}
