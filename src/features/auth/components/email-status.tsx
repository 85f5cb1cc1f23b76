import { useTranslation } from 'react-i18next';
import type { Account } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useResendVerification } from '../api/resend-verification';

/** The account's e-mail address, whether it is confirmed, and a way to get the link again. */
export function EmailStatus({ account }: { account: Account }) {
  const { t } = useTranslation('auth');
  const { t: tc } = useTranslation();
  const resend = useResendVerification();
  return (
    <div className="space-y-3">
      <p className="break-all text-lg font-medium">{account.email}</p>
      {account.emailVerified ? (
        <p className="flex items-center gap-2 text-sage-800">
          <span aria-hidden="true" className="inline-block size-2.5 rounded-full bg-sage-500" />
          {t(($) => $.email.confirmed)}
        </p>
      ) : (
        <>
          <p className="flex items-center gap-2 text-amber-900">
            <span aria-hidden="true" className="inline-block size-2.5 rounded-full bg-amber-500" />
            {t(($) => $.email.notConfirmed)}
          </p>
          {resend.isSuccess ? <Alert tone="success">{t(($) => $.email.resent)}</Alert> : null}
          {resend.isError ? <Alert tone="error">{resend.error.message}</Alert> : null}
          <Button variant="secondary" size="lg" disabled={resend.isPending} onClick={() => resend.mutate()}>
            {resend.isPending ? tc(($) => $.actions.sending) : t(($) => $.email.resend)}
          </Button>
        </>
      )}
    </div>
  );
}
