import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { SignInInput } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useSignIn } from '../api/auth-mutations';

/** Something@something.something, as the server's own check (shared/schemas/auth.ts emailSchema) will insist. */
const EMAIL_SHAPE = /^\s*[^\s@]+@[^\s@]+\.[^\s@]+\s*$/;

/**
 * The first page people see, so it carries no schema library: two checks with react-hook-form's
 * own rules (the server validates again with the shared zod schema). Keeping zod out of the first
 * page's bundle is most of what brings it under the 180 KB target (bench figure 6).
 */
export function SignInForm({ onSuccess }: { onSuccess: () => void }) {
  const { t } = useTranslation('auth');
  const { t: tc } = useTranslation();
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<SignInInput>();
  const emailField = register('email', {
    required: tc(($) => $.validation.email),
    pattern: { value: EMAIL_SHAPE, message: tc(($) => $.validation.email) },
  });
  const passwordField = register('password', { required: t(($) => $.fields.passwordRequired) });

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
      <InputField label={t(($) => $.fields.email)} type="email" autoComplete="email" {...emailField} error={formState.errors.email?.message} />
      <InputField label={t(($) => $.fields.password)} type="password" autoComplete="current-password" {...passwordField} error={formState.errors.password?.message} />
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
