import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
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
  return client;
}
