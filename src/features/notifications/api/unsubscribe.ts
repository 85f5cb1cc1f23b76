import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UnsubscribeResult } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationPreferencesQueryOptions } from './get-notification-preferences';

/** Turns off one kind of e-mail with the signed token from an e-mail's link; no session needed. */
export function unsubscribe(token: string): Promise<UnsubscribeResult> {
  return api.post<UnsubscribeResult>('/api/notifications/unsubscribe', { token });
}

export function useUnsubscribe() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: unsubscribe,
    // A signed-in reader's Reminders section shows the change.
    onSuccess: () => qc.invalidateQueries({ queryKey: notificationPreferencesQueryOptions().queryKey }),
  });
}
