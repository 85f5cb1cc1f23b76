import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { useRefreshPots } from './refresh-pots';

export const deleteSeepTest = (seepTestId: string) => api.delete<void>(`/api/seep-tests/${seepTestId}`);

export function useDeleteSeepTest() {
  const refresh = useRefreshPots();
  return useMutation({ mutationFn: deleteSeepTest, onSuccess: () => refresh() });
}
