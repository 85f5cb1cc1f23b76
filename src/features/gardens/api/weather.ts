import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { WeatherDayInput } from '@shared/schemas/logs';
import { api, qs } from '@/lib/api-client';
import { gardenKeys } from './keys';

export interface WeatherDay extends WeatherDayInput {
  id: string;
  gardenId: string;
}

export const getWeather = (gardenId: string, from?: string, to?: string) => api.get<WeatherDay[]>(`/api/gardens/${gardenId}/weather${qs({ from, to })}`);

export const weatherQueryOptions = (gardenId: string, from?: string, to?: string) =>
  queryOptions({ queryKey: gardenKeys.weather(gardenId, from, to), queryFn: () => getWeather(gardenId, from, to) });

export function useWeather(gardenId: string, from?: string, to?: string) {
  return useQuery(weatherQueryOptions(gardenId, from, to));
}

export function useSaveWeatherDay(gardenId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: WeatherDayInput) => api.put<WeatherDay>(`/api/gardens/${gardenId}/weather`, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: gardenKeys.weatherAll(gardenId) }),
  });
}

export function useDeleteWeatherDay(gardenId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete<void>(`/api/weather-days/${id}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: gardenKeys.weatherAll(gardenId) }),
  });
}
