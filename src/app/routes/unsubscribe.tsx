import { useEffect, useRef } from 'react';
import { useTranslation } from 'react-i18next';
import { Link, useSearchParams } from 'react-router-dom';
import { PublicLayout } from '@/components/layout/public-layout';
import { Alert } from '@/components/ui/alert';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { useUnsubscribe } from '@/features/notifications/api/unsubscribe';

/** Opened from an e-mail's "Stop these e-mails" link: works signed in or not. */
export function UnsubscribePage() {
  const { t } = useTranslation('notifications');
  const [params] = useSearchParams();
  const token = params.get('token');
  const user = useCurrentUser();
  const stop = useUnsubscribe();
  const { mutate } = stop;
  // Once per token, also when React runs the effect twice (StrictMode in development).
  const sent = useRef<string | null>(null);
  useEffect(() => {
    if (!token || sent.current === token) return;
    sent.current = token;
    mutate(token);
  }, [token, mutate]);
  return (
    <PublicLayout title={t(($) => $.unsubscribe.title)}>
      {!token ? <Alert tone="error">{t(($) => $.unsubscribe.incomplete)}</Alert> : null}
      {stop.isPending ? <p role="status">{t(($) => $.unsubscribe.working)}</p> : null}
      {stop.isSuccess ? <Alert tone="success">{t(($) => $.unsubscribe.done[stop.data.kind])}</Alert> : null}
      {stop.isError ? <Alert tone="error">{stop.error.message}</Alert> : null}
      <p className="mt-4 text-sm">
        <Link className="text-terracotta-700 underline" to={user ? paths.account : paths.signIn}>
          {user ? t(($) => $.unsubscribe.choose) : t(($) => $.unsubscribe.signInChoose)}
        </Link>
      </p>
    </PublicLayout>
  );
}
