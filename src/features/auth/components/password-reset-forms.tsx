import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { passwordSchema, requestPasswordResetInputSchema, type RequestPasswordResetInput } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useRequestPasswordReset, useResetPassword } from '../api/auth-mutations';

export function RequestResetForm() {
  const request = useRequestPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<RequestPasswordResetInput>({ resolver: zodResolver(requestPasswordResetInputSchema) });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await request.mutateAsync(values);
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  if (request.isSuccess) return <Alert tone="success">{request.data.message}</Alert>;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Request a password reset">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label="E-mail" type="email" autoComplete="email" {...register('email')} error={formState.errors.email?.message} />
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        Send me a reset link
      </Button>
    </form>
  );
}

const newPasswordFormSchema = z
  .object({ password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });
type NewPasswordForm = z.infer<typeof newPasswordFormSchema>;

export function ResetPasswordForm({ token }: { token: string }) {
  const reset = useResetPassword();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<NewPasswordForm>({ resolver: zodResolver(newPasswordFormSchema) });
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
        {reset.data.message}{' '}
        <Link className="font-medium underline" to={paths.signIn}>
          Sign in
        </Link>
      </Alert>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Choose a new password">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label="New password" type="password" autoComplete="new-password" {...register('password')} error={formState.errors.password?.message} />
      <InputField label="Repeat the new password" type="password" autoComplete="new-password" {...register('confirm')} error={formState.errors.confirm?.message} />
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        Save new password
      </Button>
    </form>
  );
}
