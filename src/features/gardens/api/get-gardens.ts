import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Garden } from '@shared/schemas/gardens';
import { api } from '@/lib/api-client';
import { gardenKeys } from './keys';

export const getGardens = () => api.get<Garden[]>('/api/gardens');

export const gardensQueryOptions = () => queryOptions({ queryKey: gardenKeys.list, queryFn: getGardens });

export function useGardens() {
  return useQuery(gardensQueryOptions());
}
