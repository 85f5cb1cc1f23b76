import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { NotificationPreferences, UpdateNotificationPreferencesInput } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationPreferencesQueryOptions } from './get-notification-preferences';

export function updateNotificationPreferences(input: UpdateNotificationPreferencesInput): Promise<NotificationPreferences> {
  return api.patch<NotificationPreferences>('/api/account/notifications', input);
}

export function useUpdateNotificationPreferences() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateNotificationPreferences,
    onSuccess: (prefs) => qc.setQueryData(notificationPreferencesQueryOptions().queryKey, prefs),
  });
}
