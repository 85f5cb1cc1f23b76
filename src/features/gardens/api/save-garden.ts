import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateGardenInput, Garden, UpdateGardenInput } from '@shared/schemas/gardens';
import { api } from '@/lib/api-client';
import { gardenQueryOptions } from './get-garden';
import { gardensQueryOptions } from './get-gardens';

export function useCreateGarden() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateGardenInput) => api.post<Garden>('/api/gardens', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: gardensQueryOptions().queryKey }),
  });
}

export function useUpdateGarden(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateGardenInput) => api.patch<Garden>(`/api/gardens/${id}`, input),
    onSuccess: (g) => {
      qc.setQueryData(gardenQueryOptions(id).queryKey, g);
      return qc.invalidateQueries({ queryKey: gardensQueryOptions().queryKey });
    },
  });
}

export function useDeleteGarden() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete<void>(`/api/gardens/${id}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: gardensQueryOptions().queryKey }),
  });
}
