import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Pot } from '@shared/schemas/pots';
import { api, qs } from '@/lib/api-client';
import { potKeys } from './keys';

export const getPots = (trialId?: string) => api.get<Pot[]>(`/api/pots${qs({ trialId })}`);

export const potsQueryOptions = (trialId?: string) => queryOptions({ queryKey: potKeys.list(trialId), queryFn: () => getPots(trialId) });

export function usePots(trialId?: string) {
  return useQuery(potsQueryOptions(trialId));
}
