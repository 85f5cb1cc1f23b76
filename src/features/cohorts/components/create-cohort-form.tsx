import { useEffect, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { cohortKindSchema, createCohortInputSchema, type CohortSummary } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useCreateCohort } from '../api/create-cohort';
import { capacityFromInput, licenceValues } from './labels';

type FormValues = z.input<typeof createCohortInputSchema>;

/** Educators and admins start a cohort; they become its lead. */
export function CreateCohortForm({ onCreated, onCancel, autoFocus }: { onCreated: (cohort: CohortSummary) => void; onCancel?: () => void; autoFocus?: boolean }) {
  const { t } = useTranslation('cohorts');
  const { t: tc } = useTranslation();
  const create = useCreateCohort();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, setFocus, formState } = useForm<FormValues, unknown, z.output<typeof createCohortInputSchema>>({
    resolver: localizedZodResolver(createCohortInputSchema, {
      name: (i) => (i.code === 'too_small' ? t(($) => $.form.nameError) : undefined),
      capacity: t(($) => $.capacityError),
    }),
    defaultValues: { name: '', description: '', kind: 'programme', capacity: null, licence: 'CC-BY-4.0' },
  });
  useEffect(() => {
    if (autoFocus) setFocus('name');
  }, [autoFocus, setFocus]);
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      onCreated(await create.mutateAsync(values));
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  const { errors } = formState;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.form.newForm)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label={t(($) => $.form.name)} placeholder={t(($) => $.form.namePlaceholder)} {...register('name')} error={errors.name?.message} />
      <TextareaField label={t(($) => $.form.descriptionOptional)} hint={t(($) => $.form.descriptionHint)} {...register('description')} error={errors.description?.message} />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label={t(($) => $.form.kind)} {...register('kind')} error={errors.kind?.message}>
          {cohortKindSchema.options.map((value) => (
            <option key={value} value={value}>
              {t(($) => $.kindHints[value])}
            </option>
          ))}
        </SelectField>
        <InputField
          label={t(($) => $.form.capacityOptional)}
          type="number"
          inputMode="numeric"
          min={1}
          max={10000}
          step={1}
          hint={t(($) => $.form.capacityHint)}
          {...register('capacity', { setValueAs: capacityFromInput })}
          error={errors.capacity?.message}
        />
      </div>
      <SelectField label={t(($) => $.form.licence)} hint={t(($) => $.form.licenceHint)} {...register('licence')} error={errors.licence?.message}>
        {licenceValues.map((value) => (
          <option key={value} value={value}>
            {t(($) => $.licences[value])}
          </option>
        ))}
      </SelectField>
      <div className="flex flex-col gap-2 sm:flex-row">
        <Button type="submit" size="lg" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? t(($) => $.form.creating) : t(($) => $.form.create)}
        </Button>
        {onCancel ? (
          <Button variant="secondary" size="lg" onClick={onCancel}>
            {tc(($) => $.actions.cancel)}
          </Button>
        ) : null}
      </div>
    </form>
  );
}
