import { useTranslation } from 'react-i18next';
import { Link } from 'react-router-dom';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { Button, buttonVariants } from '@/components/ui/button';
import { ApiRequestError } from '@/lib/api-client';
import { fillSlots, SLOT } from '@/lib/slots';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitationPreview } from '../api/preview-invitation';

interface InvitationPanelProps {
  token: string;
  signedIn: boolean;
  /** Sign-in and sign-up links that come back to this invitation. */
  signInHref: string;
  signUpHref: string;
  onAccepted: (cohort: CohortSummary) => void;
}

/** What an e-mailed invitation offers, and the way to accept it (signing in first if needed). */
export function InvitationPanel({ token, signedIn, signInHref, signUpHref, onAccepted }: InvitationPanelProps) {
  const { t, i18n } = useTranslation('cohorts');
  const preview = useInvitationPreview(token);
  const accept = useAcceptInvitation(token);

  if (preview.isPending) return <p role="status">{t(($) => $.invitation.checking)}</p>;
  if (preview.isError) {
    const notFound = preview.error instanceof ApiRequestError && preview.error.status === 404;
    return <Alert tone="error">{notFound ? t(($) => $.invitation.invalid) : t(($) => $.invitation.checkFailed, { message: preview.error.message })}</Alert>;
  }
  const inv = preview.data;
  const role = t(($) => $.roles[inv.role]);
  return (
    <div className="space-y-4">
      <div className="rounded-lg border border-sand-200 bg-sand-50 p-4">
        <p className="text-sm text-ink-muted">{t(($) => $.invitation.invitedTo)}</p>
        <p className="text-xl font-semibold break-words">{inv.cohortName}</p>
        <p className="mt-1 text-sm">
          {fillSlots(t(($) => $.invitation.as, { role: SLOT, hint: t(($) => $.roleHintsYou[inv.role]) }), [
            <span key="role" className="font-medium">
              {i18n.resolvedLanguage === 'en' ? role.toLowerCase() : role}
            </span>,
          ])}
        </p>
        <p className="mt-2 text-sm text-ink-muted">{t(($) => $.invitation.pseudonymNote)}</p>
      </div>
      {inv.accepted ? (
        <Alert tone="info">{t(($) => $.invitation.used)}</Alert>
      ) : inv.expired ? (
        <Alert tone="warning">{t(($) => $.invitation.expired)}</Alert>
      ) : signedIn ? (
        <div className="space-y-3">
          {accept.isError ? <Alert tone="error">{accept.error.message}</Alert> : null}
          <Button size="lg" className="w-full sm:w-auto" disabled={accept.isPending} onClick={() => accept.mutate(undefined, { onSuccess: onAccepted })}>
            {accept.isPending ? t(($) => $.invitation.accepting) : t(($) => $.invitation.accept)}
          </Button>
        </div>
      ) : (
        <div className="space-y-3">
          <p>{t(($) => $.invitation.signInNote)}</p>
          <div className="flex flex-col gap-2 sm:flex-row">
            <Link to={signInHref} className={buttonVariants({ size: 'lg' })}>
              {t(($) => $.invitation.signIn)}
            </Link>
            <Link to={signUpHref} className={buttonVariants({ variant: 'secondary', size: 'lg' })}>
              {t(($) => $.invitation.signUp)}
            </Link>
          </div>
        </div>
      )}
    </div>
  );
}
