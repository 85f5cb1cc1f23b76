import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FrostWarning } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';

export function getFrostWarnings(): Promise<FrostWarning[]> {
  return api.get<FrostWarning[]>('/api/frost-warnings');
}

/** The signed-in grower's gardens with a frost night today or in the next 2 days. */
export const frostWarningsQueryOptions = () => queryOptions({ queryKey: ['notifications', 'frost'] as const, queryFn: getFrostWarnings, staleTime: 5 * 60_000 });

export function useFrostWarnings() {
  return useQuery(frostWarningsQueryOptions());
}
