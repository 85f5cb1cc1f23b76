import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-roots';

export interface RoundPlot {
  id: string;
  label: string;
  treatment: string | null;
  blockKey: string;
  areaM2: number;
  lastSurfaceL: number | null;
  lastWateredAt: string | null;
}

export interface RoundPot {
  id: string;
  label: string;
  plotId: string;
  capacityL: number;
  condition: string;
  lastRefillL: number | null;
  lastRefillAt: string | null;
  seepLPerDay: number | null;
}

export const getRound = (trialId: string) => api.get<{ plots: RoundPlot[]; pots: RoundPot[] }>(`/api/trials/${trialId}/round`);

export const roundQueryOptions = (trialId: string) => queryOptions({ queryKey: queryRoots.round(trialId), queryFn: () => getRound(trialId) });

export function useRound(trialId: string) {
  return useQuery(roundQueryOptions(trialId));
}
