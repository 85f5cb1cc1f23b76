import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { inviteInputSchema } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField } from '@/components/ui/field';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useInviteMember } from '../api/invite-member';

type FormValues = z.input<typeof inviteInputSchema>;

/** E-mail someone a one-time invitation link. */
export function InviteForm({ cohortId, disabledReason }: { cohortId: string; disabledReason?: string }) {
  const { t } = useTranslation('cohorts');
  const invite = useInviteMember(cohortId);
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState, reset } = useForm<FormValues, unknown, z.output<typeof inviteInputSchema>>({
    resolver: localizedZodResolver(inviteInputSchema),
    defaultValues: { email: '', role: 'contributor' },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSentTo(null);
    try {
      const inv = await invite.mutateAsync(values);
      setSentTo(inv.email);
      reset({ email: '', role: values.role });
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.invite.form)}>
      {disabledReason ? <Alert tone="warning">{disabledReason}</Alert> : null}
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      {sentTo ? <Alert tone="success">{t(($) => $.invite.sent, { email: sentTo })}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-[1fr_auto]">
        <InputField label={t(($) => $.invite.email)} type="email" autoComplete="off" {...register('email')} error={formState.errors.email?.message} />
        <SelectField label={t(($) => $.invite.as)} {...register('role')} error={formState.errors.role?.message}>
          <option value="contributor">{t(($) => $.roles.contributor)}</option>
          <option value="observer">{t(($) => $.roles.observer)}</option>
        </SelectField>
      </div>
      <Button type="submit" size="lg" className="w-full sm:w-auto" disabled={formState.isSubmitting || Boolean(disabledReason)}>
        {formState.isSubmitting ? t(($) => $.invite.submitting) : t(($) => $.invite.submit)}
      </Button>
    </form>
  );
}
