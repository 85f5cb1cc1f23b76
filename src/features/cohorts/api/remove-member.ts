import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { cohortQueryOptions } from './get-cohort';
import { cohortsQueryOptions } from './get-cohorts';

export function removeMember(cohortId: string, membershipId: string): Promise<void> {
  return api.delete<void>(`/api/cohorts/${encodeURIComponent(cohortId)}/members/${encodeURIComponent(membershipId)}`);
}

export function useRemoveMember(cohortId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (membershipId: string) => removeMember(cohortId, membershipId),
    // The detail key covers the summary (member count) and the members list below it.
    onSuccess: async () => {
      await Promise.all([
        qc.invalidateQueries({ queryKey: cohortQueryOptions(cohortId).queryKey }),
        qc.invalidateQueries({ queryKey: cohortsQueryOptions().queryKey }),
      ]);
    },
  });
}
