import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreatePlotInput, Plot, UpdatePlotInput } from '@shared/schemas/plots';
import type { CreateTrialInput, Trial, TrialStatus, UpdateTrialInput } from '@shared/schemas/trials';
import { api } from '@/lib/api-client';
import { auditQueryOptions } from './get-audit';
import { trialKeys } from './keys';
import { plotsQueryOptions } from './get-plots';
import { trialQueryOptions } from './get-trial';

/** Everything that shows a trial or its plots is refreshed after a change. */
function useTrialInvalidation(trialId: string) {
  const qc = useQueryClient();
  return async () => {
    await Promise.all([
      qc.invalidateQueries({ queryKey: trialQueryOptions(trialId).queryKey }),
      qc.invalidateQueries({ queryKey: plotsQueryOptions(trialId).queryKey }),
      qc.invalidateQueries({ queryKey: auditQueryOptions(trialId).queryKey }),
      qc.invalidateQueries({ queryKey: trialKeys.lists }),
      ...trialKeys.dependents(trialId).map((queryKey) => qc.invalidateQueries({ queryKey })),
    ]);
  };
}

export function useCreateTrial(gardenId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateTrialInput) => api.post<Trial>(`/api/gardens/${gardenId}/trials`, input),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: trialKeys.lists }), qc.invalidateQueries({ queryKey: trialKeys.gardens })]),
  });
}

export function useUpdateTrial(trialId: string) {
  const refresh = useTrialInvalidation(trialId);
  return useMutation({ mutationFn: (input: UpdateTrialInput) => api.patch<Trial>(`/api/trials/${trialId}`, input), onSuccess: refresh });
}

export function useSetTrialStatus(trialId: string) {
  const refresh = useTrialInvalidation(trialId);
  return useMutation({ mutationFn: (status: TrialStatus) => api.post<Trial>(`/api/trials/${trialId}/status`, { status }), onSuccess: refresh });
}

export function useDeleteTrial(trialId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete<void>(`/api/trials/${trialId}`),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: trialKeys.lists }), qc.invalidateQueries({ queryKey: trialKeys.gardens })]),
  });
}

export function useCreatePlot(trialId: string) {
  const refresh = useTrialInvalidation(trialId);
  return useMutation({ mutationFn: (input: CreatePlotInput) => api.post<Plot>(`/api/trials/${trialId}/plots`, input), onSuccess: refresh });
}

export function useUpdatePlot(trialId: string) {
  const refresh = useTrialInvalidation(trialId);
  return useMutation({ mutationFn: ({ id, input }: { id: string; input: UpdatePlotInput }) => api.patch<Plot>(`/api/plots/${id}`, input), onSuccess: refresh });
}

export function useDeletePlot(trialId: string) {
  const refresh = useTrialInvalidation(trialId);
  return useMutation({ mutationFn: (id: string) => api.delete<void>(`/api/plots/${id}`), onSuccess: refresh });
}

export function useRandomise(trialId: string) {
  const refresh = useTrialInvalidation(trialId);
  return useMutation({ mutationFn: (seed?: string) => api.post<{ seed: string; plots: Plot[] }>(`/api/trials/${trialId}/randomise`, seed ? { seed } : {}), onSuccess: refresh });
}
