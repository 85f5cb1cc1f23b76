import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CohortResults, CohortResultsQuery } from '@shared/schemas/cohort-results';
import { api } from '@/lib/api-client';
import { cohortResultsKeys } from './keys';

/** Pooled results by pseudonym and whole-degree region: the same page for lead, contributors and observers. */
export function getCohortResults(cohortId: string, query: CohortResultsQuery): Promise<CohortResults> {
  const params = new URLSearchParams({
    method: query.method,
    confidence: String(query.confidence),
    includeSinglePairs: String(query.includeSinglePairs),
    excludeFlagged: String(query.excludeFlagged),
  });
  return api.get<CohortResults>(`/api/cohorts/${encodeURIComponent(cohortId)}/results?${params.toString()}`);
}

export const cohortResultsQueryOptions = (cohortId: string, query: CohortResultsQuery) =>
  queryOptions({
    queryKey: cohortResultsKeys.detail(cohortId, query),
    queryFn: () => getCohortResults(cohortId, query),
    // A switch of method or toggle keeps the last numbers on screen while the new ones load.
    placeholderData: keepPreviousData,
  });

export function useCohortResults(cohortId: string, query: CohortResultsQuery) {
  return useQuery(cohortResultsQueryOptions(cohortId, query));
}
