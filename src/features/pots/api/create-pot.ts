import { useMutation } from '@tanstack/react-query';
import type { CreatePotInput, Pot } from '@shared/schemas/pots';
import { api } from '@/lib/api-client';
import { useRefreshPots } from './refresh-pots';

export const createPot = (input: CreatePotInput) => api.post<Pot>('/api/pots', input);

export function useCreatePot() {
  const refresh = useRefreshPots();
  return useMutation({ mutationFn: createPot, onSuccess: (pot) => refresh([pot.trialId]) });
}
