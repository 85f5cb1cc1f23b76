import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateExclusionInput, Exclusion } from '@shared/schemas/cohort-results';
import { api } from '@/lib/api-client';
import { cohortResultsKeys } from './keys';

/** The lead leaves a shared trial out of the pooled results; the reason is shown to the whole cohort. */
export function createExclusion(cohortId: string, input: CreateExclusionInput): Promise<Exclusion> {
  return api.post<Exclusion>(`/api/cohorts/${encodeURIComponent(cohortId)}/exclusions`, input);
}

export function useCreateExclusion(cohortId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateExclusionInput) => createExclusion(cohortId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: cohortResultsKeys.all(cohortId) }),
  });
}
