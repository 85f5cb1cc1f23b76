import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LogKind } from '@shared/schemas/logs';
import { api } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-roots';
import { logKeys } from './keys';

/** Logs change totals, so the trial's analysis and Round refresh too. */
function useRefresh(trialId: string) {
  const qc = useQueryClient();
  return () =>
    Promise.all([
      qc.invalidateQueries({ queryKey: logKeys.trial(trialId) }),
      qc.invalidateQueries({ queryKey: queryRoots.trialAnalysis(trialId) }),
      qc.invalidateQueries({ queryKey: queryRoots.round(trialId) }),
    ]);
}

export function useCreateLog(trialId: string, kind: LogKind) {
  const refresh = useRefresh(trialId);
  return useMutation({ mutationFn: (input: Record<string, unknown>) => api.post<{ id: string }>(`/api/trials/${trialId}/${kind}`, input), onSuccess: refresh });
}

export function useUpdateLog(trialId: string, kind: LogKind) {
  const refresh = useRefresh(trialId);
  return useMutation({ mutationFn: ({ id, patch }: { id: string; patch: Record<string, unknown> }) => api.patch<{ id: string }>(`/api/${kind}/${id}`, patch), onSuccess: refresh });
}

export function useDeleteLog(trialId: string, kind: LogKind) {
  const refresh = useRefresh(trialId);
  return useMutation({ mutationFn: (id: string) => api.delete<void>(`/api/${kind}/${id}`), onSuccess: refresh });
}
