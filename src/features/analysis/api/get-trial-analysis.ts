import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TrialAnalysis } from '@shared/analysis/trial-analysis';
import { api } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-roots';

export type TrialAnalysisResponse = TrialAnalysis & { asOf: string };

export const getTrialAnalysis = (trialId: string) => api.get<TrialAnalysisResponse>(`/api/trials/${trialId}/analysis`);

export const trialAnalysisQueryOptions = (trialId: string) => queryOptions({ queryKey: queryRoots.trialAnalysis(trialId), queryFn: () => getTrialAnalysis(trialId) });

export function useTrialAnalysis(trialId: string) {
  return useQuery(trialAnalysisQueryOptions(trialId));
}
