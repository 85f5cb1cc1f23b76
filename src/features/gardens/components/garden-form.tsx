import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { z } from 'zod';
import { gardenInputSchema, soilTextures, type CreateGardenInput, type Garden } from '@shared/schemas/gardens';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { decimalOrUndefined } from '@/lib/parse-number';
import { useUnits } from '@/lib/units';
import { useGardenMessages } from './schema-messages';
import { browserTimeZone, TimeZoneOptions } from './time-zone-options';

/** The form holds elevation in the reader's unit; the schema's SI value is built on submit. Decimals may be typed with a comma. */
const makeFormSchema = (required: string, notNumber: string) =>
  gardenInputSchema.extend({
    latitudeDeg: z.number({ message: notNumber }).pipe(gardenInputSchema.shape.latitudeDeg),
    longitudeDeg: z.number({ message: notNumber }).pipe(gardenInputSchema.shape.longitudeDeg),
    elevationM: z.number({ error: (iss) => (iss.input === undefined ? required : notNumber) }),
  });
type FormValues = z.input<ReturnType<typeof makeFormSchema>>;

export function GardenForm({ garden, onSubmit, submitLabel }: { garden?: Garden; onSubmit: (input: CreateGardenInput) => Promise<unknown>; submitLabel: string }) {
  const units = useUnits();
  const { t } = useTranslation('gardens');
  const m = useGardenMessages();
  const formSchema = useMemo(() => makeFormSchema(t(($) => $.form.elevationRequired), t(($) => $.form.notANumber)), [t]);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: garden
      ? { ...garden, elevationM: Math.round(units.show(garden.elevationM, 'length')) }
      : { name: '', soilTexture: 'sandy_loam', coastal: false, notes: '', timeZone: browserTimeZone() },
  });
  const submit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      const parsed = gardenInputSchema.parse({ ...v, elevationM: units.toSI(Number(v.elevationM), 'length') });
      await onSubmit(parsed);
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  const e = formState.errors;
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label={submitLabel}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label={t(($) => $.form.name)} {...register('name')} error={m(e.name?.message)} />
      <div className="grid gap-4 sm:grid-cols-3">
        <InputField label={t(($) => $.form.latitude)} inputMode="decimal" {...register('latitudeDeg', { setValueAs: decimalOrUndefined })} error={m(e.latitudeDeg?.message)} />
        <InputField label={t(($) => $.form.longitude)} inputMode="decimal" {...register('longitudeDeg', { setValueAs: decimalOrUndefined })} error={m(e.longitudeDeg?.message)} />
        <InputField label={t(($) => $.form.elevation, { unit: units.label('length') })} inputMode="decimal" {...register('elevationM', { setValueAs: decimalOrUndefined })} error={m(e.elevationM?.message)} />
      </div>
      <p className="text-sm text-ink-muted">
        {t(($) => $.form.privacy)}
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label={t(($) => $.form.soil)} {...register('soilTexture')} error={m(e.soilTexture?.message)}>
          {soilTextures.map((s) => (
            <option key={s} value={s}>
              {t(($) => $.soil[s])}
            </option>
          ))}
        </SelectField>
        <label className="flex min-h-12 items-center gap-3 self-end rounded-lg border border-sand-300 bg-white px-3">
          <input type="checkbox" className="size-4 accent-terracotta-600" {...register('coastal')} />
          <span className="text-sm">{t(($) => $.form.coastal)}</span>
        </label>
      </div>
      <SelectField label={t(($) => $.form.timeZone)} hint={t(($) => $.form.timeZoneHint)} {...register('timeZone')} error={m(e.timeZone?.message)}>
        <TimeZoneOptions current={garden?.timeZone} />
      </SelectField>
      <TextareaField label={t(($) => $.form.notes)} {...register('notes')} error={m(e.notes?.message)} />
      <Button type="submit" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? t(($) => $.form.saving) : submitLabel}
      </Button>
    </form>
  );
}
