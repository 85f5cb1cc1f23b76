import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { createPlotInputSchema, plotSettingSchema, type Plot } from '@shared/schemas/plots';
import type { Trial } from '@shared/schemas/trials';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { CautionNote } from '@/components/ui/caution-note';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { InputField, SelectField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUnits } from '@/lib/units';
import { cn } from '@/lib/utils';
import { usePlots } from '../api/get-plots';
import { useCreatePlot, useDeletePlot, useRandomise } from '../api/trial-mutations';

const settingLabels: Record<z.infer<typeof plotSettingSchema>, string> = { in_ground: 'In the ground', raised_bed: 'Raised bed', container: 'Container' };

const formSchema = z.object({
  label: z.string().trim().min(1, 'Give the plot a label.').max(40),
  blockKey: z.string().trim().min(1, 'Say which pair it belongs to.').max(40),
  area: z.number({ message: 'Enter the area.' }).positive('Area must be more than zero.'),
  setting: plotSettingSchema,
  mulch: z.boolean(),
  lid: z.boolean(),
  plantCount: z.number({ message: 'How many plants?' }).int().min(0),
});
type FormValues = z.infer<typeof formSchema>;

export function TreatmentTag({ treatment }: { treatment: string | null }) {
  if (!treatment) return <span className="rounded bg-sand-100 px-2 py-0.5 text-xs text-ink-muted">not assigned</span>;
  const cls = treatment === 'olla' ? 'bg-olla text-white' : treatment === 'surface' ? 'bg-surface text-white' : 'bg-sand-200 text-ink';
  return <span className={cn('rounded px-2 py-0.5 text-xs font-semibold', cls)}>{treatment}</span>;
}

export function PlotsPanel({ trial }: { trial: Trial }) {
  const units = useUnits();
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
          <h2 id="plots-heading">Plots and pairs</h2>
          <p className="text-sm text-ink-muted">
            Each pair holds two matched plots: same crop, same planting date, side by side. Seepwise decides at random which one gets the pots.
          </p>
        </div>
        {editable && rows.length ? (
          <Button onClick={() => randomise.mutate(undefined)} disabled={randomise.isPending} variant={unassigned ? 'primary' : 'secondary'}>
            {unassigned ? 'Assign treatments at random' : 'Re-draw the assignment'}
          </Button>
        ) : null}
      </div>
      {randomise.isError ? <Alert tone="error">{randomise.error.message}</Alert> : null}
      {trial.randomisationSeed ? (
        <p className="text-sm text-ink-muted">
          Assignment drawn with seed <code className="rounded bg-sand-100 px-1">{trial.randomisationSeed}</code>: the same seed and plots always give the same draw.
        </p>
      ) : null}
      {plots.isPending ? <p role="status">Loading plots…</p> : null}
      {blocks.length ? (
        <div className="grid gap-3 sm:grid-cols-2">
          {blocks.map((b) => (
            <div key={b} className="rounded-card border border-sand-200 bg-white p-3">
              <h3 className="text-base">Pair {b}</h3>
              <ul className="mt-2 space-y-2">
                {rows
                  .filter((p) => p.blockKey === b)
                  .map((p) => (
                    <li key={p.id} className="flex flex-wrap items-center gap-2 text-sm">
                      <span className="font-medium">{p.label}</span>
                      <TreatmentTag treatment={p.treatment} />
                      <span className="text-ink-muted">
                        {units.fmt(p.areaM2, 'area', 1)} · {settingLabels[p.setting]} · {p.plantCount} plant{p.plantCount === 1 ? '' : 's'}
                        {p.mulch ? ' · mulched' : ''}
                        {p.treatment === 'olla' ? (p.lid ? ' · pots lidded' : ' · pots open') : ''}
                        {p.potIds.length ? ` · ${p.potIds.length} pot${p.potIds.length === 1 ? '' : 's'}` : ''}
                      </span>
                      {editable ? (
                        <Button variant="ghost" size="sm" className="ml-auto" onClick={() => setToDelete(p)} aria-label={`Delete plot ${p.label}`}>
                          Delete
                        </Button>
                      ) : null}
                    </li>
                  ))}
              </ul>
            </div>
          ))}
        </div>
      ) : plots.isSuccess ? (
        <p className="text-ink-muted">No plots yet. Add two plots per pair below.</p>
      ) : null}
      {editable ? (
        <form onSubmit={submit} noValidate className="grid gap-3 rounded-card border border-sand-200 bg-white p-4 sm:grid-cols-4" aria-label="Add a plot">
          <h3 className="text-base sm:col-span-4">Add a plot</h3>
          {formError ? <Alert tone="error" className="sm:col-span-4">{formError}</Alert> : null}
          <InputField label="Label" placeholder="A1" {...register('label')} error={e.label?.message} />
          <InputField label="Pair" placeholder="A" {...register('blockKey')} error={e.blockKey?.message} />
          <InputField label={`Area (${units.label('area')})`} inputMode="decimal" {...register('area', { valueAsNumber: true })} error={e.area?.message} />
          <InputField label="Plants" inputMode="numeric" {...register('plantCount', { valueAsNumber: true })} error={e.plantCount?.message} />
          <SelectField label="Setting" {...register('setting')}>
            {Object.entries(settingLabels).map(([k, v]) => (
              <option key={k} value={k}>
                {v}
              </option>
            ))}
          </SelectField>
          <label className="flex items-center gap-2 self-end pb-2 text-sm">
            <input type="checkbox" className="size-4 accent-terracotta-600" {...register('mulch')} /> Mulched
          </label>
          <label className="flex items-center gap-2 self-end pb-2 text-sm">
            <input type="checkbox" className="size-4 accent-terracotta-600" {...register('lid')} /> Pots have lids
          </label>
          {watch('lid') === false ? <CautionNote id="openPotMosquitoes" className="sm:col-span-4" /> : null}
          <div className="self-end">
            <Button type="submit" disabled={formState.isSubmitting}>
              Add plot
            </Button>
          </div>
        </form>
      ) : null}
      <ConfirmDialog
        open={toDelete !== null}
        title={`Delete plot ${toDelete?.label ?? ''}?`}
        confirmLabel="Delete plot"
        tone="danger"
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onCancel={() => setToDelete(null)}
        onConfirm={() => toDelete && remove.mutate(toDelete.id, { onSuccess: () => setToDelete(null) })}
      >
        Every refill, reading and harvest logged on this plot is deleted with it.
      </ConfirmDialog>
    </section>
  );
}
