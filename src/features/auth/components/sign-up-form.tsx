import { useEffect, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { MIN_PASSWORD_LENGTH, signUpInputSchema } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { LANGUAGES, currentLanguage } from '@/i18n';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useSignUp } from '../api/auth-mutations';

type FormValues = z.input<typeof signUpInputSchema>;

export function SignUpForm({ onSuccess }: { onSuccess: () => void }) {
  const { t } = useTranslation('auth');
  const { t: tc, i18n } = useTranslation();
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState, getFieldState, setValue } = useForm<FormValues, unknown, z.output<typeof signUpInputSchema>>({
    resolver: localizedZodResolver(signUpInputSchema, {
      displayName: (i) => (i.code === 'too_small' ? t(($) => $.signUp.displayNameRequired) : undefined),
    }),
    // The account's language starts as the one the page is shown in.
    defaultValues: { role: 'grower', unitSystem: 'metric', language: currentLanguage() },
  });

  // A language picked on this page before filling in the form carries over, unless the field was set by hand.
  const uiLanguage = i18n.resolvedLanguage;
  useEffect(() => {
    if (!getFieldState('language').isDirty) setValue('language', currentLanguage());
  }, [uiLanguage, getFieldState, setValue]);

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signUp.mutateAsync(values);
      onSuccess();
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.signUp.form)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label={t(($) => $.fields.displayName)} autoComplete="nickname" {...register('displayName')} error={formState.errors.displayName?.message} />
      <InputField label={t(($) => $.fields.email)} type="email" autoComplete="email" {...register('email')} error={formState.errors.email?.message} />
      <InputField
        label={t(($) => $.fields.password)}
        type="password"
        autoComplete="new-password"
        hint={t(($) => $.fields.passwordHint, { min: MIN_PASSWORD_LENGTH })}
        {...register('password')}
        error={formState.errors.password?.message}
      />
      <SelectField label={t(($) => $.signUp.joiningAs)} {...register('role')} error={formState.errors.role?.message}>
        <option value="grower">{t(($) => $.signUp.asGrower)}</option>
        <option value="educator">{t(($) => $.signUp.asEducator)}</option>
      </SelectField>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField label={t(($) => $.fields.units)} {...register('unitSystem')}>
          <option value="metric">{tc(($) => $.units.metric)}</option>
          <option value="us">{tc(($) => $.units.us)}</option>
        </SelectField>
        <SelectField label={t(($) => $.fields.language)} {...register('language')}>
          {LANGUAGES.map((l) => (
            <option key={l} value={l} lang={l}>
              {tc(($) => $.language[l])}
            </option>
          ))}
        </SelectField>
      </div>
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? t(($) => $.signUp.submitting) : t(($) => $.signUp.submit)}
      </Button>
      <p className="text-sm">
        {t(($) => $.signUp.haveAccount)}{' '}
        <Link className="text-terracotta-700 underline" to={paths.signIn}>
          {t(($) => $.signUp.signIn)}
        </Link>
      </p>
    </form>
  );
}
