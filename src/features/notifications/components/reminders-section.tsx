import type { Account } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { useNotificationPreferences } from '../api/get-notification-preferences';
import { ReminderPreferencesForm } from './reminder-preferences-form';

/** The Reminders part of the Account page: loads the preferences, then the form. */
export function RemindersSection({ account }: { account: Account }) {
  const prefs = useNotificationPreferences();
  if (prefs.isPending) return <p role="status">Loading your reminders…</p>;
  if (prefs.isError) return <Alert tone="error">{prefs.error.message}</Alert>;
  return <ReminderPreferencesForm preferences={prefs.data} emailVerified={account.emailVerified} leadsCohorts={account.role !== 'grower'} />;
}
