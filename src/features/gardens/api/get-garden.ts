import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Garden } from '@shared/schemas/gardens';
import { api } from '@/lib/api-client';
import { gardenKeys } from './keys';

export const getGarden = (id: string) => api.get<Garden>(`/api/gardens/${id}`);

export const gardenQueryOptions = (id: string) => queryOptions({ queryKey: gardenKeys.detail(id), queryFn: () => getGarden(id) });

export function useGarden(id: string) {
  return useQuery(gardenQueryOptions(id));
}
