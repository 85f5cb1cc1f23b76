import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionInfo } from '@shared/schemas/auth';
import { api, setCsrfToken } from '@/lib/api-client';

export async function getSession(): Promise<SessionInfo> {
  const info = await api.get<SessionInfo>('/api/auth/session');
  setCsrfToken(info.csrfToken);
  return info;
}

export const sessionQueryOptions = () =>
  queryOptions({ queryKey: ['auth', 'session'] as const, queryFn: getSession, staleTime: 60_000 });

export function useSession() {
  return useQuery(sessionQueryOptions());
}

/** The signed-in account, or null. */
export function useCurrentUser() {
  return useSession().data?.user ?? null;
}
