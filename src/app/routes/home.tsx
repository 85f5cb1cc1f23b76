import { Link } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { useCohorts } from '@/features/cohorts/api/get-cohorts';
import { CohortList } from '@/features/cohorts/components/cohort-list';

const HOME_COHORT_LIMIT = 5;

function YourCohortsCard() {
  const cohorts = useCohorts();
  return (
    <Card role="region" aria-labelledby="home-cohorts-heading" className="space-y-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="home-cohorts-heading">Your cohorts</h2>
        <Link to={paths.cohorts} className="inline-flex min-h-10 items-center text-sm font-medium text-terracotta-700 underline">
          {cohorts.data && cohorts.data.length > HOME_COHORT_LIMIT ? `All ${cohorts.data.length} cohorts` : 'Cohorts page'}
        </Link>
      </div>
      {cohorts.isPending ? (
        <p role="status" className="text-ink-muted">
          Loading…
        </p>
      ) : cohorts.isError ? (
        <Alert tone="error">Could not load your cohorts: {cohorts.error.message}</Alert>
      ) : cohorts.data.length === 0 ? (
        <p className="text-ink-muted">
          None yet. Got a code from an educator or garden network?{' '}
          <Link to={paths.joinCohort} className="font-medium text-terracotta-700 underline">
            Join with a code
          </Link>
          .
        </p>
      ) : (
        <CohortList cohorts={cohorts.data.slice(0, HOME_COHORT_LIMIT)} />
      )}
    </Card>
  );
}

export function HomePage() {
  const user = useCurrentUser();
  return (
    <div className="space-y-6">
      <div>
        <h1>Hello, {user?.displayName}</h1>
        <p className="mt-1 text-ink-muted">Your gardens and trials at a glance, and what needs doing today.</p>
      </div>
      <div className="grid gap-6 lg:grid-cols-2">
        <Card>
          <h2>Getting started</h2>
          <p className="mt-2 text-ink-muted">
            Set up two matched beds with the same crop and planting date: one watered through buried clay pots, its twin at the surface. Log every refill and
            every can of water; weigh every pick. Seepwise does the sums and tells you how sure the answer is.
          </p>
        </Card>
        <YourCohortsCard />
      </div>
    </div>
  );
}
