import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { passwordSchema, requestPasswordResetInputSchema, type RequestPasswordResetInput } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useRequestPasswordReset, useResetPassword } from '../api/auth-mutations';

export function RequestResetForm() {
  const { t } = useTranslation('auth');
  const request = useRequestPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<RequestPasswordResetInput>({ resolver: localizedZodResolver(requestPasswordResetInputSchema) });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await request.mutateAsync(values);
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  if (request.isSuccess) return <Alert tone="success">{t(($) => $.forgot.sent)}</Alert>;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.forgot.form)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label={t(($) => $.fields.email)} type="email" autoComplete="email" {...register('email')} error={formState.errors.email?.message} />
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {t(($) => $.forgot.submit)}
      </Button>
    </form>
  );
}

const newPasswordFormSchema = z
  .object({ password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });
type NewPasswordForm = z.infer<typeof newPasswordFormSchema>;

export function ResetPasswordForm({ token }: { token: string }) {
  const { t } = useTranslation('auth');
  const reset = useResetPassword();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<NewPasswordForm>({
    resolver: localizedZodResolver(newPasswordFormSchema, { confirm: t(($) => $.reset.differ) }),
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await reset.mutateAsync({ token, password: values.password });
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  if (reset.isSuccess) {
    return (
      <Alert tone="success">
        {t(($) => $.reset.done)}{' '}
        <Link className="font-medium underline" to={paths.signIn}>
          {t(($) => $.reset.signIn)}
        </Link>
      </Alert>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.reset.form)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label={t(($) => $.fields.newPassword)} type="password" autoComplete="new-password" {...register('password')} error={formState.errors.password?.message} />
      <InputField label={t(($) => $.fields.repeatNewPassword)} type="password" autoComplete="new-password" {...register('confirm')} error={formState.errors.confirm?.message} />
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {t(($) => $.reset.submit)}
      </Button>
    </form>
  );
}
