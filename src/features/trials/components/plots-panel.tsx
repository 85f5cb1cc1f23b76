import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { z } from 'zod';
import { createPlotInputSchema, plotSettingSchema, type Plot } from '@shared/schemas/plots';
import type { Trial } from '@shared/schemas/trials';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { CautionNote } from '@/components/ui/caution-note';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { InputField, SelectField } from '@/components/ui/field';
import { currentLanguage } from '@/i18n';
import { applyServerErrors } from '@/lib/form-errors';
import { decimalOrUndefined } from '@/lib/parse-number';
import { useUnits } from '@/lib/units';
import { cn } from '@/lib/utils';
import { usePlots } from '../api/get-plots';
import { useCreatePlot, useDeletePlot, useRandomise } from '../api/trial-mutations';
import { useTrialMessages } from './schema-messages';

const makeFormSchema = (m: { label: string; pair: string; area: string; areaPositive: string; plants: string }) =>
  z.object({
    label: z.string().trim().min(1, m.label).max(40),
    blockKey: z.string().trim().min(1, m.pair).max(40),
    area: z.number({ message: m.area }).positive(m.areaPositive),
    setting: plotSettingSchema,
    mulch: z.boolean(),
    lid: z.boolean(),
    plantCount: z.number({ message: m.plants }).int().min(0),
  });
type FormValues = z.infer<ReturnType<typeof makeFormSchema>>;

export function TreatmentTag({ treatment }: { treatment: string | null }) {
  const { t } = useTranslation('trials');
  if (!treatment) return <span className="rounded bg-sand-100 px-2 py-0.5 text-xs text-ink-muted">{t(($) => $.plots.notAssigned)}</span>;
  const cls = treatment === 'olla' ? 'bg-olla text-white' : treatment === 'surface' ? 'bg-surface text-white' : 'bg-sand-200 text-ink';
  const name = treatment === 'olla' || treatment === 'surface' ? t(($) => $.treatments[treatment]) : treatment;
  return <span className={cn('rounded px-2 py-0.5 text-xs font-semibold', cls)}>{name}</span>;
}

