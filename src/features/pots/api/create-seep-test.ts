import { useMutation } from '@tanstack/react-query';
import type { CreateSeepTestInput, SeepTest } from '@shared/schemas/pots';
import { api } from '@/lib/api-client';
import { useRefreshPots } from './refresh-pots';

export const createSeepTest = (potId: string, input: CreateSeepTestInput) => api.post<SeepTest>(`/api/pots/${potId}/seep-tests`, input);

export function useCreateSeepTest(potId: string) {
  const refresh = useRefreshPots();
  return useMutation({ mutationFn: (input: CreateSeepTestInput) => createSeepTest(potId, input), onSuccess: () => refresh() });
}
