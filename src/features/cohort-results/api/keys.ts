import type { CohortResultsQuery } from '@shared/schemas/cohort-results';

/**
 * Query keys of the cohort results, built only here. They sit below the cohorts feature's detail
 * key (['cohorts', 'detail', id]), so anything that refreshes a cohort (a member removed, their
 * trials gone) refreshes its results too.
 */
export const cohortResultsKeys = {
  all: (cohortId: string) => ['cohorts', 'detail', cohortId, 'results'] as const,
  detail: (cohortId: string, query: CohortResultsQuery) => ['cohorts', 'detail', cohortId, 'results', query] as const,
};
