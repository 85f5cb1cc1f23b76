import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { trialKeys } from './keys';

export interface TrialShare {
  cohortId: string;
  cohortName: string;
  sharedAt: string;
  withdrawnAt: string | null;
}

export const getShares = (trialId: string) => api.get<TrialShare[]>(`/api/trials/${trialId}/shares`);

export const sharesQueryOptions = (trialId: string) => queryOptions({ queryKey: trialKeys.shares(trialId), queryFn: () => getShares(trialId) });

export function useShares(trialId: string, enabled = true) {
  return useQuery({ ...sharesQueryOptions(trialId), enabled });
}

export function useShareTrial(trialId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (cohortId: string) => api.post<TrialShare[]>(`/api/trials/${trialId}/shares`, { cohortId }),
    onSuccess: (data) => qc.setQueryData(sharesQueryOptions(trialId).queryKey, data),
  });
}

export function useWithdrawShare(trialId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (cohortId: string) => api.delete<TrialShare[]>(`/api/trials/${trialId}/shares/${cohortId}`),
    onSuccess: (data) => qc.setQueryData(sharesQueryOptions(trialId).queryKey, data),
  });
}
