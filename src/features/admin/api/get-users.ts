import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AdminUser } from '@shared/schemas/auth';
import { api, qs } from '@/lib/api-client';

export interface UsersParams {
  q?: string;
  page: number;
  pageSize: number;
}

export const ADMIN_PAGE_SIZE = 25;

/** Search and page live in the address, so a filtered list can be reloaded or shared (the admin page and its loader). */
export function usersParamsFrom(search: URLSearchParams): UsersParams {
  const page = Number(search.get('page'));
  return { q: search.get('q')?.trim() || undefined, page: Number.isInteger(page) && page > 0 ? page : 1, pageSize: ADMIN_PAGE_SIZE };
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
