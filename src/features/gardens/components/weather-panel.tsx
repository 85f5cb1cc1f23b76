import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { weatherDayInputSchema } from '@shared/schemas/logs';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUnits } from '@/lib/units';
import { useDeleteWeatherDay, useSaveWeatherDay, useWeather } from '../api/weather';

const optionalNumber = z.preprocess((v) => (v === '' || v === null || (typeof v === 'number' && Number.isNaN(v)) ? null : Number(v)), z.number().nullable());
const formSchema = z.object({
  day: z.iso.date('Pick the day.'),
  tMinC: z.number({ message: 'Enter the minimum.' }),
  tMaxC: z.number({ message: 'Enter the maximum.' }),
  rainMm: optionalNumber,
  rhMinPct: optionalNumber,
  rhMaxPct: optionalNumber,
  windSpeedMs: optionalNumber,
  sunshineHours: optionalNumber,
  forecast: z.boolean(),
});
type FormValues = z.input<typeof formSchema>;

/** Weather days of a garden: what ET0 is computed from, and where frost shows up. */
export function WeatherPanel({ gardenId, from, to }: { gardenId: string; from?: string; to?: string }) {
  const units = useUnits();
  const weather = useWeather(gardenId, from, to);
  const save = useSaveWeatherDay(gardenId);
  const remove = useDeleteWeatherDay(gardenId);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { day: new Date().toISOString().slice(0, 10), forecast: false },
  });
  const submit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      const t = (x: number) => units.toSI(x, 'temperature');
      const input = weatherDayInputSchema.parse({
        day: v.day,
        tMinC: t(Number(v.tMinC)),
        tMaxC: t(Number(v.tMaxC)),
        rainMm: v.rainMm === null || v.rainMm === undefined ? 0 : units.toSI(Number(v.rainMm), 'length-small'),
        rhMinPct: v.rhMinPct ?? null,
        rhMaxPct: v.rhMaxPct ?? null,
        windSpeedMs: v.windSpeedMs ?? null,
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
      <h2 id="weather-heading">Weather days</h2>
      <p className="text-sm text-ink-muted">
        Minimum and maximum temperature are enough for reference evapotranspiration (FAO-56 Hargreaves). Add humidity, wind and sunshine hours when you have
        them and Seepwise uses FAO-56 Penman-Monteith instead.
      </p>
      {frost.length ? (
        <Alert tone="warning">
          Frost logged or forecast on {frost.map((f) => f.day).join(', ')}. Empty or lift your pots before a hard frost: water left in the clay freezes and cracks
          it. Follow local advice for your area.
        </Alert>
      ) : null}
      <form onSubmit={submit} noValidate className="grid gap-3 rounded-card border border-sand-200 bg-white p-4 sm:grid-cols-4" aria-label="Log a weather day">
        {formError ? <Alert tone="error" className="sm:col-span-4">{formError}</Alert> : null}
        <InputField label="Day" type="date" {...register('day')} error={e.day?.message} />
        <InputField label={`Min (${units.label('temperature')})`} inputMode="decimal" {...register('tMinC', { valueAsNumber: true })} error={e.tMinC?.message} />
        <InputField label={`Max (${units.label('temperature')})`} inputMode="decimal" {...register('tMaxC', { valueAsNumber: true })} error={e.tMaxC?.message} />
        <InputField label={`Rain (${units.label('length-small')})`} inputMode="decimal" {...register('rainMm')} />
        <InputField label="Humidity min (%)" inputMode="decimal" {...register('rhMinPct')} error={e.rhMinPct?.message} />
        <InputField label="Humidity max (%)" inputMode="decimal" {...register('rhMaxPct')} error={e.rhMaxPct?.message} />
        <InputField label="Wind at 2 m (m/s)" inputMode="decimal" {...register('windSpeedMs')} error={e.windSpeedMs?.message} />
        <InputField label="Sunshine (hours)" inputMode="decimal" {...register('sunshineHours')} error={e.sunshineHours?.message} />
        <label className="flex items-center gap-2 text-sm sm:col-span-2">
          <input type="checkbox" className="size-4 accent-terracotta-600" {...register('forecast')} /> This is a forecast, not an observation
        </label>
        <div className="sm:col-span-2 sm:text-right">
          <Button type="submit" disabled={formState.isSubmitting}>
            Save weather day
          </Button>
        </div>
      </form>
      {weather.isPending ? <p role="status">Loading weather…</p> : null}
      {rows.length ? (
        <div className="relative overflow-x-auto rounded-card border border-sand-200 bg-white">
          <table className="w-full text-sm">
            <caption className="sr-only">Weather days</caption>
            <thead className="bg-sand-100 text-left">
              <tr>
                <th scope="col" className="px-3 py-2">Day</th>
                <th scope="col" className="px-3 py-2 text-right">Min</th>
                <th scope="col" className="px-3 py-2 text-right">Max</th>
                <th scope="col" className="px-3 py-2 text-right">Rain</th>
                <th scope="col" className="px-3 py-2 text-right">Humidity</th>
                <th scope="col" className="px-3 py-2 text-right">Wind</th>
                <th scope="col" className="px-3 py-2 text-right">Sun</th>
                <th scope="col" className="px-3 py-2"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {[...rows].reverse().slice(0, 60).map((w) => (
                <tr key={w.id} className="border-t border-sand-100">
                  <td className="px-3 py-1.5">
                    {w.day}
                    {w.forecast ? <span className="ml-2 rounded bg-slate-100 px-1.5 text-xs">forecast</span> : null}
                  </td>
                  <td className="num px-3 py-1.5">{units.fmt(w.tMinC, 'temperature')}</td>
                  <td className="num px-3 py-1.5">{units.fmt(w.tMaxC, 'temperature')}</td>
                  <td className="num px-3 py-1.5">{units.fmt(w.rainMm ?? 0, 'length-small')}</td>
                  <td className="num px-3 py-1.5">{w.rhMinPct !== null && w.rhMaxPct !== null ? `${w.rhMinPct}–${w.rhMaxPct} %` : '—'}</td>
                  <td className="num px-3 py-1.5">{w.windSpeedMs !== null ? `${w.windSpeedMs} m/s` : '—'}</td>
                  <td className="num px-3 py-1.5">{w.sunshineHours !== null ? `${w.sunshineHours} h` : '—'}</td>
                  <td className="px-3 py-1.5 text-right">
                    <Button variant="ghost" size="sm" onClick={() => remove.mutate(w.id)} aria-label={`Delete weather of ${w.day}`}>
                      Delete
                    </Button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {rows.length > 60 ? <p className="px-3 py-2 text-sm text-ink-muted">Showing the latest 60 of {rows.length} days.</p> : null}
        </div>
      ) : weather.isSuccess ? (
        <p className="text-ink-muted">No weather logged yet.</p>
      ) : null}
    </section>
  );
}
