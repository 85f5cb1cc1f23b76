import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';
import { cohortQueryOptions } from './get-cohort';
import { cohortsQueryOptions } from './get-cohorts';

/** Replaces the cohort's join code; the old one stops working at once. */
export function rotateJoinCode(cohortId: string): Promise<CohortSummary> {
  return api.post<CohortSummary>(`/api/cohorts/${encodeURIComponent(cohortId)}/join-code`);
}

export function useRotateJoinCode(cohortId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => rotateJoinCode(cohortId),
    onSuccess: async (cohort) => {
      qc.setQueryData(cohortQueryOptions(cohortId).queryKey, cohort);
      await qc.invalidateQueries({ queryKey: cohortsQueryOptions().queryKey });
    },
  });
}
