import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { sessionQueryOptions } from '@/features/auth/api/get-session';
import { syncOnlineStatus } from '@/features/offline/online';
import { persistQueries } from '@/features/offline/persist';
import { registerRoundSave } from '@/features/round/api/save-round';
import { ApiRequestError } from '@/lib/api-client';

/** Set when a request finds the session gone, so the sign-in page can say why. */
export const SESSION_EXPIRED_FLAG = 'seepwise.session-expired';

function onUnauthenticated(client: QueryClient, err: unknown) {
  if (err instanceof ApiRequestError && err.status === 401) {
    const session = client.getQueryData<{ user: unknown; csrfToken: string }>(['auth', 'session']);
    if (session?.user) {
      sessionStorage.setItem(SESSION_EXPIRED_FLAG, '1');
      void client.invalidateQueries({ queryKey: ['auth', 'session'] });
    }
  }
}

export function createQueryClient() {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (err) => onUnauthenticated(client, err) }),
    mutationCache: new MutationCache({ onError: (err) => onUnauthenticated(client, err) }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: (count, err) => !(err instanceof ApiRequestError && err.status >= 400 && err.status < 500) && count < 2,
        refetchOnWindowFocus: false,
      },
    },
  });

  // Offline quick entry: the Round's save waits on the phone and resumes after a reload, and what
  // the Round screen needs to open without a connection is kept on the phone (features/offline).
  syncOnlineStatus();
  registerRoundSave(client);
  // Prefixes of sessionQueryOptions, trialKeys.detail(id) and queryRoots.round(id). They stay in
  // memory (a few small objects), or an unvisited Round would drop out of storage after the default
  // five minutes. Infinity, not "30 days": a timer above 2^31 − 1 ms (24.8 days) fires at once.
  const kept = [sessionQueryOptions().queryKey, ['trials', 'detail'] as const, ['round'] as const];
  for (const key of kept) {
    persistQueries(key);
    client.setQueryDefaults(key, { gcTime: Infinity });
  }
  return client;
}
