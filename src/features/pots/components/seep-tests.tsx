import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { VisualizationSpec } from 'vega-embed';
import { seepSettingLabels, seepSettingSchema, type CreateSeepTestInput, type Pot, type SeepTest } from '@shared/schemas/pots';
import { Chart } from '@/components/charts/chart';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmAction } from '@/components/ui/confirm-dialog';
import { InputField, SelectField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { formatDay } from './format-day';
import { useUnits } from '@/lib/units';
import { useCreateSeepTest } from '../api/create-seep-test';
import { useDeleteSeepTest } from '../api/delete-seep-test';
import { digits, seepTestFormSchema, type SeepTestFormValues } from './pot-form-schema';

type Units = ReturnType<typeof useUnits>;

/** Seepwise's olla colour, the same in every chart. */
const OLLA_SAGE = '#4a7642';

/** Today in the grower's own calendar, as YYYY-MM-DD. */
function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

/** One sentence on how the rate moved from the first test to the latest. */
export function seepTakeaway(tests: SeepTest[], units: Units): string {
  const first = tests[0];
  const last = tests[tests.length - 1];
  if (!first || !last || tests.length < 2) return 'One test so far: a second one later in the season shows whether the rate holds.';
  const rate = (t: SeepTest) => units.fmt(t.litresPerDay, 'rate', digits(units).rate);
  const span = `${rate(first)} on ${formatDay(first.testedOn)}, ${rate(last)} on ${formatDay(last.testedOn)}`;
  const mixed = new Set(tests.map((t) => t.setting)).size > 1 ? ' The tests were not all in the same setting, so compare them with care.' : '';
  if (first.litresPerDay === 0) return `The first test lost no water; the latest shows ${rate(last)}.${mixed}`;
  const change = (last.litresPerDay - first.litresPerDay) / first.litresPerDay;
  const pct = Math.round(Math.abs(change) * 100);
  if (pct < 10) return `Seepage has held steady (within 10%): ${span}.${mixed}`;
  if (change < 0) return `Seepage has fallen by ${pct}%: ${span}. A falling rate can mean a clogged or crusted wall.${mixed}`;
  return `Seepage has risen by ${pct}%: ${span}. A sudden rise can mean a crack.${mixed}`;
}

/** A calendar date as a vega-lite DateTime at midnight UTC (months count from 1). */
function utcDay(isoDate: string) {
  const [year, month, date] = isoDate.split('-').map(Number);
  return { year, month, date, utc: true };
}

function SeepChart({ pot, units }: { pot: Pot; units: Units }) {
  const tests = pot.seepTests;
  const rateLabel = units.label('rate');
  // Dates are calendar days: read and shown in UTC so no time zone moves a test to the day before.
  const values = tests.map((t) => ({ day: t.testedOn, date: formatDay(t.testedOn), rate: units.show(t.litresPerDay, 'rate'), setting: seepSettingLabels[t.setting] }));
  const settings = new Set(values.map((v) => v.setting)).size;
  const x = {
    field: 'day',
    type: 'temporal',
    title: 'Test date',
    scale: { type: 'utc' },
    axis: { values: [...new Set(tests.map((t) => t.testedOn))].map(utcDay), format: '%d %b %Y', labelAngle: 0, labelOverlap: true, grid: false },
  };
  const y = { field: 'rate', type: 'quantitative', title: `Seepage (${rateLabel})`, scale: { zero: true } };
  const spec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: 'container',
    height: 180,
    padding: { left: 4, right: 24, top: 8, bottom: 4 },
    data: { values },
    layer: [
      { mark: { type: 'line', color: OLLA_SAGE, strokeWidth: 2 }, encoding: { x, y } },
      {
        mark: { type: 'point', filled: true, size: 90, color: OLLA_SAGE, opacity: 1 },
        encoding: {
          x,
          y,
          ...(settings > 1 ? { shape: { field: 'setting', type: 'nominal', title: 'Setting', legend: { orient: 'bottom', direction: 'horizontal' } } } : {}),
          tooltip: [
            { field: 'date', title: 'Date' },
            { field: 'setting', title: 'Setting' },
            { field: 'rate', title: rateLabel, format: '.2f' },
          ],
        },
      },
    ],
  } as VisualizationSpec;
  return (
    <Chart
      title={`Seepage of ${pot.label} over its tests`}
      takeaway={seepTakeaway(tests, units)}
      spec={spec}
      fileName={`seepage-${pot.label.replace(/[^A-Za-z0-9_-]+/g, '-')}`}
      alternative={
        <table className="text-sm">
          <caption className="sr-only">Seep tests of {pot.label}</caption>
          <thead>
            <tr>
              <th scope="col" className="pr-4 text-left">Date</th>
              <th scope="col" className="pr-4 text-left">Setting</th>
              <th scope="col" className="text-right">Seepage</th>
            </tr>
          </thead>
          <tbody>
            {tests.map((t) => (
              <tr key={t.id}>
                <td className="pr-4">{formatDay(t.testedOn)}</td>
                <td className="pr-4">{seepSettingLabels[t.setting]}</td>
                <td className="num">{units.fmt(t.litresPerDay, 'rate', 2)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      }
    />
  );
}

function AddSeepTestForm({ pot, units }: { pot: Pot; units: Units }) {
  const create = useCreateSeepTest(pot.id);
  const schema = useMemo(() => seepTestFormSchema(units), [units]);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const defaults: SeepTestFormValues = { testedOn: today(), setting: pot.plotId ? 'in_bed' : 'air', litresLost: '', hours: '24', notes: '' };
  const { register, handleSubmit, setError, reset, formState } = useForm<SeepTestFormValues, unknown, CreateSeepTestInput>({
    resolver: zodResolver(schema),
    defaultValues: defaults,
  });
  const submit = handleSubmit(async (input) => {
    setFormError(null);
    setSaved(null);
    try {
      const t = await create.mutateAsync(input);
      setSaved(`Test of ${formatDay(t.testedOn)} saved: ${units.fmt(t.litresPerDay, 'rate', 2)}.`);
      reset({ ...defaults, setting: input.setting, hours: String(input.hours) });
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  const e = formState.errors;
  const p = `seep-${pot.id}`;
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-lg border border-sand-200 bg-sand-50 p-3" aria-label={`Add a seep test to ${pot.label}`}>
      <h4 className="font-semibold">Add a seep test</h4>
      <p className="text-sm text-ink-muted">Fill the pot, wait, and measure how much water it took to top it up again.</p>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <InputField id={`${p}-date`} type="date" label="Test date" {...register('testedOn')} error={e.testedOn?.message} />
        <SelectField id={`${p}-setting`} label="Setting" {...register('setting')} error={e.setting?.message}>
          {seepSettingSchema.options.map((s) => (
            <option key={s} value={s}>
              {seepSettingLabels[s]}
            </option>
          ))}
        </SelectField>
        <InputField
          id={`${p}-lost`}
          label={`Water lost (${units.label('volume')})`}
          inputMode="decimal"
          className="text-right"
          {...register('litresLost')}
          error={e.litresLost?.message}
        />
        <InputField id={`${p}-hours`} label="Over how many hours" inputMode="decimal" className="text-right" {...register('hours')} error={e.hours?.message} />
      </div>
      <InputField id={`${p}-notes`} label="Notes (optional)" {...register('notes')} error={e.notes?.message} />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" size="lg" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Saving…' : 'Save seep test'}
        </Button>
        <span role="status" className="text-sm text-sage-800">
          {saved}
        </span>
      </div>
    </form>
  );
}

/** A pot's seep tests: the list (newest first), the trend chart and a form for the next one. */
export function SeepTests({ pot }: { pot: Pot }) {
  const units = useUnits();
  const remove = useDeleteSeepTest();
  const tests = pot.seepTests;
  return (
    <div className="space-y-4">
      {tests.length ? (
        <ul className="divide-y divide-sand-100 rounded-lg border border-sand-200" aria-label={`Seep tests of ${pot.label}`}>
          {[...tests].reverse().map((t) => (
            <li key={t.id} className="grid grid-cols-[minmax(0,1fr)_auto] items-center gap-x-3 px-3 py-2">
              <p className="font-medium">{formatDay(t.testedOn)}</p>
              <p className="num font-semibold">{units.fmt(t.litresPerDay, 'rate', 2)}</p>
              <p className="text-sm text-ink-muted">
                {seepSettingLabels[t.setting]} · {units.fmt(t.litresLost, 'volume', 2)} in {t.hours} h{t.notes ? ` · ${t.notes}` : ''}
              </p>
              <ConfirmAction
                label="Delete"
                ariaLabel={`Delete the seep test of ${formatDay(t.testedOn)}`}
                buttonProps={{ variant: 'ghost', className: 'min-h-11 justify-self-end' }}
                title={`Delete the seep test of ${formatDay(t.testedOn)}?`}
                confirmLabel="Delete test"
                tone="danger"
                onConfirm={() => remove.mutateAsync(t.id)}
              >
                The test ({units.fmt(t.litresPerDay, 'rate', 2)}) is removed from {pot.label}&apos;s record.
              </ConfirmAction>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-ink-muted">No seep tests yet. One in spring and one after the season shows whether the wall is clogging.</p>
      )}
      {tests.length >= 2 ? <SeepChart pot={pot} units={units} /> : null}
      <AddSeepTestForm pot={pot} units={units} />
    </div>
  );
}
