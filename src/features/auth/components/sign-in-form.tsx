import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { signInInputSchema, type SignInInput } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useSignIn } from '../api/auth-mutations';

export function SignInForm({ onSuccess }: { onSuccess: () => void }) {
  const { t } = useTranslation('auth');
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<SignInInput>({
    resolver: localizedZodResolver(signInInputSchema, { password: (i) => (i.code === 'too_small' ? t(($) => $.fields.passwordRequired) : undefined) }),
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signIn.mutateAsync(values);
      onSuccess();
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.signIn.form)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label={t(($) => $.fields.email)} type="email" autoComplete="email" {...register('email')} error={formState.errors.email?.message} />
      <InputField label={t(($) => $.fields.password)} type="password" autoComplete="current-password" {...register('password')} error={formState.errors.password?.message} />
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? t(($) => $.signIn.submitting) : t(($) => $.signIn.submit)}
      </Button>
      <div className="flex flex-wrap justify-between gap-x-4 gap-y-2 text-sm">
        <Link className="text-terracotta-700 underline" to={paths.forgotPassword}>
          {t(($) => $.signIn.forgot)}
        </Link>
        <Link className="text-terracotta-700 underline" to={paths.signUp}>
          {t(($) => $.signIn.createAccount)}
        </Link>
      </div>
    </form>
  );
}
