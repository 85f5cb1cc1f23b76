import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';

export function getCohort(cohortId: string): Promise<CohortSummary> {
  return api.get<CohortSummary>(`/api/cohorts/${encodeURIComponent(cohortId)}`);
}

/** One cohort; members and invitations hang below this key, so invalidating it refreshes them too. */
export const cohortQueryOptions = (cohortId: string) =>
  queryOptions({ queryKey: ['cohorts', 'detail', cohortId] as const, queryFn: () => getCohort(cohortId) });

export function useCohort(cohortId: string) {
  return useQuery(cohortQueryOptions(cohortId));
}
