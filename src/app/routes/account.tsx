import { Card } from '@/components/ui/card';
import { AccountSettingsForm } from '@/features/auth/components/account-settings-form';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { EmailStatus } from '@/features/auth/components/email-status';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { RemindersSection } from '@/features/notifications/components/reminders-section';
import { formatDate } from '@/lib/format';

const roleText = { grower: 'Grower', educator: 'Educator', admin: 'Admin' } as const;

export function AccountPage() {
  const user = useCurrentUser();
  if (!user) return null;
  return (
    <div className="mx-auto max-w-3xl space-y-6">
      <div>
        <h1>Account</h1>
        <p className="mt-1 text-ink-muted">
          {roleText[user.role]} account since {formatDate(user.createdAt)}.
        </p>
      </div>
      <Card role="region" aria-labelledby="profile-heading" className="space-y-4">
        <h2 id="profile-heading">Profile and preferences</h2>
        <AccountSettingsForm account={user} />
      </Card>
      <Card role="region" aria-labelledby="email-heading" className="space-y-4">
        <h2 id="email-heading">E-mail</h2>
        <EmailStatus account={user} />
      </Card>
      <Card role="region" aria-labelledby="reminders-heading" className="space-y-4">
        <div>
          <h2 id="reminders-heading">Reminders</h2>
          <p className="mt-1 text-sm text-ink-muted">E-mails Seepwise sends on its own. Each one has a link that stops its kind, no sign-in needed.</p>
        </div>
        <RemindersSection account={user} />
      </Card>
      <Card role="region" aria-labelledby="password-heading" className="space-y-4">
        <div>
          <h2 id="password-heading">Password</h2>
          <p className="mt-1 text-sm text-ink-muted">Changing it signs out every other phone or computer that uses your account.</p>
        </div>
        <ChangePasswordForm />
      </Card>
    </div>
  );
}
