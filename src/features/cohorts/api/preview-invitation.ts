import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationPreview } from '@shared/schemas/cohorts';
import { api } from '@/lib/api-client';

/** What an invitation link offers (public: works before signing in). A read, sent as POST so the token stays out of logs. */
export function previewInvitation(token: string): Promise<InvitationPreview> {
  return api.post<InvitationPreview>('/api/invitations/preview', { token });
}

export const invitationPreviewQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['invitations', 'preview', token] as const, queryFn: () => previewInvitation(token), retry: false, staleTime: 0 });

export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewQueryOptions(token));
}
