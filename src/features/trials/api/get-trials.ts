import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Trial } from '@shared/schemas/trials';
import { api, qs } from '@/lib/api-client';
import { trialKeys } from './keys';

export const getTrials = (gardenId?: string) => api.get<Trial[]>(`/api/trials${qs({ gardenId })}`);

export const trialsQueryOptions = (gardenId?: string) => queryOptions({ queryKey: trialKeys.list(gardenId), queryFn: () => getTrials(gardenId) });

export function useTrials(gardenId?: string) {
  return useQuery(trialsQueryOptions(gardenId));
}
