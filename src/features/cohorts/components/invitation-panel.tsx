import { Link } from 'react-router-dom';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { Button, buttonVariants } from '@/components/ui/button';
import { ApiRequestError } from '@/lib/api-client';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitationPreview } from '../api/preview-invitation';
import { memberRoleHints, memberRoleLabels } from './labels';

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
  const preview = useInvitationPreview(token);
  const accept = useAcceptInvitation(token);

  if (preview.isPending) return <p role="status">Checking the invitation…</p>;
  if (preview.isError) {
    const notFound = preview.error instanceof ApiRequestError && preview.error.status === 404;
    return (
      <Alert tone="error">
        {notFound
          ? 'This invitation link is not valid. It may have been copied incompletely; open it again from the e-mail, or ask the cohort lead for a new one.'
          : `Could not check the invitation: ${preview.error.message}`}
      </Alert>
    );
  }
  const inv = preview.data;
  return (
    <div className="space-y-4">
      <div className="rounded-lg border border-sand-200 bg-sand-50 p-4">
        <p className="text-sm text-ink-muted">You are invited to</p>
        <p className="text-xl font-semibold break-words">{inv.cohortName}</p>
        <p className="mt-1 text-sm">
          as <span className="font-medium">{memberRoleLabels[inv.role].toLowerCase()}</span> ({memberRoleHints[inv.role].replace('their own', 'your own')}).
        </p>
        <p className="mt-2 text-sm text-ink-muted">Other members will see you under a pseudonym, never your name or e-mail.</p>
      </div>
      {inv.accepted ? (
        <Alert tone="info">This invitation has already been used. If that was you, the cohort is in your Cohorts list.</Alert>
      ) : inv.expired ? (
        <Alert tone="warning">This invitation has expired. Ask the cohort lead to send a new one, or to give you the join code.</Alert>
      ) : signedIn ? (
        <div className="space-y-3">
          {accept.isError ? <Alert tone="error">{accept.error.message}</Alert> : null}
          <Button size="lg" className="w-full sm:w-auto" disabled={accept.isPending} onClick={() => accept.mutate(undefined, { onSuccess: onAccepted })}>
            {accept.isPending ? 'Joining…' : 'Accept and join'}
          </Button>
        </div>
      ) : (
        <div className="space-y-3">
          <p>Sign in with the address the invitation was sent to, or create an account with it, to accept.</p>
          <div className="flex flex-col gap-2 sm:flex-row">
            <Link to={signInHref} className={buttonVariants({ size: 'lg' })}>
              Sign in to accept
            </Link>
            <Link to={signUpHref} className={buttonVariants({ variant: 'secondary', size: 'lg' })}>
              Create an account
            </Link>
          </div>
        </div>
      )}
    </div>
  );
}
