import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { MIN_PASSWORD_LENGTH, signUpInputSchema } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useSignUp } from '../api/auth-mutations';
import { currentLanguage } from '@/i18n';

type FormValues = z.input<typeof signUpInputSchema>;

export function SignUpForm({ onSuccess }: { onSuccess: () => void }) {
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<FormValues, unknown, z.output<typeof signUpInputSchema>>({
    resolver: zodResolver(signUpInputSchema),
    defaultValues: { role: 'grower', unitSystem: 'metric', language: currentLanguage() },
  });

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
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Create an account">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label="Name to show" autoComplete="nickname" {...register('displayName')} error={formState.errors.displayName?.message} />
      <InputField label="E-mail" type="email" autoComplete="email" {...register('email')} error={formState.errors.email?.message} />
      <InputField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${MIN_PASSWORD_LENGTH} characters; a short phrase works well.`}
        {...register('password')}
        error={formState.errors.password?.message}
      />
      <SelectField label="I am joining as" {...register('role')} error={formState.errors.role?.message}>
        <option value="grower">A grower running my own trials</option>
        <option value="educator">An educator running a programme or class</option>
      </SelectField>
      <div className="grid grid-cols-2 gap-3">
        <SelectField label="Units" {...register('unitSystem')}>
          <option value="metric">Metric (L, kg, °C)</option>
          <option value="us">US customary (gal, lb, °F)</option>
        </SelectField>
        <SelectField label="Language" {...register('language')}>
          <option value="en">English</option>
          <option value="es">Español</option>
        </SelectField>
      </div>
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Creating…' : 'Create account'}
      </Button>
      <p className="text-sm">
        Already have an account?{' '}
        <Link className="text-terracotta-700 underline" to={paths.signIn}>
          Sign in
        </Link>
      </p>
    </form>
  );
}
