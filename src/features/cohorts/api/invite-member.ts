import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Invitation, InviteInput } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';
import { cohortInvitationsQueryOptions } from './get-cohort-invitations';

/** E-mails a one-time invitation link (valid 14 days). */
export function inviteMember(cohortId: string, input: InviteInput): Promise<Invitation> {
  return api.post<Invitation>(`/api/cohorts/${encodeURIComponent(cohortId)}/invitations`, input);
}

export function useInviteMember(cohortId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteInput) => inviteMember(cohortId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: cohortInvitationsQueryOptions(cohortId).queryKey }),
  });
}
