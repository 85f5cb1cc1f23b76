import { useState, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm, type UseFormRegisterReturn } from 'react-hook-form';
import { MAX_THRESHOLD_PCT, MIN_THRESHOLD_PCT, notificationPreferencesSchema, type NotificationPreferences } from '@shared/schemas/notifications';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useUpdateNotificationPreferences } from '../api/update-notification-preferences';

function Toggle({ label, hint, registration }: { label: string; hint: ReactNode; registration: UseFormRegisterReturn }) {
  return (
    <label className="flex min-h-12 cursor-pointer items-start gap-3 rounded-lg border border-sand-300 px-3 py-2.5 hover:bg-sand-50">
      <input type="checkbox" className="mt-1 size-5 shrink-0 accent-terracotta-600" {...registration} />
      <span>
        <span className="block font-medium">{label}</span>
        <span className="block text-sm text-ink-muted">{hint}</span>
      </span>
    </label>
  );
}

/** Which e-mails Seepwise sends on its own, and the refill reminder level. */
export function ReminderPreferencesForm({ preferences, emailVerified, leadsCohorts }: { preferences: NotificationPreferences; emailVerified: boolean; leadsCohorts: boolean }) {
  const { t } = useTranslation('notifications');
  const { t: tc } = useTranslation();
  const update = useUpdateNotificationPreferences();
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { register, handleSubmit, setError, formState, reset, watch } = useForm<NotificationPreferences>({
    resolver: localizedZodResolver(notificationPreferencesSchema),
    defaultValues: preferences,
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSaved(false);
    try {
      reset(await update.mutateAsync(values));
      setSaved(true);
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  const { errors } = formState;
  const refillOn = watch('refillReminders');
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.reminders.form)}>
      {!emailVerified ? <Alert tone="warning">{t(($) => $.reminders.unconfirmed)}</Alert> : null}
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <Toggle
        label={t(($) => $.reminders.refill)}
        hint={t(($) => $.reminders.refillHint)}
        registration={register('refillReminders')}
      />
      <InputField
        label={t(($) => $.reminders.threshold)}
        type="number"
        inputMode="numeric"
        min={MIN_THRESHOLD_PCT}
        max={MAX_THRESHOLD_PCT}
        step={1}
        disabled={!refillOn}
        hint={t(($) => $.reminders.thresholdHint)}
        {...register('refillThresholdPct', { valueAsNumber: true })}
        error={errors.refillThresholdPct ? t(($) => $.reminders.thresholdError, { min: MIN_THRESHOLD_PCT, max: MAX_THRESHOLD_PCT }) : undefined}
      />
      <Toggle
        label={t(($) => $.reminders.frost)}
        hint={t(($) => $.reminders.frostHint)}
        registration={register('frostWarnings')}
      />
      <Toggle
        label={t(($) => $.reminders.digest)}
        hint={leadsCohorts ? t(($) => $.reminders.digestHintLead) : t(($) => $.reminders.digestHint)}
        registration={register('weeklyDigest')}
      />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" size="lg" disabled={formState.isSubmitting || !formState.isDirty}>
          {formState.isSubmitting ? tc(($) => $.actions.saving) : t(($) => $.reminders.save)}
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
