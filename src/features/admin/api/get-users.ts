import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AdminUser } from '@shared/schemas/auth';
import { api, qs } from '@/lib/api-client';

export interface UsersParams {
  q?: string;
  page: number;
  pageSize: number;
}

export interface UsersPage {
  users: AdminUser[];
  total: number;
  page: number;
  pageSize: number;
}

/** Accounts, newest first, filtered by a name or e-mail fragment. */
export async function getUsers(params: UsersParams): Promise<UsersPage> {
  const res = await api.getWithMeta<AdminUser[], { total: number; page: number; pageSize: number }>(`/api/admin/users${qs({ ...params })}`);
  return { users: res.data, total: res.meta?.total ?? res.data.length, page: res.meta?.page ?? params.page, pageSize: res.meta?.pageSize ?? params.pageSize };
}

/** The prefix shared by every page of the accounts list (for invalidation). */
export const usersQueryKeyRoot = ['admin', 'users'] as const;

export const usersQueryOptions = (params: UsersParams) =>
  queryOptions({ queryKey: [...usersQueryKeyRoot, params] as const, queryFn: () => getUsers(params), placeholderData: keepPreviousData });

export function useUsers(params: UsersParams) {
  return useQuery(usersQueryOptions(params));
}
