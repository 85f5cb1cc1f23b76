import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { cohortQueryOptions } from './get-cohort';
import { cohortsQueryOptions } from './get-cohorts';

export function leaveCohort(cohortId: string): Promise<void> {
  return api.post<void>(`/api/cohorts/${encodeURIComponent(cohortId)}/leave`);
}

export function useLeaveCohort(cohortId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => leaveCohort(cohortId),
    onSuccess: async () => {
      // The cohort is no longer ours to read: drop it (and its members) rather than refetch a 404.
      qc.removeQueries({ queryKey: cohortQueryOptions(cohortId).queryKey });
      await qc.invalidateQueries({ queryKey: cohortsQueryOptions().queryKey });
    },
  });
}
