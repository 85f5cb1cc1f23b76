import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Invitation } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';

/** Invitations sent for a cohort (lead only), newest first. */
export function getCohortInvitations(cohortId: string): Promise<Invitation[]> {
  return api.get<Invitation[]>(`/api/cohorts/${encodeURIComponent(cohortId)}/invitations`);
}

export const cohortInvitationsQueryOptions = (cohortId: string) =>
  queryOptions({ queryKey: ['cohorts', 'detail', cohortId, 'invitations'] as const, queryFn: () => getCohortInvitations(cohortId) });

export function useCohortInvitations(cohortId: string, enabled = true) {
  return useQuery({ ...cohortInvitationsQueryOptions(cohortId), enabled });
}
