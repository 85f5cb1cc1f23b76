import { useEffect, useRef } from 'react';
import { useTranslation } from 'react-i18next';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { PublicLayout } from '@/components/layout/public-layout';
import { Alert } from '@/components/ui/alert';
import { paths } from '@/config/paths';
import { useVerifyEmail } from '@/features/auth/api/auth-mutations';
import { RequestResetForm, ResetPasswordForm } from '@/features/auth/components/password-reset-forms';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { safeNext } from '@/lib/safe-next';

export function SignUpPage() {
  const { t } = useTranslation('auth');
  const navigate = useNavigate();
  const [params] = useSearchParams();
  return (
    <PublicLayout title={t(($) => $.signUp.title)} intro={t(($) => $.signUp.intro)}>
      <SignUpForm onSuccess={() => navigate(safeNext(params.get('next')), { replace: true })} />
    </PublicLayout>
  );
}

export function ForgotPasswordPage() {
  const { t } = useTranslation('auth');
  return (
    <PublicLayout title={t(($) => $.forgot.title)} intro={t(($) => $.forgot.intro)}>
      <RequestResetForm />
      <p className="mt-4 text-sm">
        <Link className="text-terracotta-700 underline" to={paths.signIn}>
          {t(($) => $.forgot.back)}
        </Link>
      </p>
    </PublicLayout>
  );
}

export function ResetPasswordPage() {
  const { t } = useTranslation('auth');
  const [params] = useSearchParams();
  const token = params.get('token');
  return (
    <PublicLayout title={t(($) => $.reset.title)}>
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <Alert tone="error">
          {t(($) => $.reset.incomplete)}{' '}
          <Link to={paths.forgotPassword} className="underline">
            {t(($) => $.reset.askNew)}
          </Link>
          .
        </Alert>
      )}
    </PublicLayout>
  );
}

export function VerifyEmailPage() {
  const { t } = useTranslation('auth');
  const [params] = useSearchParams();
  const token = params.get('token');
  const verify = useVerifyEmail();
  const { mutate } = verify;
  // A link works once: send each token once, also when React runs the effect twice (StrictMode in
  // development), or the second answer ("already used") would replace the first ("confirmed").
  const sent = useRef<string | null>(null);
  useEffect(() => {
    if (!token || sent.current === token) return;
    sent.current = token;
    mutate(token);
  }, [token, mutate]);
  return (
    <PublicLayout title={t(($) => $.verify.title)}>
      {!token ? <Alert tone="error">{t(($) => $.verify.incomplete)}</Alert> : null}
      {verify.isPending ? <p role="status">{t(($) => $.verify.checking)}</p> : null}
      {verify.isSuccess ? <Alert tone="success">{t(($) => $.verify.done)}</Alert> : null}
      {verify.isError ? <Alert tone="error">{verify.error.message}</Alert> : null}
      <p className="mt-4 text-sm">
        <Link className="text-terracotta-700 underline" to={paths.home}>
          {t(($) => $.verify.goTo)}
        </Link>
      </p>
    </PublicLayout>
  );
}
