import { useTranslation } from 'react-i18next';
import { Link } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { useCohorts } from '@/features/cohorts/api/get-cohorts';
import { CohortList } from '@/features/cohorts/components/cohort-list';
import { useGardens } from '@/features/gardens/api/get-gardens';
import { FrostWarnings } from '@/features/notifications/components/frost-warnings';
import { useTrials } from '@/features/trials/api/get-trials';
import { TrialCards } from '@/features/trials/components/trial-cards';

const HOME_COHORT_LIMIT = 5;

function YourCohortsCard() {
  const { t } = useTranslation('home');
  const { t: tc } = useTranslation();
  const cohorts = useCohorts();
  return (
    <Card role="region" aria-labelledby="home-cohorts-heading" className="space-y-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="home-cohorts-heading">{t(($) => $.cohorts.title)}</h2>
        <Link to={paths.cohorts} className="inline-flex min-h-10 items-center text-sm font-medium text-terracotta-700 underline">
          {cohorts.data && cohorts.data.length > HOME_COHORT_LIMIT ? t(($) => $.cohorts.all, { count: cohorts.data.length }) : t(($) => $.cohorts.page)}
        </Link>
      </div>
      {cohorts.isPending ? (
        <p role="status" className="text-ink-muted">
          {tc(($) => $.loading)}
        </p>
      ) : cohorts.isError ? (
        <Alert tone="error">{t(($) => $.cohorts.loadFailed, { message: cohorts.error.message })}</Alert>
      ) : cohorts.data.length === 0 ? (
        <p className="text-ink-muted">
          {t(($) => $.cohorts.none)}{' '}
          <Link to={paths.joinCohort} className="font-medium text-terracotta-700 underline">
            {t(($) => $.cohorts.join)}
          </Link>
          .
        </p>
      ) : (
        <CohortList cohorts={cohorts.data.slice(0, HOME_COHORT_LIMIT)} />
      )}
    </Card>
  );
}

function GardensAndTrials() {
  const { t } = useTranslation('home');
  const { t: tc } = useTranslation();
  const gardens = useGardens();
  const trials = useTrials();
  const active = (trials.data ?? []).filter((trial) => trial.status !== 'closed');
  const closed = (trials.data ?? []).filter((trial) => trial.status === 'closed');
  return (
    <section aria-labelledby="home-trials-heading" className="space-y-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="home-trials-heading">{t(($) => $.trials.title)}</h2>
        <Link to={paths.newGarden} className="ml-auto inline-flex min-h-10 items-center rounded-lg border border-sand-300 bg-white px-3 text-sm font-medium hover:bg-sand-100">
          {t(($) => $.trials.newGarden)}
        </Link>
      </div>
      {trials.isPending || gardens.isPending ? <p role="status">{tc(($) => $.loading)}</p> : null}
      {gardens.data && gardens.data.length === 0 ? (
        <Card>
          <p>
            {t(($) => $.trials.start)}{' '}
            <Link to={paths.newGarden} className="font-medium text-terracotta-700 underline">
              {t(($) => $.trials.firstGarden)}
            </Link>
          </p>
        </Card>
      ) : null}
      {active.length ? <TrialCards trials={active} trialPath={paths.trial} roundPath={paths.round} /> : null}
      {gardens.data?.length ? (
        <p className="text-sm text-ink-muted">
          {t(($) => $.trials.gardens)}{' '}
          {gardens.data.map((g, i) => (
            <span key={g.id}>
              {i ? ' · ' : ''}
              <Link className="underline" to={paths.garden(g.id)}>
                {g.name}
              </Link>{' '}
              ({g.trialCount})
            </span>
          ))}
        </p>
      ) : null}
      {closed.length ? (
        <details>
          <summary className="cursor-pointer font-medium">{t(($) => $.trials.closed, { n: closed.length })}</summary>
          <div className="mt-3">
            <TrialCards trials={closed} trialPath={paths.trial} roundPath={paths.round} />
          </div>
        </details>
      ) : null}
    </section>
  );
}

export function HomePage() {
  const { t } = useTranslation('home');
  const user = useCurrentUser();
  const gardens = useGardens();
  const trials = useTrials();
  const cohorts = useCohorts();
  const cohortsFirst = gardens.data?.length === 0 && trials.data?.length === 0 && (cohorts.data?.length ?? 0) > 0;
  // Once any trial has a record the grower knows the routine: the primer would only push the cohorts down.
  const started = trials.data?.some((tr) => tr.lastLoggedAt !== null) ?? false;
  const gettingStarted = started ? null : (
    <Card>
      <h2>{t(($) => $.gettingStarted.title)}</h2>
      <p className="mt-2 text-ink-muted">{t(($) => $.gettingStarted.body)}</p>
    </Card>
  );
  return (
    <div className="space-y-6">
      <div>
        <h1>{t(($) => $.hello, { name: user?.displayName ?? '' })}</h1>
        <p className="mt-1 text-ink-muted">{t(($) => $.intro)}</p>
      </div>
      <FrostWarnings />
      {cohortsFirst ? (
        // A student or lead with no garden of their own comes here for a cohort: that comes first.
        <>
          <YourCohortsCard />
          <GardensAndTrials />
          {gettingStarted}
        </>
      ) : (
        <>
          <GardensAndTrials />
          <div className="grid gap-6 lg:grid-cols-2">
            {gettingStarted}
            <YourCohortsCard />
          </div>
        </>
      )}
    </div>
  );
}
