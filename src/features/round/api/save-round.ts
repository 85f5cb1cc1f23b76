import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoundInput } from '@shared/schemas/logs';
import { api } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-roots';

export type RoundResult = { type: string; id: string; created: boolean }[];

/** Sends one walk's entries in one request; each carries an idempotency key, so a retry never duplicates. */
export function useSaveRound(trialId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationKey: ['round', 'save', trialId] as const,
    mutationFn: (input: RoundInput) => api.post<RoundResult>(`/api/trials/${trialId}/round`, input),
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: queryRoots.round(trialId) }),
        qc.invalidateQueries({ queryKey: queryRoots.logs(trialId) }),
        qc.invalidateQueries({ queryKey: queryRoots.trialAnalysis(trialId) }),
      ]),
  });
}
