import { useEffect } from 'react';
import { useTranslation } from 'react-i18next';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { PublicLayout } from '@/components/layout/public-layout';
import { Alert } from '@/components/ui/alert';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { safeNext } from '@/lib/safe-next';
import { SESSION_EXPIRED_FLAG } from '../query-client';

/**
 * The sign-in page, the first page most visits see: it ships in the first chunk, the other public
 * pages (auth-pages.tsx) load on first use.
 */
export function SignInPage() {
  const { t } = useTranslation('auth');
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const expired = params.get('reason') === 'expired';
  useEffect(() => {
    sessionStorage.removeItem(SESSION_EXPIRED_FLAG);
  }, []);
  return (
    <PublicLayout title={t(($) => $.signIn.title)} intro={t(($) => $.signIn.intro)}>
      {expired ? (
        <Alert tone="warning" className="mb-4">
          {t(($) => $.signIn.expired)}
        </Alert>
      ) : null}
      <SignInForm onSuccess={() => navigate(safeNext(params.get('next')), { replace: true })} />
    </PublicLayout>
  );
}
