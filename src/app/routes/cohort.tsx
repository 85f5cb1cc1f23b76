import { useTranslation } from 'react-i18next';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { useCohort } from '@/features/cohorts/api/get-cohort';
import { CohortHeader } from '@/features/cohorts/components/cohort-header';
import { CohortSettingsForm } from '@/features/cohorts/components/cohort-settings-form';
import { InvitationsList } from '@/features/cohorts/components/invitations-list';
import { InviteForm } from '@/features/cohorts/components/invite-form';
import { JoinCodeCard } from '@/features/cohorts/components/join-code-card';
import { LeaveCohortCard } from '@/features/cohorts/components/leave-cohort-card';
import { MembersList } from '@/features/cohorts/components/members-list';
import { CohortResultsSection } from '@/features/cohort-results/components/cohort-results-section';
import { ApiRequestError } from '@/lib/api-client';

function joinUrl(code: string) {
  return `${window.location.origin}${paths.joinCohort}?code=${encodeURIComponent(code)}`;
}

function BackLink() {
  const { t } = useTranslation('cohorts');
  return (
    <Link to={paths.cohorts} className="inline-flex min-h-10 items-center text-sm font-medium text-terracotta-700 underline">
      {t(($) => $.cohort.back)}
    </Link>
  );
}

export function CohortPage() {
  const { t } = useTranslation('cohorts');
  const { cohortId = '' } = useParams();
  const cohort = useCohort(cohortId);
  const navigate = useNavigate();

  if (cohort.isPending) {
    return (
      <p role="status" className="text-ink-muted">
        {t(($) => $.cohort.loading)}
      </p>
    );
  }
  if (cohort.isError) {
    const notFound = cohort.error instanceof ApiRequestError && cohort.error.status === 404;
    return (
      <div className="space-y-4">
        <BackLink />
        <h1>{notFound ? t(($) => $.cohort.notFound) : t(($) => $.cohort.loadFailed)}</h1>
        <Alert tone="error">
          {notFound ? t(($) => $.cohort.notFoundBody) : cohort.error.message}
        </Alert>
      </div>
    );
  }

  const c = cohort.data;
  const isLead = c.myRole === 'lead';
  const full = c.capacity !== null && c.memberCount >= c.capacity;
  const inviteBlocked = c.closed
    ? t(($) => $.cohort.inviteClosed)
    : full
      ? t(($) => $.cohort.inviteFull)
      : undefined;

  return (
    <div className="space-y-6">
      <BackLink />
      <CohortHeader cohort={c} />

      {/* Pooled results span the page (forest plot and trial table need the width); before the members, as the page's answer. */}
      <CohortResultsSection cohortId={c.id} canExclude={isLead} />

      <div className={isLead ? 'grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]' : 'grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]'}>
        {/* The join code comes first on a phone (it is what a lead reads out), beside the members on a wide screen. */}
        {isLead ? (
          <div className="space-y-6 lg:order-2">
            <JoinCodeCard cohort={c} joinUrl={joinUrl} />
            <Card role="region" aria-labelledby="invite-heading" className="space-y-4">
              <div>
                <h2 id="invite-heading">{t(($) => $.cohort.invite)}</h2>
                <p className="mt-1 text-sm text-ink-muted">{t(($) => $.cohort.inviteIntro)}</p>
              </div>
              <InviteForm cohortId={c.id} disabledReason={inviteBlocked} />
              <h3 className="pt-2 text-base">{t(($) => $.cohort.invitationsSent)}</h3>
              <InvitationsList cohortId={c.id} />
            </Card>
          </div>
        ) : null}

        <div className="space-y-6 lg:order-1">
          <Card role="region" aria-labelledby="members-heading" className="space-y-4">
            <h2 id="members-heading">{t(($) => $.cohort.members)}</h2>
            <MembersList cohortId={c.id} canRemove={isLead} />
          </Card>

          {isLead ? (
            <Card role="region" aria-labelledby="settings-heading" className="space-y-4">
              <h2 id="settings-heading">{t(($) => $.cohort.settings)}</h2>
              <CohortSettingsForm key={c.id} cohort={c} />
            </Card>
          ) : null}
        </div>

        {!isLead ? (
          <div className="space-y-6 lg:order-2">
            <LeaveCohortCard cohort={c} onLeft={() => navigate(paths.cohorts, { replace: true })} />
          </div>
        ) : null}
      </div>
    </div>
  );
}
