import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { z } from 'zod';
import { weatherDayInputSchema } from '@shared/schemas/logs';
import { dayInTimeZone } from '@shared/time-zone';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { formatDate, formatNumber } from '@/lib/format';
import { decimalOrUndefined, parseDecimal } from '@/lib/parse-number';
import { useUnits } from '@/lib/units';
import { useDeleteWeatherDay, useSaveWeatherDay, useWeather } from '../api/weather';
import { useGardenMessages } from './schema-messages';

/** Optional boxes: empty means not measured; "2,5" and "2.5" are both read (parseDecimal). */
const optionalNumber = (notNumber: string) =>
  z.preprocess(
    (v) => (v === '' || v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v)) ? null : typeof v === 'number' ? v : parseDecimal(String(v))),
    z.number({ message: notNumber }).nullable(),
  );
const makeFormSchema = (m: { pickDay: string; enterMin: string; enterMax: string; notNumber: string }) =>
  z.object({
    day: z.iso.date(m.pickDay),
    tMinC: z.number({ message: m.enterMin }),
    tMaxC: z.number({ message: m.enterMax }),
    rainMm: optionalNumber(m.notNumber),
    rhMinPct: optionalNumber(m.notNumber),
    rhMaxPct: optionalNumber(m.notNumber),
    windSpeedMs: optionalNumber(m.notNumber),
    sunshineHours: optionalNumber(m.notNumber),
    forecast: z.boolean(),
  });
type FormValues = z.input<ReturnType<typeof makeFormSchema>>;

