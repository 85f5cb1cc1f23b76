import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Trial } from '@shared/schemas/trials';
import { api } from '@/lib/api-client';
import { trialKeys } from './keys';

export const getTrial = (id: string) => api.get<Trial>(`/api/trials/${id}`);

export const trialQueryOptions = (id: string) => queryOptions({ queryKey: trialKeys.detail(id), queryFn: () => getTrial(id) });

export function useTrial(id: string) {
  return useQuery(trialQueryOptions(id));
}
