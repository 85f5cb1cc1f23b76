import { useMutation, type QueryClient } from '@tanstack/react-query';
import type { RoundInput } from '@shared/schemas/logs';
import { isWorthRetrying, outboxRetryDelay, registerOutboxKind } from '@/features/offline/outbox';
import { api, type ApiRequestError } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-roots';

export type RoundResult = { type: string; id: string; created: boolean }[];

/** One walk's entries for one trial. The trial travels with them so a stored save can resume alone. */
export interface RoundSaveVariables {
  trialId: string;
  input: RoundInput;
}

export const roundSaveKey = (trialId: string) => ['round', 'save', trialId] as const;

export const saveRound = ({ trialId, input }: RoundSaveVariables) => api.post<RoundResult>(`/api/trials/${trialId}/round`, input);

/**
 * Registers the Round's save on the query client (before the stored cache is restored), so a save
 * made offline — stored on the phone, then the page reloaded — still knows how to send itself and
 * what to refresh. Offline it pauses (networkMode 'online'); a lost connection or a busy server is
 * retried; each entry keeps its idempotency key, so a repeat never makes a second record.
 */
export function registerRoundSave(client: QueryClient) {
  registerOutboxKind({ key: ['round', 'save'], size: (v) => (v as RoundSaveVariables | undefined)?.input.entries.length ?? 0 });
  client.setMutationDefaults(['round', 'save'], {
    mutationFn: (v: unknown) => saveRound(v as RoundSaveVariables),
    networkMode: 'online',
    retry: (_count, error) => isWorthRetrying(error),
    retryDelay: outboxRetryDelay,
    // A refused save waits in the cache until the grower saves its taps again or discards them;
    // the default five minutes would drop it unseen. (Saves of one page visit are a few small objects.)
    gcTime: Infinity,
    // Not awaited: a refetch that pauses (the signal gone again) must not hold the save "pending".
    onSuccess: (_data, v) => {
      const { trialId } = v as RoundSaveVariables;
      void client.invalidateQueries({ queryKey: queryRoots.round(trialId) });
      void client.invalidateQueries({ queryKey: queryRoots.logs(trialId) });
      void client.invalidateQueries({ queryKey: queryRoots.trialAnalysis(trialId) });
    },
  });
}

/** Saves one walk; the function, retries and refreshes come from registerRoundSave. */
export function useSaveRound(trialId: string) {
  return useMutation<RoundResult, ApiRequestError, RoundSaveVariables>({ mutationKey: roundSaveKey(trialId) });
}
