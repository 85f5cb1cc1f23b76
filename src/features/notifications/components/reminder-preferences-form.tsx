import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import { useForm, type UseFormRegisterReturn } from 'react-hook-form';
import { MAX_THRESHOLD_PCT, MIN_THRESHOLD_PCT, notificationPreferencesSchema, type NotificationPreferences } from '@shared/schemas/notifications';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
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
  const update = useUpdateNotificationPreferences();
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { register, handleSubmit, setError, formState, reset, watch } = useForm<NotificationPreferences>({
    resolver: zodResolver(notificationPreferencesSchema),
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
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Reminders">
      {!emailVerified ? <Alert tone="warning">Reminders go only to a confirmed address: confirm your e-mail above first.</Alert> : null}
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <Toggle
        label="Refill reminders"
        hint="One e-mail a day at most, listing every pot whose estimated level is below your reminder level, with a link to log the refill."
        registration={register('refillReminders')}
      />
      <InputField
        label="Remind me below (% of a pot's capacity)"
        type="number"
        inputMode="numeric"
        min={MIN_THRESHOLD_PCT}
        max={MAX_THRESHOLD_PCT}
        step={1}
        disabled={!refillOn}
        hint="25 % leaves a day or so in most pots in summer. The estimate runs from your last logged refill at the pot's seep-test rate."
        {...register('refillThresholdPct', { valueAsNumber: true })}
        error={errors.refillThresholdPct ? `Use a whole percentage from ${MIN_THRESHOLD_PCT} to ${MAX_THRESHOLD_PCT}.` : undefined}
      />
      <Toggle
        label="Frost warnings"
        hint="When a logged or forecast night at one of your gardens reaches 0 °C or below: empty or lift the pots before it."
        registration={register('frostWarnings')}
      />
      <Toggle
        label="Weekly digest"
        hint={leadsCohorts ? 'Mondays: new data in your cohorts, trials gone quiet and new quality flags.' : 'Sent only to cohort leads, on Mondays.'}
        registration={register('weeklyDigest')}
      />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" size="lg" disabled={formState.isSubmitting || !formState.isDirty}>
          {formState.isSubmitting ? 'Saving…' : 'Save reminders'}
        </Button>
        {saved && !formState.isDirty ? (
          <p role="status" className="text-sm font-medium text-sage-800">
            Saved.
          </p>
        ) : null}
      </div>
    </form>
  );
}
