import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { signInInputSchema, type SignInInput } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useSignIn } from '../api/auth-mutations';

export function SignInForm({ onSuccess }: { onSuccess: () => void }) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<SignInInput>({ resolver: zodResolver(signInInputSchema) });

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
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Sign in">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label="E-mail" type="email" autoComplete="email" {...register('email')} error={formState.errors.email?.message} />
      <InputField label="Password" type="password" autoComplete="current-password" {...register('password')} error={formState.errors.password?.message} />
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
      <div className="flex justify-between text-sm">
        <Link className="text-terracotta-700 underline" to={paths.forgotPassword}>
          Forgot your password?
        </Link>
        <Link className="text-terracotta-700 underline" to={paths.signUp}>
          Create an account
        </Link>
      </div>
    </form>
  );
}
