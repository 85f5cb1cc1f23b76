import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { changePasswordInputSchema, MIN_PASSWORD_LENGTH } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useChangePassword } from '../api/auth-mutations';

const formSchema = changePasswordInputSchema
  .extend({ currentPassword: z.string().min(1, 'Enter your current password.').max(200), confirm: z.string() })
  .refine((v) => v.newPassword === v.confirm, { path: ['confirm'], message: 'The two new passwords differ.' });
type FormValues = z.infer<typeof formSchema>;

/** Change the password; every other session is signed out, this one carries on. */
export function ChangePasswordForm() {
  const { t } = useTranslation('auth');
  const change = useChangePassword();
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const { register, handleSubmit, setError, formState, reset } = useForm<FormValues>({
    resolver: localizedZodResolver(formSchema, {
      currentPassword: (i) => (i.code === 'too_small' ? t(($) => $.password.currentRequired) : undefined),
      confirm: t(($) => $.password.differ),
    }),
    defaultValues: { currentPassword: '', newPassword: '', confirm: '' },
  });
  const onSubmit = handleSubmit(async ({ currentPassword, newPassword }) => {
    setFormError(null);
    setDone(false);
    try {
      await change.mutateAsync({ currentPassword, newPassword });
      reset();
      setDone(true);
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  const { errors } = formState;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.password.form)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      {done ? <Alert tone="success">{t(($) => $.password.done)}</Alert> : null}
      <InputField label={t(($) => $.fields.currentPassword)} type="password" autoComplete="current-password" {...register('currentPassword')} error={errors.currentPassword?.message} />
      <InputField
        label={t(($) => $.fields.newPassword)}
        type="password"
        autoComplete="new-password"
        hint={t(($) => $.fields.passwordHint, { min: MIN_PASSWORD_LENGTH })}
        {...register('newPassword')}
        error={errors.newPassword?.message}
      />
      <InputField label={t(($) => $.fields.repeatNewPassword)} type="password" autoComplete="new-password" {...register('confirm')} error={errors.confirm?.message} />
      <Button type="submit" size="lg" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? t(($) => $.password.submitting) : t(($) => $.password.submit)}
      </Button>
    </form>
  );
}