export function PlotsPanel({ trial }: { trial: Trial }) {
  const units = useUnits();
  const { t } = useTranslation('trials');
  const { t: tc } = useTranslation('common');
  const m = useTrialMessages();
  const formSchema = useMemo(
    () =>
      makeFormSchema({
        label: t(($) => $.plots.errors.label),
        pair: t(($) => $.plots.errors.pair),
        area: t(($) => $.plots.errors.area),
        areaPositive: t(($) => $.plots.errors.areaPositive),
        plants: t(($) => $.plots.errors.plants),
      }),
    [t],
  );
  const plots = usePlots(trial.id);
  const create = useCreatePlot(trial.id);
  const remove = useDeletePlot(trial.id);
  const randomise = useRandomise(trial.id);
  const [toDelete, setToDelete] = useState<Plot | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const editable = trial.access === 'owner' && trial.status !== 'closed';
  const { register, handleSubmit, setError, reset, watch, formState } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { setting: 'in_ground', mulch: false, lid: true, plantCount: 1 },
  });
  const submit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      const input = createPlotInputSchema.parse({ ...v, areaM2: units.toSI(v.area, 'area'), treatment: null });
      await create.mutateAsync(input);
      reset({ ...v, label: '' });
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });

  const rows = plots.data ?? [];
  const blocks = [...new Set(rows.map((p) => p.blockKey))];
  const unassigned = rows.some((p) => !p.treatment);
  const e = formState.errors;
  return (
    <section aria-labelledby="plots-heading" className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="plots-heading">{t(($) => $.plots.title)}</h2>
          <p className="text-sm text-ink-muted">{t(($) => $.plots.intro)}</p>
        </div>
        {editable && rows.length ? (
          <Button onClick={() => randomise.mutate(undefined)} disabled={randomise.isPending} variant={unassigned ? 'primary' : 'secondary'}>
            {unassigned ? t(($) => $.plots.assign) : t(($) => $.plots.redraw)}
          </Button>
        ) : null}
      </div>
      {randomise.isError ? <Alert tone="error">{randomise.error.message}</Alert> : null}
      {trial.randomisationSeed ? (
        <p className="text-sm text-ink-muted">
          {t(($) => $.plots.seedBefore)} <code className="rounded bg-sand-100 px-1">{trial.randomisationSeed}</code>
          {t(($) => $.plots.seedAfter)}
        </p>
      ) : null}
      {plots.isPending ? <p role="status">{t(($) => $.plots.loading)}</p> : null}
      {blocks.length ? (
        <div className="grid gap-3 sm:grid-cols-2">
          {blocks.map((b) => (
            <div key={b} className="rounded-card border border-sand-200 bg-white p-3">
              <h3 className="text-base">{t(($) => $.plots.pair, { pair: b })}</h3>
              <ul className="mt-2 space-y-2">
                {rows
                  .filter((p) => p.blockKey === b)
                  .map((p) => (
                    <li key={p.id} className="flex flex-wrap items-center gap-2 text-sm">
                      <span className="font-medium">{p.label}</span>
                      <TreatmentTag treatment={p.treatment} />
                      <span className="text-ink-muted">
                        {units.fmt(p.areaM2, 'area', 1)} · {t(($) => $.plots.settings[p.setting])} · {t(($) => $.plots.plants, { count: p.plantCount })}
                        {p.mulch ? ` · ${t(($) => $.plots.mulched)}` : ''}
                        {p.treatment === 'olla' ? ` · ${p.lid ? t(($) => $.plots.lidded) : t(($) => $.plots.open)}` : ''}
                        {p.potIds.length ? ` · ${t(($) => $.plots.pots, { count: p.potIds.length })}` : ''}
                      </span>
                      {editable ? (
                        <Button variant="ghost" size="sm" className="ml-auto" onClick={() => setToDelete(p)} aria-label={t(($) => $.plots.deletePlot, { label: p.label })}>
                          {tc(($) => $.actions.delete)}
                        </Button>
                      ) : null}
                    </li>
                  ))}
              </ul>
            </div>
          ))}
        </div>
      ) : plots.isSuccess ? (
        <p className="text-ink-muted">{t(($) => $.plots.none)}</p>
      ) : null}
      {editable ? (
        <form onSubmit={submit} noValidate className="grid gap-3 rounded-card border border-sand-200 bg-white p-4 sm:grid-cols-4" aria-label={t(($) => $.plots.add)}>
          <h3 className="text-base sm:col-span-4">{t(($) => $.plots.add)}</h3>
          {formError ? <Alert tone="error" className="sm:col-span-4">{formError}</Alert> : null}
          <InputField label={t(($) => $.plots.label)} placeholder="A1" {...register('label')} error={m(e.label?.message)} />
          <InputField label={t(($) => $.plots.pairField)} placeholder="A" {...register('blockKey')} error={m(e.blockKey?.message)} />
          <InputField label={t(($) => $.plots.area, { unit: units.label('area') })} inputMode="decimal" {...register('area', { setValueAs: decimalOrUndefined })} error={m(e.area?.message)} />
          <InputField label={t(($) => $.plots.plantsField)} inputMode="numeric" {...register('plantCount', { setValueAs: decimalOrUndefined })} error={m(e.plantCount?.message)} />
          <SelectField label={t(($) => $.plots.setting)} {...register('setting')}>
            {plotSettingSchema.options.map((k) => (
              <option key={k} value={k}>
                {t(($) => $.plots.settings[k])}
              </option>
            ))}
          </SelectField>
          <label className="flex items-center gap-2 self-end pb-2 text-sm">
            <input type="checkbox" className="size-4 accent-terracotta-600" {...register('mulch')} /> {t(($) => $.plots.mulchedField)}
          </label>
          <label className="flex items-center gap-2 self-end pb-2 text-sm">
            <input type="checkbox" className="size-4 accent-terracotta-600" {...register('lid')} /> {t(($) => $.plots.lids)}
          </label>
          {watch('lid') === false ? <CautionNote id="openPotMosquitoes" lang={currentLanguage()} className="sm:col-span-4" /> : null}
          <div className="self-end">
            <Button type="submit" disabled={formState.isSubmitting}>
              {t(($) => $.plots.addButton)}
            </Button>
          </div>
        </form>
      ) : null}
      <ConfirmDialog
        open={toDelete !== null}
        title={t(($) => $.plots.deleteTitle, { label: toDelete?.label ?? '' })}
        confirmLabel={t(($) => $.plots.deleteConfirm)}
        tone="danger"
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onCancel={() => setToDelete(null)}
        onConfirm={() => toDelete && remove.mutate(toDelete.id, { onSuccess: () => setToDelete(null) })}
      >
        {t(($) => $.plots.deleteBody)}
      </ConfirmDialog>
    </section>
  );
}
