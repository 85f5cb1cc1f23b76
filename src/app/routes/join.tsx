import { useTranslation } from 'react-i18next';
import { Link, useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { PublicLayout } from '@/components/layout/public-layout';
import { Card } from '@/components/ui/card';
import { buttonVariants } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { InvitationPanel } from '@/features/cohorts/components/invitation-panel';
import { JoinCohortForm } from '@/features/cohorts/components/join-cohort-form';

/**
 * /join?invite=TOKEN (an e-mailed invitation) or /join?code=CODE (a shared join link), for signed-in
 * and signed-out visitors alike. Signing in or up comes back here through `next`.
 */
export function JoinPage() {
  const { t } = useTranslation('cohorts');
  const [params] = useSearchParams();
  const location = useLocation();
  const navigate = useNavigate();
  const user = useCurrentUser();
  const token = params.get('invite');
  const code = params.get('code') ?? '';
  const next = encodeURIComponent(location.pathname + location.search);
  const signInHref = `${paths.signIn}?next=${next}`;
  const signUpHref = `${paths.signUp}?next=${next}`;
  const goToCohort = (id: string) => navigate(paths.cohort(id), { replace: true });

  const invitation = token ? (
    <InvitationPanel token={token} signedIn={Boolean(user)} signInHref={signInHref} signUpHref={signUpHref} onAccepted={(c) => goToCohort(c.id)} />
  ) : null;

  const codeSection = user ? (
    <JoinCohortForm defaultCode={code} onJoined={(c) => goToCohort(c.id)} />
  ) : (
    <div className="space-y-3">
      <p>{code ? t(($) => $.join.signInFirstCode) : t(($) => $.join.signInFirst)}</p>
      <div className="flex flex-col gap-2 sm:flex-row">
        <Link to={signInHref} className={buttonVariants({ size: 'lg' })}>
          {t(($) => $.join.signIn)}
        </Link>
        <Link to={signUpHref} className={buttonVariants({ variant: 'secondary', size: 'lg' })}>
          {t(($) => $.join.signUp)}
        </Link>
      </div>
    </div>
  );

  if (!user) {
    return (
      <PublicLayout title={token ? t(($) => $.join.titleInvite) : t(($) => $.join.title)} intro={token ? undefined : t(($) => $.join.intro)}>
        {invitation ?? codeSection}
        {token ? (
          <p className="mt-6 text-sm text-ink-muted">
            {t(($) => $.join.haveCode)}{' '}
            <Link className="text-terracotta-700 underline" to={paths.joinCohort}>
              {t(($) => $.join.withCode)}
            </Link>
          </p>
        ) : null}
      </PublicLayout>
    );
  }

  return (
    <div className="mx-auto max-w-2xl space-y-6">
      <h1>{token ? t(($) => $.join.titleInvite) : t(($) => $.join.title)}</h1>
      {invitation ? <Card>{invitation}</Card> : null}
      <Card role="region" aria-labelledby="join-code-form-heading" className="space-y-4">
        <div>
          <h2 id="join-code-form-heading">{token ? t(($) => $.join.orWithCode) : t(($) => $.join.withCode)}</h2>
          <p className="mt-1 text-sm text-ink-muted">{t(($) => $.join.pseudonymNote)}</p>
        </div>
        {codeSection}
      </Card>
    </div>
  );
}
