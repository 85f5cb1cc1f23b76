import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CohortMember } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';

/** Members by pseudonym and role; never names or e-mail addresses. */
export function getCohortMembers(cohortId: string): Promise<CohortMember[]> {
  return api.get<CohortMember[]>(`/api/cohorts/${encodeURIComponent(cohortId)}/members`);
}

export const cohortMembersQueryOptions = (cohortId: string) =>
  queryOptions({ queryKey: ['cohorts', 'detail', cohortId, 'members'] as const, queryFn: () => getCohortMembers(cohortId) });

export function useCohortMembers(cohortId: string) {
  return useQuery(cohortMembersQueryOptions(cohortId));
}
