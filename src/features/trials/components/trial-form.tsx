import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { createTrialInputSchema, cropIds, cropLabels, type CreateTrialInput, type Trial } from '@shared/schemas/trials';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';

type FormValues = z.input<typeof createTrialInputSchema>;

/** Trial setup: crop, dates and the question. Paired olla-versus-surface is the default design. */
export function TrialForm({ trial, onSubmit, submitLabel }: { trial?: Trial; onSubmit: (input: CreateTrialInput) => Promise<unknown>; submitLabel: string }) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, watch, formState } = useForm<FormValues, unknown, CreateTrialInput>({
    resolver: zodResolver(createTrialInputSchema),
    defaultValues: trial
      ? { ...trial }
      : { crop: 'tomato', design: 'paired', treatments: ['olla', 'surface'], plantingDate: new Date().toISOString().slice(0, 10), endDate: null },
  });
  const crop = watch('crop');
  const submit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      await onSubmit({ ...v, endDate: v.endDate || null });
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  const e = formState.errors;
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label={submitLabel}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label="Trial title" placeholder="Tomatoes by the south fence, 2027" {...register('title')} error={e.title?.message} />
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField label="Crop" {...register('crop')} error={e.crop?.message}>
          {cropIds.map((c) => (
            <option key={c} value={c}>
              {cropLabels[c]}
            </option>
          ))}
        </SelectField>
        {crop === 'other' ? <InputField label="Crop name" {...register('cropName')} error={e.cropName?.message} /> : null}
        <InputField label="Variety" {...register('variety')} error={e.variety?.message} />
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <InputField label="Planting date" type="date" {...register('plantingDate')} error={e.plantingDate?.message} />
        <InputField label="End date (optional)" type="date" {...register('endDate', { setValueAs: (v: string) => v || null })} error={e.endDate?.message} />
        <SelectField label="Design" {...register('design')} error={e.design?.message} disabled={Boolean(trial)}>
          <option value="paired">Paired plots: olla vs surface watering</option>
        </SelectField>
      </div>
      <TextareaField
        label="Your question"
        placeholder="Do buried pots save water on my tomatoes without costing harvest?"
        {...register('question')}
        error={e.question?.message}
      />
      <TextareaField label="Protocol notes" hint="How you measure water, when you pick, anything a reader should know." {...register('protocolNotes')} error={e.protocolNotes?.message} />
      {e.treatments?.message ? <Alert tone="error">{e.treatments.message}</Alert> : null}
      <Button type="submit" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Saving…' : submitLabel}
      </Button>
    </form>
  );
}
