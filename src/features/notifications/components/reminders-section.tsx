import { useTranslation } from 'react-i18next';
import type { Account } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { useNotificationPreferences } from '../api/get-notification-preferences';
import { ReminderPreferencesForm } from './reminder-preferences-form';

/** The Reminders part of the Account page: loads the preferences, then the form. */
export function RemindersSection({ account }: { account: Account }) {
  const { t } = useTranslation('notifications');
  const prefs = useNotificationPreferences();
  if (prefs.isPending) return <p role="status">{t(($) => $.reminders.loading)}</p>;
  if (prefs.isError) return <Alert tone="error">{prefs.error.message}</Alert>;
  return <ReminderPreferencesForm preferences={prefs.data} emailVerified={account.emailVerified} leadsCohorts={account.role !== 'grower'} />;
}
