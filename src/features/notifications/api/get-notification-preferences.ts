import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NotificationPreferences } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';

export function getNotificationPreferences(): Promise<NotificationPreferences> {
  return api.get<NotificationPreferences>('/api/account/notifications');
}

export const notificationPreferencesQueryOptions = () =>
  queryOptions({ queryKey: ['notifications', 'preferences'] as const, queryFn: getNotificationPreferences });

export function useNotificationPreferences() {
  return useQuery(notificationPreferencesQueryOptions());
}