/** Weather days of a garden: what ET0 is computed from, and where frost shows up. */
export function WeatherPanel({ gardenId, timeZone, from, to }: { gardenId: string; timeZone: string; from?: string; to?: string }) {
  const units = useUnits();
  const { t } = useTranslation('gardens');
  const { t: tc } = useTranslation('common');
  const m = useGardenMessages();
  const formSchema = useMemo(
    () =>
      makeFormSchema({
        pickDay: t(($) => $.weather.pickDay),
        enterMin: t(($) => $.weather.enterMin),
        enterMax: t(($) => $.weather.enterMax),
        notNumber: t(($) => $.form.notANumber),
      }),
    [t],
  );
  const weather = useWeather(gardenId, from, to);
  const save = useSaveWeatherDay(gardenId);
  const remove = useDeleteWeatherDay(gardenId);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { day: dayInTimeZone(new Date(), timeZone), forecast: false },
  });
  const submit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      const toC = (x: number) => units.toSI(x, 'temperature');
      const input = weatherDayInputSchema.parse({
        day: v.day,
        tMinC: toC(Number(v.tMinC)),
        tMaxC: toC(Number(v.tMaxC)),
        rainMm: v.rainMm === null || v.rainMm === undefined ? 0 : units.toSI(Number(v.rainMm), 'length-small'),
        rhMinPct: v.rhMinPct ?? null,
        rhMaxPct: v.rhMaxPct ?? null,
        windSpeedMs: v.windSpeedMs === null || v.windSpeedMs === undefined ? null : units.toSI(Number(v.windSpeedMs), 'speed'),
        sunshineHours: v.sunshineHours ?? null,
        forecast: v.forecast,
      });
      await save.mutateAsync(input);
      reset({ day: v.day, forecast: false });
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  const rows = weather.data ?? [];
  const frost = rows.filter((w) => w.tMinC <= 0);
  const e = formState.errors;
  return (
    <section aria-labelledby="weather-heading" className="space-y-4">
      <h2 id="weather-heading">{t(($) => $.weather.title)}</h2>
      <p className="text-sm text-ink-muted">
        {t(($) => $.weather.intro)}
      </p>
      {frost.length ? (
        <Alert tone="warning">{t(($) => $.weather.frost, { days: frost.map((f) => formatDate(f.day)).join(', ') })}</Alert>
      ) : null}
      <form onSubmit={submit} noValidate className="grid gap-3 rounded-card border border-sand-200 bg-white p-4 sm:grid-cols-4" aria-label={t(($) => $.weather.formLabel)}>
        {formError ? <Alert tone="error" className="sm:col-span-4">{formError}</Alert> : null}
        <InputField label={t(($) => $.weather.day)} type="date" {...register('day')} error={m(e.day?.message)} />
        <InputField label={t(($) => $.weather.min, { unit: units.label('temperature') })} inputMode="decimal" {...register('tMinC', { setValueAs: decimalOrUndefined })} error={m(e.tMinC?.message)} />
        <InputField label={t(($) => $.weather.max, { unit: units.label('temperature') })} inputMode="decimal" {...register('tMaxC', { setValueAs: decimalOrUndefined })} error={m(e.tMaxC?.message)} />
        <InputField label={t(($) => $.weather.rain, { unit: units.label('length-small') })} inputMode="decimal" {...register('rainMm')} error={m(e.rainMm?.message)} />
        <InputField label={t(($) => $.weather.rhMin)} inputMode="decimal" {...register('rhMinPct')} error={m(e.rhMinPct?.message)} />
        <InputField label={t(($) => $.weather.rhMax)} inputMode="decimal" {...register('rhMaxPct')} error={m(e.rhMaxPct?.message)} />
        <InputField label={t(($) => $.weather.wind, { unit: units.label('speed') })} inputMode="decimal" {...register('windSpeedMs')} error={m(e.windSpeedMs?.message)} />
        <InputField label={t(($) => $.weather.sunshine)} inputMode="decimal" {...register('sunshineHours')} error={m(e.sunshineHours?.message)} />
        <label className="flex items-center gap-2 text-sm sm:col-span-2">
          <input type="checkbox" className="size-4 accent-terracotta-600" {...register('forecast')} /> {t(($) => $.weather.forecastCheck)}
        </label>
        <div className="sm:col-span-2 sm:text-right">
          <Button type="submit" disabled={formState.isSubmitting}>
            {t(($) => $.weather.save)}
          </Button>
        </div>
      </form>
      {weather.isPending ? <p role="status">{t(($) => $.weather.loading)}</p> : null}
      {rows.length ? (
        <div className="relative overflow-x-auto rounded-card border border-sand-200 bg-white">
          <table className="w-full text-sm">
            <caption className="sr-only">{t(($) => $.weather.title)}</caption>
            <thead className="bg-sand-100 text-left">
              <tr>
                <th scope="col" className="px-3 py-2">{t(($) => $.weather.col.day)}</th>
                <th scope="col" className="px-3 py-2 text-right">{t(($) => $.weather.col.min)}</th>
                <th scope="col" className="px-3 py-2 text-right">{t(($) => $.weather.col.max)}</th>
                <th scope="col" className="px-3 py-2 text-right">{t(($) => $.weather.col.rain)}</th>
                <th scope="col" className="px-3 py-2 text-right">{t(($) => $.weather.col.humidity)}</th>
                <th scope="col" className="px-3 py-2 text-right">{t(($) => $.weather.col.wind)}</th>
                <th scope="col" className="px-3 py-2 text-right">{t(($) => $.weather.col.sun)}</th>
                <th scope="col" className="px-3 py-2"><span className="sr-only">{t(($) => $.weather.col.actions)}</span></th>
              </tr>
            </thead>
            <tbody>
              {[...rows].reverse().slice(0, 60).map((w) => (
                <tr key={w.id} className="border-t border-sand-100">
                  <td className="px-3 py-1.5">
                    {formatDate(w.day)}
                    {w.forecast ? <span className="ml-2 rounded bg-slate-100 px-1.5 text-xs">{t(($) => $.weather.forecast)}</span> : null}
                  </td>
                  <td className="num px-3 py-1.5">{units.fmt(w.tMinC, 'temperature')}</td>
                  <td className="num px-3 py-1.5">{units.fmt(w.tMaxC, 'temperature')}</td>
                  <td className="num px-3 py-1.5">{units.fmt(w.rainMm ?? 0, 'length-small')}</td>
                  <td className="num px-3 py-1.5">{w.rhMinPct !== null && w.rhMaxPct !== null ? `${formatNumber(w.rhMinPct, 0)}–${formatNumber(w.rhMaxPct, 0)} %` : '—'}</td>
                  <td className="num px-3 py-1.5">{units.fmt(w.windSpeedMs, 'speed', 1)}</td>
                  <td className="num px-3 py-1.5">{w.sunshineHours !== null ? `${formatNumber(w.sunshineHours, 1)} h` : '—'}</td>
                  <td className="px-3 py-1.5 text-right">
                    <Button variant="ghost" size="sm" onClick={() => remove.mutate(w.id)} aria-label={t(($) => $.weather.deleteDay, { day: formatDate(w.day) })}>
                      {tc(($) => $.actions.delete)}
                    </Button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {rows.length > 60 ? <p className="px-3 py-2 text-sm text-ink-muted">{t(($) => $.weather.showing, { count: rows.length })}</p> : null}
        </div>
      ) : weather.isSuccess ? (
        <p className="text-ink-muted">{t(($) => $.weather.none)}</p>
      ) : null}
    </section>
  );
}
