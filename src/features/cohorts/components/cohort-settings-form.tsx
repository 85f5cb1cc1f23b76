import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { updateCohortInputSchema, type CohortSummary } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useUpdateCohort } from '../api/update-cohort';
import { capacityFromInput, licenceValues } from './labels';

type FormValues = z.input<typeof updateCohortInputSchema>;

function valuesOf(c: CohortSummary): FormValues {
  return { name: c.name, description: c.description, capacity: c.capacity, licence: c.licence as FormValues['licence'], closed: c.closed };
}

/** The lead's settings: name, description, member limit, licence and whether new members may join. */
export function CohortSettingsForm({ cohort }: { cohort: CohortSummary }) {
  const { t } = useTranslation('cohorts');
  const { t: tc } = useTranslation();
  const update = useUpdateCohort(cohort.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { register, handleSubmit, setError, formState, reset } = useForm<FormValues, unknown, z.output<typeof updateCohortInputSchema>>({
    resolver: localizedZodResolver(updateCohortInputSchema),
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
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.form.settingsForm)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label={t(($) => $.form.name)} {...register('name')} error={errors.name ? t(($) => $.form.nameRangeError) : undefined} />
      <TextareaField label={t(($) => $.form.description)} {...register('description')} error={errors.description ? t(($) => $.form.descriptionError) : undefined} />
      <div className="grid gap-4 sm:grid-cols-2">
        <InputField
          label={t(($) => $.form.capacity)}
          type="number"
          inputMode="numeric"
          min={1}
          max={10000}
          step={1}
          hint={t(($) => $.form.capacitySettingsHint)}
          {...register('capacity', { setValueAs: capacityFromInput })}
          error={errors.capacity ? t(($) => $.capacityError) : undefined}
        />
        <SelectField label={t(($) => $.form.licence)} {...register('licence')} error={errors.licence?.message}>
          {licenceValues.map((value) => (
            <option key={value} value={value}>
              {t(($) => $.licences[value])}
            </option>
          ))}
        </SelectField>
      </div>
      <label className="flex min-h-12 cursor-pointer items-start gap-3 rounded-lg border border-sand-300 px-3 py-2.5 hover:bg-sand-50">
        <input type="checkbox" className="mt-1 size-5 shrink-0 accent-terracotta-600" {...register('closed')} />
        <span>
          <span className="block font-medium">{t(($) => $.form.closed)}</span>
          <span className="block text-sm text-ink-muted">{t(($) => $.form.closedHint)}</span>
        </span>
      </label>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" size="lg" disabled={formState.isSubmitting || !formState.isDirty}>
          {formState.isSubmitting ? tc(($) => $.actions.saving) : t(($) => $.form.save)}
        </Button>
        {saved && !formState.isDirty ? (
          <p role="status" className="text-sm font-medium text-sage-800">
            {tc(($) => $.actions.saved)}
          </p>
        ) : null}
      </div>
    </form>
  );
}
