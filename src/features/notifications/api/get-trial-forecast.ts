import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TrialForecast } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';

export function getTrialForecast(trialId: string): Promise<TrialForecast> {
  return api.get<TrialForecast>(`/api/trials/${encodeURIComponent(trialId)}/forecast`);
}

/** Refill forecast of a trial's pots; a minute old at most, since levels move with the clock. */
export const trialForecastQueryOptions = (trialId: string) =>
  queryOptions({ queryKey: ['notifications', 'forecast', trialId] as const, queryFn: () => getTrialForecast(trialId), staleTime: 60_000 });

export function useTrialForecast(trialId: string) {
  return useQuery(trialForecastQueryOptions(trialId));
}
