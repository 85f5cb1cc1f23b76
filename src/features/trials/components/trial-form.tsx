import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import type { z } from 'zod';
import { createTrialInputSchema, cropIds, type CreateTrialInput, type Trial } from '@shared/schemas/trials';
import { dayInTimeZone } from '@shared/time-zone';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useTrialMessages } from './schema-messages';

type FormValues = z.input<typeof createTrialInputSchema>;

/** Trial setup: crop, dates and the question. Paired olla-versus-surface is the default design. */
export function TrialForm({ trial, timeZone, onSubmit, submitLabel }: { trial?: Trial; timeZone?: string; onSubmit: (input: CreateTrialInput) => Promise<unknown>; submitLabel: string }) {
  const { t } = useTranslation('trials');
  const m = useTrialMessages();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, watch, formState } = useForm<FormValues, unknown, CreateTrialInput>({
    resolver: zodResolver(createTrialInputSchema),
    defaultValues: trial
      ? { ...trial }
      : { crop: 'tomato', design: 'paired', treatments: ['olla', 'surface'], plantingDate: dayInTimeZone(new Date(), timeZone ?? 'UTC'), endDate: null },
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
      <InputField label={t(($) => $.form.title)} placeholder={t(($) => $.form.titlePlaceholder)} {...register('title')} error={m(e.title?.message)} />
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField label={t(($) => $.form.crop)} {...register('crop')} error={m(e.crop?.message)}>
          {cropIds.map((c) => (
            <option key={c} value={c}>
              {t(($) => $.crops[c])}
            </option>
          ))}
        </SelectField>
        {crop === 'other' ? <InputField label={t(($) => $.form.cropName)} {...register('cropName')} error={m(e.cropName?.message)} /> : null}
        <InputField label={t(($) => $.form.variety)} {...register('variety')} error={m(e.variety?.message)} />
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <InputField label={t(($) => $.form.plantingDate)} type="date" {...register('plantingDate')} error={m(e.plantingDate?.message)} />
        <InputField label={t(($) => $.form.endDate)} type="date" {...register('endDate', { setValueAs: (v: string) => v || null })} error={m(e.endDate?.message)} />
        <SelectField label={t(($) => $.form.design)} {...register('design')} error={m(e.design?.message)} disabled={Boolean(trial)}>
          <option value="paired">{t(($) => $.form.designPaired)}</option>
        </SelectField>
      </div>
      <TextareaField
        label={t(($) => $.form.question)}
        placeholder={t(($) => $.form.questionPlaceholder)}
        {...register('question')}
        error={m(e.question?.message)}
      />
      <TextareaField label={t(($) => $.form.protocolNotes)} hint={t(($) => $.form.protocolHint)} {...register('protocolNotes')} error={m(e.protocolNotes?.message)} />
      {e.treatments?.message ? <Alert tone="error">{m(e.treatments.message)}</Alert> : null}
      <Button type="submit" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? t(($) => $.form.saving) : submitLabel}
      </Button>
    </form>
  );
}
