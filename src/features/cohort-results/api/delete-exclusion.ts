import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { cohortResultsKeys } from './keys';

/** Puts a left-out trial back into the pooled results. */
export function deleteExclusion(cohortId: string, trialId: string): Promise<void> {
  return api.delete<void>(`/api/cohorts/${encodeURIComponent(cohortId)}/exclusions/${encodeURIComponent(trialId)}`);
}

export function useDeleteExclusion(cohortId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (trialId: string) => deleteExclusion(cohortId, trialId),
    onSuccess: () => qc.invalidateQueries({ queryKey: cohortResultsKeys.all(cohortId) }),
  });
}
