import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import type { TFunction } from 'i18next';
import { useForm } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import type { VisualizationSpec } from 'vega-embed';
import { seepSettingSchema, type CreateSeepTestInput, type Pot, type SeepTest } from '@shared/schemas/pots';
import { Chart } from '@/components/charts/chart';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmAction } from '@/components/ui/confirm-dialog';
import { InputField, SelectField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { formatNumber } from '@/lib/format';
import { formatDay } from './format-day';
import { useUnits } from '@/lib/units';
import { useCreateSeepTest } from '../api/create-seep-test';
import { useDeleteSeepTest } from '../api/delete-seep-test';
import { digits, seepTestFormSchema, type SeepTestFormValues } from './pot-form-schema';
import { usePotMessages } from './schema-messages';

type Units = ReturnType<typeof useUnits>;

/** Seepwise's olla colour, the same in every chart. */
const OLLA_SAGE = '#4a7642';

/** Today in the grower's own calendar, as YYYY-MM-DD. */
function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

/** One sentence on how the rate moved from the first test to the latest. */
export function seepTakeaway(tests: SeepTest[], units: Units, t: TFunction<'pots'>): string {
  const first = tests[0];
  const last = tests[tests.length - 1];
  if (!first || !last || tests.length < 2) return t(($) => $.seep.oneTest);
  const rate = (x: SeepTest) => units.fmt(x.litresPerDay, 'rate', digits(units).rate);
  const span = t(($) => $.seep.span, { first: rate(first), firstDate: formatDay(first.testedOn), last: rate(last), lastDate: formatDay(last.testedOn) });
  const mixed = new Set(tests.map((x) => x.setting)).size > 1 ? t(($) => $.seep.mixed) : '';
  if (first.litresPerDay === 0) return t(($) => $.seep.firstZero, { last: rate(last), mixed });
  const change = (last.litresPerDay - first.litresPerDay) / first.litresPerDay;
  const pct = Math.round(Math.abs(change) * 100);
  if (pct < 10) return t(($) => $.seep.steady, { span, mixed });
  if (change < 0) return t(($) => $.seep.fallen, { pct: formatNumber(pct, 0), span, mixed });
  return t(($) => $.seep.risen, { pct: formatNumber(pct, 0), span, mixed });
}

/** A calendar date as a vega-lite DateTime at midnight UTC (months count from 1). */
function utcDay(isoDate: string) {
  const [year, month, date] = isoDate.split('-').map(Number);
  return { year, month, date, utc: true };
}

function SeepChart({ pot, units }: { pot: Pot; units: Units }) {
  const { t } = useTranslation('pots');
  const tests = pot.seepTests;
  const rateLabel = units.label('rate');
  // Dates are calendar days: read and shown in UTC so no time zone moves a test to the day before.
  const values = tests.map((x) => ({ day: x.testedOn, date: formatDay(x.testedOn), rate: units.show(x.litresPerDay, 'rate'), setting: t(($) => $.seepSettings[x.setting]) }));
  const settings = new Set(values.map((v) => v.setting)).size;
  const x = {
    field: 'day',
    type: 'temporal',
    title: t(($) => $.seep.testDate),
    scale: { type: 'utc' },
    axis: { values: [...new Set(tests.map((x) => x.testedOn))].map(utcDay), format: '%d %b %Y', labelAngle: 0, labelOverlap: true, grid: false },
  };
  const y = { field: 'rate', type: 'quantitative', title: t(($) => $.seep.seepage, { unit: rateLabel }), scale: { zero: true } };
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
          ...(settings > 1 ? { shape: { field: 'setting', type: 'nominal', title: t(($) => $.seep.setting), legend: { orient: 'bottom', direction: 'horizontal' } } } : {}),
          tooltip: [
            { field: 'date', title: t(($) => $.seep.date) },
            { field: 'setting', title: t(($) => $.seep.setting) },
            { field: 'rate', title: rateLabel, format: '.2f' },
          ],
        },
      },
    ],
  } as VisualizationSpec;
  return (
    <Chart
      title={t(($) => $.seep.chartTitle, { pot: pot.label })}
      takeaway={seepTakeaway(tests, units, t)}
      spec={spec}
      fileName={`seepage-${pot.label.replace(/[^A-Za-z0-9_-]+/g, '-')}`}
      alternative={
        <table className="text-sm">
          <caption className="sr-only">{t(($) => $.seep.tableCaption, { pot: pot.label })}</caption>
          <thead>
            <tr>
              <th scope="col" className="pr-4 text-left">
                {t(($) => $.seep.date)}
              </th>
              <th scope="col" className="pr-4 text-left">
                {t(($) => $.seep.setting)}
              </th>
              <th scope="col" className="text-right">
                {t(($) => $.seep.seepageCol)}
              </th>
            </tr>
          </thead>
          <tbody>
            {tests.map((x) => (
              <tr key={x.id}>
                <td className="pr-4">{formatDay(x.testedOn)}</td>
                <td className="pr-4">{t(($) => $.seepSettings[x.setting])}</td>
                <td className="num">{units.fmt(x.litresPerDay, 'rate', 2)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      }
    />
  );
}

function AddSeepTestForm({ pot, units }: { pot: Pot; units: Units }) {
  const { t } = useTranslation('pots');
  const create = useCreateSeepTest(pot.id);
  const schema = useMemo(() => seepTestFormSchema(units, t), [units, t]);
  const m = usePotMessages();
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
      const created = await create.mutateAsync(input);
      setSaved(t(($) => $.seep.savedTest, { date: formatDay(created.testedOn), rate: units.fmt(created.litresPerDay, 'rate', 2) }));
      reset({ ...defaults, setting: input.setting, hours: String(input.hours) });
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  const e = formState.errors;
  const p = `seep-${pot.id}`;
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-lg border border-sand-200 bg-sand-50 p-3" aria-label={t(($) => $.seep.formLabel, { pot: pot.label })}>
      <h4 className="font-semibold">{t(($) => $.seep.add)}</h4>
      <p className="text-sm text-ink-muted">{t(($) => $.seep.howTo)}</p>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <InputField id={`${p}-date`} type="date" label={t(($) => $.seep.testDate)} {...register('testedOn')} error={m(e.testedOn?.message)} />
        <SelectField id={`${p}-setting`} label={t(($) => $.seep.setting)} {...register('setting')} error={m(e.setting?.message)}>
          {seepSettingSchema.options.map((s) => (
            <option key={s} value={s}>
              {t(($) => $.seepSettings[s])}
            </option>
          ))}
        </SelectField>
        <InputField
          id={`${p}-lost`}
          label={t(($) => $.seep.lost, { unit: units.label('volume') })}
          inputMode="decimal"
          className="text-right"
          {...register('litresLost')}
          error={m(e.litresLost?.message)}
        />
        <InputField id={`${p}-hours`} label={t(($) => $.seep.hours)} inputMode="decimal" className="text-right" {...register('hours')} error={m(e.hours?.message)} />
      </div>
      <InputField id={`${p}-notes`} label={t(($) => $.seep.notes)} {...register('notes')} error={m(e.notes?.message)} />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" size="lg" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? t(($) => $.form.saving) : t(($) => $.seep.save)}
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
  const { t } = useTranslation('pots');
  const { t: tc } = useTranslation('common');
  const remove = useDeleteSeepTest();
  const tests = pot.seepTests;
  return (
    <div className="space-y-4">
      {tests.length ? (
        <ul className="divide-y divide-sand-100 rounded-lg border border-sand-200" aria-label={t(($) => $.seep.listLabel, { pot: pot.label })}>
          {[...tests].reverse().map((x) => (
            <li key={x.id} className="grid grid-cols-[minmax(0,1fr)_auto] items-center gap-x-3 px-3 py-2">
              <p className="font-medium">{formatDay(x.testedOn)}</p>
              <p className="num font-semibold">{units.fmt(x.litresPerDay, 'rate', 2)}</p>
              <p className="text-sm text-ink-muted">
                {t(($) => $.seepSettings[x.setting])} · {t(($) => $.seep.lostIn, { lost: units.fmt(x.litresLost, 'volume', 2), hours: formatNumber(x.hours, 1) })}
                {x.notes ? ` · ${x.notes}` : ''}
              </p>
              <ConfirmAction
                label={tc(($) => $.actions.delete)}
                ariaLabel={t(($) => $.seep.deleteTest, { date: formatDay(x.testedOn) })}
                buttonProps={{ variant: 'ghost', className: 'min-h-11 justify-self-end' }}
                title={t(($) => $.seep.deleteTitle, { date: formatDay(x.testedOn) })}
                confirmLabel={t(($) => $.seep.deleteConfirm)}
                tone="danger"
                onConfirm={() => remove.mutateAsync(x.id)}
              >
                {t(($) => $.seep.deleteBody, { rate: units.fmt(x.litresPerDay, 'rate', 2), pot: pot.label })}
              </ConfirmAction>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-ink-muted">{t(($) => $.seep.none)}</p>
      )}
      {tests.length >= 2 ? <SeepChart pot={pot} units={units} /> : null}
      <AddSeepTestForm pot={pot} units={units} />
    </div>
  );
}
