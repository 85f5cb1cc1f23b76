import { useMutation } from '@tanstack/react-query';
import type { Pot } from '@shared/schemas/pots';
import { api } from '@/lib/api-client';
import { useRefreshPots } from './refresh-pots';

export const deletePot = (potId: string) => api.delete<void>(`/api/pots/${potId}`);

export function useDeletePot() {
  const refresh = useRefreshPots();
  return useMutation({ mutationFn: (pot: Pot) => deletePot(pot.id), onSuccess: (_, pot) => refresh([pot.trialId]) });
}
