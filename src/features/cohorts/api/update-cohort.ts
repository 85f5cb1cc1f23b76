import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CohortSummary, UpdateCohortInput } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';
import { cohortQueryOptions } from './get-cohort';
import { cohortsQueryOptions } from './get-cohorts';

export function updateCohort(cohortId: string, input: UpdateCohortInput): Promise<CohortSummary> {
  return api.patch<CohortSummary>(`/api/cohorts/${encodeURIComponent(cohortId)}`, input);
}

export function useUpdateCohort(cohortId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateCohortInput) => updateCohort(cohortId, input),
    onSuccess: async (cohort) => {
      qc.setQueryData(cohortQueryOptions(cohortId).queryKey, cohort);
      await qc.invalidateQueries({ queryKey: cohortsQueryOptions().queryKey });
    },
  });
}
