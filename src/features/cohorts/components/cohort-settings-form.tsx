import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { updateCohortInputSchema, type CohortSummary } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateCohort } from '../api/update-cohort';
import { capacityFromInput, capacityMessage, licenceOptions } from './labels';

type FormValues = z.input<typeof updateCohortInputSchema>;

function valuesOf(c: CohortSummary): FormValues {
  return { name: c.name, description: c.description, capacity: c.capacity, licence: c.licence as FormValues['licence'], closed: c.closed };
}

/** The lead's settings: name, description, member limit, licence and whether new members may join. */
export function CohortSettingsForm({ cohort }: { cohort: CohortSummary }) {
  const update = useUpdateCohort(cohort.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { register, handleSubmit, setError, formState, reset } = useForm<FormValues, unknown, z.output<typeof updateCohortInputSchema>>({
    resolver: zodResolver(updateCohortInputSchema),
    defaultValues: valuesOf(cohort),
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSaved(false);
    try {
      const next = await update.mutateAsync(values);
      reset(valuesOf(next));
      setSaved(true);
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  const { errors } = formState;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Cohort settings">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label="Name" {...register('name')} error={errors.name ? 'Give the cohort a name of 2 to 120 characters.' : undefined} />
      <TextareaField label="Description" {...register('description')} error={errors.description ? 'Keep the description under 2,000 characters.' : undefined} />
      <div className="grid gap-4 sm:grid-cols-2">
        <InputField
          label="Member limit"
          type="number"
          inputMode="numeric"
          min={1}
          max={10000}
          step={1}
          hint="Empty: no limit. Members already in stay even above the limit."
          {...register('capacity', { setValueAs: capacityFromInput })}
          error={errors.capacity ? capacityMessage : undefined}
        />
        <SelectField label="Licence for the pooled data" {...register('licence')} error={errors.licence?.message}>
          {licenceOptions.map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </SelectField>
      </div>
      <label className="flex min-h-12 cursor-pointer items-start gap-3 rounded-lg border border-sand-300 px-3 py-2.5 hover:bg-sand-50">
        <input type="checkbox" className="mt-1 size-5 shrink-0 accent-terracotta-600" {...register('closed')} />
        <span>
          <span className="block font-medium">Closed to new members</span>
          <span className="block text-sm text-ink-muted">The join code and open invitations are refused until you untick this. Members stay.</span>
        </span>
      </label>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" size="lg" disabled={formState.isSubmitting || !formState.isDirty}>
          {formState.isSubmitting ? 'Saving…' : 'Save settings'}
        </Button>
        {saved && !formState.isDirty ? (
          <p role="status" className="text-sm font-medium text-sage-800">
            Saved.
          </p>
        ) : null}
      </div>
    </form>
  );
}
