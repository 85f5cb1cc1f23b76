import { useEffect } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { PublicLayout } from '@/components/layout/public-layout';
import { Alert } from '@/components/ui/alert';
import { paths } from '@/config/paths';
import { useVerifyEmail } from '@/features/auth/api/auth-mutations';
import { RequestResetForm, ResetPasswordForm } from '@/features/auth/components/password-reset-forms';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { safeNext } from '@/lib/safe-next';
import { SESSION_EXPIRED_FLAG } from '../query-client';

export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const expired = params.get('reason') === 'expired';
  useEffect(() => {
    sessionStorage.removeItem(SESSION_EXPIRED_FLAG);
  }, []);
  return (
    <PublicLayout title="Sign in" intro="Your gardens, trials and cohorts are waiting.">
      {expired ? (
        <Alert tone="warning" className="mb-4">
          Your session has ended (signed out elsewhere, password changed, or idle too long). Sign in again to carry on; nothing you saved was lost.
        </Alert>
      ) : null}
      <SignInForm onSuccess={() => navigate(safeNext(params.get('next')), { replace: true })} />
    </PublicLayout>
  );
}

export function SignUpPage() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  return (
    <PublicLayout title="Create an account" intro="Set up paired beds, log refills from your phone and get an honest answer at harvest.">
      <SignUpForm onSuccess={() => navigate(safeNext(params.get('next')), { replace: true })} />
    </PublicLayout>
  );
}

export function ForgotPasswordPage() {
  return (
    <PublicLayout title="Reset your password" intro="We will e-mail you a link that works once, for one hour.">
      <RequestResetForm />
      <p className="mt-4 text-sm">
        <Link className="text-terracotta-700 underline" to={paths.signIn}>
          Back to sign in
        </Link>
      </p>
    </PublicLayout>
  );
}

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  return (
    <PublicLayout title="Choose a new password">
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <Alert tone="error">
          This reset link is incomplete. <Link to={paths.forgotPassword} className="underline">Ask for a new one</Link>.
        </Alert>
      )}
    </PublicLayout>
  );
}

export function VerifyEmailPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const verify = useVerifyEmail();
  const { mutate } = verify;
  useEffect(() => {
    if (token) mutate(token);
  }, [token, mutate]);
  return (
    <PublicLayout title="Confirm your e-mail">
      {!token ? <Alert tone="error">This confirmation link is incomplete.</Alert> : null}
      {verify.isPending ? <p role="status">Checking the link…</p> : null}
      {verify.isSuccess ? <Alert tone="success">{verify.data.message}</Alert> : null}
      {verify.isError ? <Alert tone="error">{verify.error.message}</Alert> : null}
      <p className="mt-4 text-sm">
        <Link className="text-terracotta-700 underline" to={paths.home}>
          Go to Seepwise
        </Link>
      </p>
    </PublicLayout>
  );
}
