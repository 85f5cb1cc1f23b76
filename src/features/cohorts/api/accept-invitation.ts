import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';
import { cohortQueryOptions } from './get-cohort';
import { cohortsQueryOptions } from './get-cohorts';
import { invitationPreviewQueryOptions } from './preview-invitation';

export function acceptInvitation(token: string): Promise<CohortSummary> {
  return api.post<CohortSummary>('/api/invitations/accept', { token });
}

export function useAcceptInvitation(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => acceptInvitation(token),
    onSuccess: async (cohort) => {
      qc.setQueryData(cohortQueryOptions(cohort.id).queryKey, cohort);
      await Promise.all([
        qc.invalidateQueries({ queryKey: cohortsQueryOptions().queryKey }),
        qc.invalidateQueries({ queryKey: invitationPreviewQueryOptions(token).queryKey }),
      ]);
    },
  });
}
