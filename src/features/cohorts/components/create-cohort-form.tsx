import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { createCohortInputSchema, type CohortSummary } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateCohort } from '../api/create-cohort';
import { capacityFromInput, capacityMessage, kindHints, licenceOptions } from './labels';

type FormValues = z.input<typeof createCohortInputSchema>;

/** Educators and admins start a cohort; they become its lead. */
export function CreateCohortForm({ onCreated, onCancel, autoFocus }: { onCreated: (cohort: CohortSummary) => void; onCancel?: () => void; autoFocus?: boolean }) {
  const create = useCreateCohort();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, setFocus, formState } = useForm<FormValues, unknown, z.output<typeof createCohortInputSchema>>({
    resolver: zodResolver(createCohortInputSchema),
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
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="New cohort">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label="Name" placeholder="Saltbush Bend Summer Trials" {...register('name')} error={errors.name?.message} />
      <TextareaField
        label="Description (optional)"
        hint="What the cohort compares and who takes part. Members see this."
        {...register('description')}
        error={errors.description?.message}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Kind" {...register('kind')} error={errors.kind?.message}>
          {Object.entries(kindHints).map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </SelectField>
        <InputField
          label="Member limit (optional)"
          type="number"
          inputMode="numeric"
          min={1}
          max={10000}
          step={1}
          hint="Leave empty for no limit."
          {...register('capacity', { setValueAs: capacityFromInput })}
          error={errors.capacity ? capacityMessage : undefined}
        />
      </div>
      <SelectField label="Licence for the pooled data" hint="Applies to the pseudonymised data members and students export." {...register('licence')} error={errors.licence?.message}>
        {licenceOptions.map(([value, label]) => (
          <option key={value} value={value}>
            {label}
          </option>
        ))}
      </SelectField>
      <div className="flex flex-col gap-2 sm:flex-row">
        <Button type="submit" size="lg" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Creating…' : 'Create cohort'}
        </Button>
        {onCancel ? (
          <Button variant="secondary" size="lg" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
