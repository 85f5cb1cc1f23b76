import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { updateAccountInputSchema, type Account, type UpdateAccountInput } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateAccount } from '../api/auth-mutations';

function valuesOf(a: Account): UpdateAccountInput {
  return { displayName: a.displayName, unitSystem: a.unitSystem, language: a.language };
}

/** Name to show, units and language. */
export function AccountSettingsForm({ account }: { account: Account }) {
  const update = useUpdateAccount();
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { register, handleSubmit, setError, formState, reset } = useForm<UpdateAccountInput>({
    resolver: zodResolver(updateAccountInputSchema),
    defaultValues: valuesOf(account),
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
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Profile and preferences">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField
        label="Name to show"
        autoComplete="nickname"
        hint="Shown to you and to site admins. Cohort members never see it; they see your pseudonym."
        {...register('displayName')}
        error={errors.displayName ? 'Enter a name of 1 to 80 characters.' : undefined}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Units" hint="For entering and reading volumes, weights and temperatures." {...register('unitSystem')} error={errors.unitSystem?.message}>
          <option value="metric">Metric (L, kg, °C)</option>
          <option value="us">US customary (gal, lb, °F)</option>
        </SelectField>
        <SelectField label="Language" hint="For the screens and for the e-mails Seepwise sends you." {...register('language')} error={errors.language?.message}>
          <option value="en">English</option>
          <option value="es">Español</option>
        </SelectField>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" size="lg" disabled={formState.isSubmitting || !formState.isDirty}>
          {formState.isSubmitting ? 'Saving…' : 'Save changes'}
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
