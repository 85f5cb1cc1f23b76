import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Plot } from '@shared/schemas/plots';
import { api } from '@/lib/api-client';
import { trialKeys } from './keys';

export const getPlots = (trialId: string) => api.get<Plot[]>(`/api/trials/${trialId}/plots`);

export const plotsQueryOptions = (trialId: string) => queryOptions({ queryKey: trialKeys.plots(trialId), queryFn: () => getPlots(trialId) });

export function usePlots(trialId: string) {
  return useQuery(plotsQueryOptions(trialId));
}
