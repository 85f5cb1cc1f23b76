import { onlineManager, useMutationState, type MutationKey, type QueryClient } from '@tanstack/react-query';
import { ApiRequestError } from '@/lib/api-client';

/**
 * The outbox: writes a grower makes in the garden that this phone keeps until they are sent.
 * A feature registers the mutation key of such a write (the Round's batch save) and how many
 * records one call carries; the outbox then keeps those mutations in storage while pending
 * (or refused), resumes them after a reload and counts them for the "waiting to send" badge.
 * The mutation itself must be safe to send twice (idempotency keys).
 */
export interface OutboxKind {
  /** Key prefix of the mutations, e.g. ['round', 'save']. */
  key: MutationKey;
  /** Records one call carries (its variables). */
  size: (variables: unknown) => number;
}

const kinds: OutboxKind[] = [];

/**
 * What the outbox reads of a mutation. Structural on purpose: the persist packages bring their own
 * copy of query-core's types (one version behind), and a class type from one copy is not assignable
 * to the other's; the bundle has one copy (vite.config.ts `dedupe`).
 */
export interface MutationLike {
  options: { mutationKey?: MutationKey };
  state: { status: string; variables?: unknown };
}

export function registerOutboxKind(kind: OutboxKind) {
  if (!kinds.some((k) => JSON.stringify(k.key) === JSON.stringify(kind.key))) kinds.push(kind);
}

function kindOf(mutation: MutationLike): OutboxKind | undefined {
  const key = mutation.options.mutationKey;
  if (!key) return undefined;
  return kinds.find((k) => k.key.every((part, i) => JSON.stringify(part) === JSON.stringify(key[i])));
}

/** A write that waits on this phone: kept in storage while pending or refused. */
export function isKeptInOutbox(mutation: MutationLike): boolean {
  return Boolean(kindOf(mutation)) && (mutation.state.status === 'pending' || mutation.state.status === 'error');
}

/**
 * Once the stored cache is back: with a connection the app reads everything fresh, exactly as
 * without storage (a session, role or unit system changed meanwhile must not be shown stale); the
 * stored session, trial and Round are only for opening without one. The outbox always stays.
 */
export function afterRestore(client: QueryClient) {
  if (onlineManager.isOnline()) client.getQueryCache().clear();
  resumeOutbox(client);
}

/**
 * Sends again what a previous visit left pending. Resuming after a reload runs the mutation from
 * its stored variables (same idempotency keys); offline, it pauses again until the connection returns.
 */
export function resumeOutbox(client: QueryClient) {
  for (const m of client.getMutationCache().getAll()) {
    if (kindOf(m) && m.state.status === 'pending') void m.continue().catch(() => undefined);
  }
}

/**
 * Retry rule for outbox writes: a lost connection, a timeout, a busy or failing server are tried
 * again without end (the write waits; the idempotency key makes a repeat harmless); any other
 * refusal (validation, access, a closed trial) is final and goes back to the grower.
 */
export function isWorthRetrying(error: unknown): boolean {
  if (!(error instanceof ApiRequestError)) return true;
  return error.status === 0 || error.status === 408 || error.status === 429 || error.status >= 500;
}

/** Waits between attempts: 1 s, 2 s, 4 s … up to a minute. */
export const outboxRetryDelay = (attempt: number) => Math.min(60_000, 1000 * 2 ** attempt);

export interface OutboxSummary {
  /** Records pending on this phone (paused offline, between attempts, or being sent). */
  waiting: number;
  /** Records the server refused, to be looked at on their screen. */
  refused: number;
}

/** Counts every outbox write in the cache; for the app-wide badge. */
export function useOutboxSummary(): OutboxSummary {
  const items = useMutationState({
    filters: { predicate: (m) => Boolean(kindOf(m)) },
    select: (m) => ({ status: m.state.status, n: kindOf(m)?.size(m.state.variables) ?? 0 }),
  });
  let waiting = 0;
  let refused = 0;
  for (const i of items) {
    if (i.status === 'pending') waiting += i.n;
    else if (i.status === 'error') refused += i.n;
  }
  return { waiting, refused };
}
