import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AdminUpdateUserInput, AdminUser } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { usersQueryKeyRoot } from './get-users';

/** Changes an account's role, or disables / enables it (disabling signs it out everywhere). */
export function updateUser(userId: string, input: AdminUpdateUserInput): Promise<AdminUser> {
  return api.patch<AdminUser>(`/api/admin/users/${encodeURIComponent(userId)}`, input);
}

export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, input }: { userId: string; input: AdminUpdateUserInput }) => updateUser(userId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: usersQueryKeyRoot }),
  });
}
