import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CohortSummary, CreateCohortInput } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';
import { cohortQueryOptions } from './get-cohort';
import { cohortsQueryOptions } from './get-cohorts';

export function createCohort(input: CreateCohortInput): Promise<CohortSummary> {
  return api.post<CohortSummary>('/api/cohorts', input);
}

export function useCreateCohort() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createCohort,
    onSuccess: async (cohort) => {
      qc.setQueryData(cohortQueryOptions(cohort.id).queryKey, cohort);
      await qc.invalidateQueries({ queryKey: cohortsQueryOptions().queryKey });
    },
  });
}
