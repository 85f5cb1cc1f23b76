import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { gardenInputSchema, soilTextureLabels, soilTextures, type CreateGardenInput, type Garden } from '@shared/schemas/gardens';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUnits } from '@/lib/units';

/** The form holds elevation in the reader's unit; the schema's SI value is built on submit. */
const formSchema = gardenInputSchema.extend({ elevationM: z.number({ message: 'Enter the elevation.' }) });
type FormValues = z.input<typeof formSchema>;

export function GardenForm({ garden, onSubmit, submitLabel }: { garden?: Garden; onSubmit: (input: CreateGardenInput) => Promise<unknown>; submitLabel: string }) {
  const units = useUnits();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: garden
      ? { ...garden, elevationM: Math.round(units.show(garden.elevationM, 'length')) }
      : { name: '', soilTexture: 'sandy_loam', coastal: false, notes: '' },
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
      <InputField label="Garden name" {...register('name')} error={e.name?.message} />
      <div className="grid gap-4 sm:grid-cols-3">
        <InputField label="Latitude (°, north +)" inputMode="decimal" {...register('latitudeDeg', { valueAsNumber: true })} error={e.latitudeDeg?.message} />
        <InputField label="Longitude (°, east +)" inputMode="decimal" {...register('longitudeDeg', { valueAsNumber: true })} error={e.longitudeDeg?.message} />
        <InputField label={`Elevation (${units.label('length')})`} inputMode="decimal" {...register('elevationM', { valueAsNumber: true })} error={e.elevationM?.message} />
      </div>
      <p className="text-sm text-ink-muted">
        Seepwise keeps the location only to 0.1° (about 11 km): enough for the sun and the season in the water-need sums, not enough to find your garden.
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Soil texture (USDA class)" {...register('soilTexture')} error={e.soilTexture?.message}>
          {soilTextures.map((s) => (
            <option key={s} value={s}>
              {soilTextureLabels[s]}
            </option>
          ))}
        </SelectField>
        <label className="flex min-h-12 items-center gap-3 self-end rounded-lg border border-sand-300 bg-white px-3">
          <input type="checkbox" className="size-4 accent-terracotta-600" {...register('coastal')} />
          <span className="text-sm">Near the coast (changes the radiation estimate when sunshine is not logged)</span>
        </label>
      </div>
      <TextareaField label="Notes" {...register('notes')} error={e.notes?.message} />
      <Button type="submit" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Saving…' : submitLabel}
      </Button>
    </form>
  );
}
