import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CohortSummary, JoinCohortInput } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';
import { cohortQueryOptions } from './get-cohort';
import { cohortsQueryOptions } from './get-cohorts';

export function joinCohort(input: JoinCohortInput): Promise<CohortSummary> {
  return api.post<CohortSummary>('/api/cohorts/join', input);
}

export function useJoinCohort() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: joinCohort,
    onSuccess: async (cohort) => {
      qc.setQueryData(cohortQueryOptions(cohort.id).queryKey, cohort);
      await qc.invalidateQueries({ queryKey: cohortsQueryOptions().queryKey });
    },
  });
}
