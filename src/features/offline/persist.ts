import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import type { QueryKey } from '@tanstack/react-query';
import type { PersistedClient } from '@tanstack/react-query-persist-client';
import { isKeptInOutbox, type MutationLike } from './outbox';

/** localStorage key of the persisted cache. */
export const PERSIST_KEY = 'seepwise.offline.v1';
/**
 * Bump only when the stored shape changes so that old entries cannot be read: a new buster throws
 * away everything stored, pending Round entries included.
 */
const BUSTER = '1';
/** A phone left in the shed for a month still sends its Round. */
export const PERSIST_MAX_AGE = 30 * 24 * 3600_000;

/**
 * Queries kept on the phone so the Round opens without a connection: the session (without its
 * CSRF token), the trial and its Round. Nothing else is stored. Give them `gcTime: Infinity` too
 * (setQueryDefaults), or an unvisited screen drops out of storage after five minutes.
 */
const persistedRoots: QueryKey[] = [];

export function persistQueries(root: QueryKey) {
  if (!persistedRoots.some((r) => JSON.stringify(r) === JSON.stringify(root))) persistedRoots.push(root);
}

const startsWith = (key: QueryKey, root: QueryKey) => root.every((part, i) => JSON.stringify(part) === JSON.stringify(key[i]));

// Typed structurally, not as DehydrateOptions, so it fits both copies of query-core's types (see MutationLike).
const dehydrateOptions = {
  shouldDehydrateQuery: (q: { queryKey: QueryKey; state: { status: string } }) => q.state.status === 'success' && persistedRoots.some((r) => startsWith(q.queryKey, r)),
  shouldDehydrateMutation: (m: MutationLike) => isKeptInOutbox(m),
};

/** Errors become plain objects (an Error's message is not enumerable, so JSON would drop it). */
function plainError(e: Error | null): Error | null {
  if (!e || typeof e !== 'object') return e;
  const { status, code } = e as { status?: number; code?: string };
  return { name: e.name, message: e.message, status, code } as Error;
}

/** The CSRF token never reaches storage: after a reload the api-client reads a fresh one. */
function redact(client: PersistedClient): PersistedClient {
  const { queries, mutations } = client.clientState;
  return {
    ...client,
    clientState: {
      queries: queries.map((q) => {
        const data = q.state.data as { csrfToken?: unknown } | undefined;
        if (!data || typeof data !== 'object' || !('csrfToken' in data)) return q;
        return { ...q, state: { ...q.state, data: { ...data, csrfToken: '' } } };
      }),
      mutations: mutations.map((m) => ({ ...m, state: { ...m.state, error: plainError(m.state.error), failureReason: plainError(m.state.failureReason) } })),
    },
  };
}

const storage = typeof window !== 'undefined' ? window.localStorage : undefined;
const serialize = (client: PersistedClient) => JSON.stringify(redact(client));

/**
 * No throttle: a save is written as soon as it is made (a phone locked right after Save keeps it).
 * The stored state is a few small objects, so writing on every cache change costs little. (A
 * throttle would also stall under a frozen clock: it waits for Date.now() to pass a mark.)
 */
export const persister = createAsyncStoragePersister({ storage, key: PERSIST_KEY, throttleTime: 0, serialize });

/** Options for PersistQueryClientProvider. */
export const persistOptions = { persister, maxAge: PERSIST_MAX_AGE, buster: BUSTER, dehydrateOptions };
