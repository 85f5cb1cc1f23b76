import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';

/** Every cohort the caller leads or belongs to, newest first. */
export function getCohorts(): Promise<CohortSummary[]> {
  return api.get<CohortSummary[]>('/api/cohorts');
}

export const cohortsQueryOptions = () => queryOptions({ queryKey: ['cohorts', 'list'] as const, queryFn: getCohorts });

export function useCohorts() {
  return useQuery(cohortsQueryOptions());
}
