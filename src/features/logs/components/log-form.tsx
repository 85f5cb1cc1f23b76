import { useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import { moistureRanges, type LogKind, type MoistureMethod, type WaterKind, type WaterSource } from '@shared/schemas/logs';
import type { Plot } from '@shared/schemas/plots';
import { dayInTimeZone, instantOfWallClockInput, wallClockInput } from '@shared/time-zone';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { CautionNote } from '@/components/ui/caution-note';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { currentLanguage } from '@/i18n';
import { ApiRequestError } from '@/lib/api-client';
import { formatNumber } from '@/lib/format';
import { parseDecimal } from '@/lib/parse-number';
import { useUnits } from '@/lib/units';
import { useCreateLog } from '../api/log-mutations';
import { useLogMessages } from './schema-messages';

/** Now on the garden's clock, as a datetime-local value. */
function gardenNow(timeZone: string): string {
  return wallClockInput(new Date(), timeZone);
}

/**
 * A datetime-local value, read on the garden's clock (the same as the phone's when the grower is in
 * the garden), as an ISO instant; a malformed value goes as typed and the server says what is wrong.
 */
function toIso(local: string, timeZone: string): string {
  return instantOfWallClockInput(local, timeZone) ?? local;
}

/**
 * One form for every kind of log. The server validates with the shared schema and answers with
 * field messages, shown beside the field; nothing is written when anything is wrong.
 */
export function LogForm({ trialId, timeZone, kind, plots }: { trialId: string; timeZone: string; kind: LogKind; plots: Plot[] }) {
  const units = useUnits();
  const { t } = useTranslation('logs');
  const m = useLogMessages();
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
    // "2,5" and "2.5" are both read; text that is no number is stopped here, with the field named.
    const bad: Record<string, string> = {};
    const num = (k: string, field: string) => {
      const n = parseDecimal(str(k));
      if (!Number.isFinite(n)) bad[field] = t(($) => $.form.notANumber);
      return n;
    };
    const numOrNull = (k: string, field: string) => (str(k) === '' ? null : num(k, field));
    let body: Record<string, unknown>;
    const plotId = str('plotId') || null;
    switch (kind) {
      case 'water-events':
        body = {
          plotId,
          occurredAt: toIso(str('when'), timeZone),
          kind: waterKind,
          volumeL: str('volume') === '' ? undefined : units.toSI(num('volume', 'volumeL'), 'volume'),
          source,
          fertiliser: f.get('fertiliser') === 'on',
          notes: str('notes'),
        };
        break;
      case 'moisture-readings':
        body = { plotId, takenAt: toIso(str('when'), timeZone), method, depthCm: num('depthCm', 'depthCm'), value: numOrNull('value', 'value') };
        break;
      case 'harvests': {
        const m = numOrNull('marketable', 'marketableKg');
        body = {
          plotId,
          harvestedOn: str('day'),
          freshKg: str('fresh') === '' ? undefined : units.toSI(num('fresh', 'freshKg'), 'mass'),
          marketableKg: m === null ? null : units.toSI(m, 'mass'),
          count: numOrNull('count', 'count'),
          notes: str('notes'),
        };
        break;
      }
      case 'observations':
        body = { plotId, observedAt: toIso(str('when'), timeZone), text: str('text') };
        break;
    }
    setErrors(bad);
    setMessage(null);
    if (Object.keys(bad).length) return;
    try {
      await create.mutateAsync(body);
      setMessage({ tone: 'success', text: t(($) => $.form.saved) });
      const keep = ['plotId', 'when', 'day', 'depthCm'];
      for (const el of Array.from(form.elements) as HTMLInputElement[]) if (el.name && !keep.includes(el.name) && el.type !== 'checkbox' && el.tagName !== 'SELECT') el.value = '';
    } catch (err) {
      if (err instanceof ApiRequestError) {
        setErrors(err.fieldErrors);
        setMessage({ tone: 'error', text: err.message });
      } else setMessage({ tone: 'error', text: t(($) => $.form.failed) });
    }
  };

  const plotSelect = (
    <SelectField label={t(($) => $.form.plot)} name="plotId" error={m(errors.plotId)} defaultValue={plots[0]?.id}>
      {kind === 'observations' ? <option value="">{t(($) => $.form.wholeTrial)}</option> : null}
      {plots.map((p) => (
        <option key={p.id} value={p.id}>
          {p.label} {p.treatment ? `(${p.treatment === 'olla' || p.treatment === 'surface' ? t(($) => $.treatments[p.treatment as 'olla' | 'surface']) : p.treatment})` : ''}
        </option>
      ))}
    </SelectField>
  );
  const range = moistureRanges[method];
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 rounded-card border border-sand-200 bg-white p-4 sm:grid-cols-4" aria-label={t(($) => $.form.label)}>
      {message ? (
        <Alert tone={message.tone} className="sm:col-span-4">
          {message.text}
        </Alert>
      ) : null}
      {plotSelect}
      {kind === 'harvests' ? (
        <InputField label={t(($) => $.form.dayPicked)} type="date" name="day" defaultValue={dayInTimeZone(new Date(), timeZone)} error={m(errors.harvestedOn)} />
      ) : (
        <InputField
          label={t(($) => $.form.when)}
          type="datetime-local"
          name="when"
          defaultValue={gardenNow(timeZone)}
          hint={timeZone !== Intl.DateTimeFormat().resolvedOptions().timeZone ? t(($) => $.form.gardenClock, { zone: timeZone }) : undefined}
          error={m(errors.occurredAt ?? errors.takenAt ?? errors.observedAt)}
        />
      )}
      {kind === 'water-events' ? (
        <>
          <SelectField label={t(($) => $.form.kind)} value={waterKind} onChange={(e) => setWaterKind(e.target.value as WaterKind)} error={m(errors.kind)}>
            <option value="olla_refill">{t(($) => $.waterKinds.olla_refill)}</option>
            <option value="surface">{t(($) => $.waterKinds.surface)}</option>
          </SelectField>
          <InputField label={t(($) => $.form.volume, { unit: units.label('volume') })} name="volume" inputMode="decimal" error={m(errors.volumeL)} />
          <SelectField label={t(($) => $.form.source)} value={source} onChange={(e) => setSource(e.target.value as WaterSource)} error={m(errors.source)}>
            {(['mains', 'rainwater', 'well', 'greywater', 'other'] as const).map((s) => (
              <option key={s} value={s}>
                {t(($) => $.sources[s])}
              </option>
            ))}
          </SelectField>
          <label className="flex items-center gap-2 self-end pb-2 text-sm">
            <input type="checkbox" name="fertiliser" className="size-4 accent-terracotta-600" checked={fertiliser} onChange={(e) => setFertiliser(e.target.checked)} />{' '}
            {t(($) => $.form.fertiliser)}
          </label>
          <InputField label={t(($) => $.form.note)} name="notes" className="sm:col-span-2" />
          {source === 'greywater' ? <CautionNote id="greywater" lang={currentLanguage()} className="sm:col-span-4" /> : null}
          {fertiliser && waterKind === 'olla_refill' ? <CautionNote id="cloggingFertiliser" lang={currentLanguage()} className="sm:col-span-4" /> : null}
        </>
      ) : null}
      {kind === 'moisture-readings' ? (
        <>
          <SelectField label={t(($) => $.form.method)} value={method} onChange={(e) => setMethod(e.target.value as MoistureMethod)} error={m(errors.method)}>
            {(['vwc', 'tensiometer', 'probe_index'] as const).map((m) => (
              <option key={m} value={m}>
                {t(($) => $.methods[m])}
              </option>
            ))}
          </SelectField>
          <InputField label={t(($) => $.form.depth)} name="depthCm" inputMode="decimal" defaultValue="15" error={m(errors.depthCm)} />
          <InputField
            label={t(($) => $.form.reading, { unit: t(($) => $.units[range.unit as '%' | 'kPa' | 'index']) })}
            name="value"
            inputMode="decimal"
            hint={t(($) => $.form.range, { min: formatNumber(range.min, 0), max: formatNumber(range.max, 0), unit: t(($) => $.units[range.unit as '%' | 'kPa' | 'index']) })} error={m(errors.value)} />
        </>
      ) : null}
      {kind === 'harvests' ? (
        <>
          <InputField label={t(($) => $.form.fresh, { unit: units.label('mass') })} name="fresh" inputMode="decimal" error={m(errors.freshKg)} />
          <InputField label={t(($) => $.form.marketable, { unit: units.label('mass') })} name="marketable" inputMode="decimal" error={m(errors.marketableKg)} />
          <InputField label={t(($) => $.form.count)} name="count" inputMode="numeric" error={m(errors.count)} />
          <InputField label={t(($) => $.form.note)} name="notes" className="sm:col-span-3" />
        </>
      ) : null}
      {kind === 'observations' ? <TextareaField label={t(($) => $.form.whatYouSaw)} name="text" className="sm:col-span-4" error={m(errors.text)} /> : null}
      <div className="sm:col-span-4">
        <Button type="submit" disabled={create.isPending}>
          {create.isPending ? t(($) => $.form.saving) : t(($) => $.form.save)}
        </Button>
      </div>
    </form>
  );
}
