import { useTranslation } from 'react-i18next';
import { Card } from '@/components/ui/card';
import { AccountSettingsForm } from '@/features/auth/components/account-settings-form';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { EmailStatus } from '@/features/auth/components/email-status';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { RemindersSection } from '@/features/notifications/components/reminders-section';
import { formatDate } from '@/lib/format';

export function AccountPage() {
  const { t } = useTranslation('account');
  const user = useCurrentUser();
  if (!user) return null;
  return (
    <div className="mx-auto max-w-3xl space-y-6">
      <div>
        <h1>{t(($) => $.title)}</h1>
        <p className="mt-1 text-ink-muted">
          {t(($) => $.since, { role: t(($) => $.roles[user.role]), date: formatDate(user.createdAt) })}
        </p>
      </div>
      <Card role="region" aria-labelledby="profile-heading" className="space-y-4">
        <h2 id="profile-heading">{t(($) => $.profile)}</h2>
        <AccountSettingsForm account={user} />
      </Card>
      <Card role="region" aria-labelledby="email-heading" className="space-y-4">
        <h2 id="email-heading">{t(($) => $.email)}</h2>
        <EmailStatus account={user} />
      </Card>
      <Card role="region" aria-labelledby="reminders-heading" className="space-y-4">
        <div>
          <h2 id="reminders-heading">{t(($) => $.reminders)}</h2>
          <p className="mt-1 text-sm text-ink-muted">{t(($) => $.remindersIntro)}</p>
        </div>
        <RemindersSection account={user} />
      </Card>
      <Card role="region" aria-labelledby="password-heading" className="space-y-4">
        <div>
          <h2 id="password-heading">{t(($) => $.password)}</h2>
          <p className="mt-1 text-sm text-ink-muted">{t(($) => $.passwordIntro)}</p>
        </div>
        <ChangePasswordForm />
      </Card>
    </div>
  );
}
