import { useEffect } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { PublicLayout } from '@/components/layout/public-layout';
import { Alert } from '@/components/ui/alert';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { useUnsubscribe } from '@/features/notifications/api/unsubscribe';

/** The client URL of the unsubscribe link in every e-mail (the server writes `${publicUrl}/unsubscribe?token=…`). */
export const unsubscribePath = '/unsubscribe';

/** Opened from an e-mail's "Stop these e-mails" link: works signed in or not. */
export function UnsubscribePage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const user = useCurrentUser();
  const stop = useUnsubscribe();
  const { mutate } = stop;
  useEffect(() => {
    if (token) mutate(token);
  }, [token, mutate]);
  return (
    <PublicLayout title="Stop these e-mails">
      {!token ? <Alert tone="error">This unsubscribe link is incomplete. Copy the whole link from the e-mail, or change your reminders under Account.</Alert> : null}
      {stop.isPending ? <p role="status">Turning them off…</p> : null}
      {stop.isSuccess ? <Alert tone="success">{stop.data.message}</Alert> : null}
      {stop.isError ? <Alert tone="error">{stop.error.message}</Alert> : null}
      <p className="mt-4 text-sm">
        <Link className="text-terracotta-700 underline" to={user ? paths.account : paths.signIn}>
          {user ? 'Choose which e-mails you get' : 'Sign in to choose which e-mails you get'}
        </Link>
      </p>
    </PublicLayout>
  );
}
