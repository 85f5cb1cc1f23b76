import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { updateAccountInputSchema, type Account, type UpdateAccountInput } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField } from '@/components/ui/field';
import { LANGUAGES } from '@/i18n';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useUpdateAccount } from '../api/auth-mutations';

function valuesOf(a: Account): UpdateAccountInput {
  return { displayName: a.displayName, unitSystem: a.unitSystem, language: a.language };
}

/** Name to show, units and language. */
export function AccountSettingsForm({ account }: { account: Account }) {
  const { t } = useTranslation('auth');
  const { t: tc } = useTranslation();
  const update = useUpdateAccount();
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { register, handleSubmit, setError, formState, reset } = useForm<UpdateAccountInput>({
    resolver: localizedZodResolver(updateAccountInputSchema),
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
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.settings.form)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField
        label={t(($) => $.fields.displayName)}
        autoComplete="nickname"
        hint={t(($) => $.settings.displayNameHint)}
        {...register('displayName')}
        error={errors.displayName ? t(($) => $.settings.displayNameError) : undefined}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label={t(($) => $.fields.units)} hint={t(($) => $.settings.unitsHint)} {...register('unitSystem')} error={errors.unitSystem?.message}>
          <option value="metric">{tc(($) => $.units.metric)}</option>
          <option value="us">{tc(($) => $.units.us)}</option>
        </SelectField>
        <SelectField label={t(($) => $.fields.language)} hint={t(($) => $.settings.languageHint)} {...register('language')} error={errors.language?.message}>
          {LANGUAGES.map((l) => (
            <option key={l} value={l} lang={l}>
              {tc(($) => $.language[l])}
            </option>
          ))}
        </SelectField>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" size="lg" disabled={formState.isSubmitting || !formState.isDirty}>
          {formState.isSubmitting ? tc(($) => $.actions.saving) : t(($) => $.settings.submit)}
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
