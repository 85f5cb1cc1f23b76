import type { Account } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useResendVerification } from '../api/resend-verification';

/** The account's e-mail address, whether it is confirmed, and a way to get the link again. */
export function EmailStatus({ account }: { account: Account }) {
  const resend = useResendVerification();
  return (
    <div className="space-y-3">
      <p className="break-all text-lg font-medium">{account.email}</p>
      {account.emailVerified ? (
        <p className="flex items-center gap-2 text-sage-800">
          <span aria-hidden="true" className="inline-block size-2.5 rounded-full bg-sage-500" />
          Confirmed. Reminders and cohort e-mails reach you here.
        </p>
      ) : (
        <>
          <p className="flex items-center gap-2 text-amber-900">
            <span aria-hidden="true" className="inline-block size-2.5 rounded-full bg-amber-500" />
            Not confirmed yet. Open the link we e-mailed you so refill reminders and frost warnings reach you.
          </p>
          {resend.isSuccess ? <Alert tone="success">{resend.data.message} Check your spam folder too.</Alert> : null}
          {resend.isError ? <Alert tone="error">{resend.error.message}</Alert> : null}
          <Button variant="secondary" size="lg" disabled={resend.isPending} onClick={() => resend.mutate()}>
            {resend.isPending ? 'Sending…' : 'Send the link again'}
          </Button>
        </>
      )}
    </div>
  );
}
