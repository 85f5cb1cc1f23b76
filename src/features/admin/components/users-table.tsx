import { useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import { roleSchema, type AdminUser, type Role } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmAction, ConfirmDialog } from '@/components/ui/confirm-dialog';
import { formatDate, formatNumber } from '@/lib/format';
import { useUpdateUser } from '../api/update-user';
import { useUsers, type UsersParams } from '../api/get-users';


interface UsersTableProps {
  params: UsersParams;
  onParamsChange: (next: UsersParams) => void;
  /** The admin's own account: its role and status cannot be changed here. */
  currentUserId: string;
}

/** Accounts with search, paging, role changes and disable / enable, each confirmed first. */
export function UsersTable({ params, onParamsChange, currentUserId }: UsersTableProps) {
  const { t } = useTranslation('admin');
  const { t: tc } = useTranslation();
  const users = useUsers(params);
  const update = useUpdateUser();
  const [search, setSearch] = useState(params.q ?? '');
  const [pendingRole, setPendingRole] = useState<{ user: AdminUser; role: Role } | null>(null);
  const [roleError, setRoleError] = useState<string | null>(null);

  const submitSearch = (e: FormEvent) => {
    e.preventDefault();
    onParamsChange({ ...params, q: search.trim() || undefined, page: 1 });
  };

  const confirmRole = async () => {
    if (!pendingRole) return;
    setRoleError(null);
    try {
      await update.mutateAsync({ userId: pendingRole.user.id, input: { role: pendingRole.role } });
      setPendingRole(null);
    } catch (err) {
      setRoleError(err instanceof Error ? err.message : t(($) => $.users.roleError));
    }
  };

  const total = users.data?.total ?? 0;
  const first = total === 0 ? 0 : (params.page - 1) * params.pageSize + 1;
  const last = Math.min(total, params.page * params.pageSize);
  const pages = Math.max(1, Math.ceil(total / params.pageSize));

  return (
    <div className="space-y-4">
      <form role="search" onSubmit={submitSearch} className="flex flex-col gap-2 sm:flex-row sm:items-end">
        <div className="flex-1 space-y-1">
          <label htmlFor="account-search" className="block text-sm font-medium">
            {t(($) => $.users.search)}
          </label>
          <input
            id="account-search"
            type="search"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder={t(($) => $.users.searchPlaceholder)}
            className="block h-11 w-full rounded-lg border border-sand-300 bg-white px-3 text-base focus:border-terracotta-500 focus:outline-none focus:ring-2 focus:ring-terracotta-200"
          />
        </div>
        <div className="flex gap-2">
          <Button type="submit" className="h-11 flex-1 sm:flex-none">
            {t(($) => $.users.searchButton)}
          </Button>
          {params.q ? (
            <Button
              variant="secondary"
              className="h-11 flex-1 sm:flex-none"
              onClick={() => {
                setSearch('');
                onParamsChange({ ...params, q: undefined, page: 1 });
              }}
            >
              {t(($) => $.users.showAll)}
            </Button>
          ) : null}
        </div>
      </form>

      {users.isPending ? (
        <p role="status" className="text-ink-muted">
          {t(($) => $.users.loading)}
        </p>
      ) : users.isError ? (
        <Alert tone="error">{t(($) => $.users.loadFailed, { message: users.error.message })}</Alert>
      ) : users.data.users.length === 0 ? (
        <p className="text-ink-muted">{params.q ? t(($) => $.users.noMatch, { q: params.q }) : t(($) => $.users.none)}</p>
      ) : (
        <div className="overflow-hidden rounded-card border border-sand-200 bg-white">
          <table className="w-full text-sm" aria-describedby="accounts-range">
            <caption className="sr-only">{t(($) => $.users.caption)}</caption>
            <thead className="hidden bg-sand-50 text-left md:table-header-group">
              <tr>
                <th scope="col" className="px-3 py-2 font-medium">
                  {t(($) => $.users.name)}
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  {t(($) => $.users.email)}
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  {t(($) => $.users.role)}
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  {t(($) => $.users.status)}
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  {t(($) => $.users.since)}
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  <span className="sr-only">{t(($) => $.users.actions)}</span>
                </th>
              </tr>
            </thead>
            <tbody className={users.isPlaceholderData ? 'opacity-60' : undefined}>
              {users.data.users.map((u) => {
                const isMe = u.id === currentUserId;
                return (
                  <tr key={u.id} className="block border-b border-sand-200 px-3 py-3 last:border-0 md:table-row md:px-0 md:py-0">
                    <td className="block py-0.5 md:table-cell md:px-3 md:py-2">
                      <span className="font-medium">{u.displayName}</span>
                      {isMe ? <span className="ml-2 rounded bg-terracotta-50 px-1.5 py-0.5 text-xs font-medium text-terracotta-800">{tc(($) => $.you)}</span> : null}
                    </td>
                    <td className="block py-0.5 text-ink-muted [overflow-wrap:anywhere] md:table-cell md:px-3 md:py-2 md:text-ink">
                      {u.email}
                      {u.emailVerified ? null : <span className="ml-1 whitespace-nowrap text-xs text-ink-muted">{t(($) => $.users.notConfirmed)}</span>}
                    </td>
                    <td className="flex items-center justify-between gap-2 py-1 md:table-cell md:px-3 md:py-2">
                      <span className="text-ink-muted md:hidden" aria-hidden="true">
                        {t(($) => $.users.role)}
                      </span>
                      <select
                        aria-label={t(($) => $.users.roleOf, { name: u.displayName })}
                        value={u.role}
                        disabled={isMe}
                        title={isMe ? t(($) => $.users.ownRole) : undefined}
                        onChange={(e) => {
                          setRoleError(null);
                          setPendingRole({ user: u, role: e.target.value as Role });
                        }}
                        className="h-10 rounded-lg border border-sand-300 bg-white px-2 text-sm disabled:opacity-60"
                      >
                        {roleSchema.options.map((r) => (
                          <option key={r} value={r}>
                            {t(($) => $.users.roles[r])}
                          </option>
                        ))}
                      </select>
                    </td>
                    <td className="flex items-center justify-between gap-2 py-1 md:table-cell md:px-3 md:py-2">
                      <span className="text-ink-muted md:hidden" aria-hidden="true">
                        {t(($) => $.users.status)}
                      </span>
                      {u.disabled ? (
                        <span className="rounded-full border border-red-300 bg-red-50 px-2 py-0.5 text-xs font-medium text-red-900">{t(($) => $.users.disabled)}</span>
                      ) : (
                        <span className="rounded-full border border-sage-200 bg-sage-50 px-2 py-0.5 text-xs font-medium text-sage-800">{t(($) => $.users.active)}</span>
                      )}
                    </td>
                    <td className="flex items-center justify-between gap-2 py-1 md:table-cell md:px-3 md:py-2">
                      <span className="text-ink-muted md:hidden" aria-hidden="true">
                        {t(($) => $.users.since)}
                      </span>
                      {formatDate(u.createdAt)}
                    </td>
                    <td className="block pt-2 md:table-cell md:px-3 md:py-2 md:text-right">
                      {isMe ? null : u.disabled ? (
                        <ConfirmAction
                          label={t(($) => $.users.enable)}
                          ariaLabel={t(($) => $.users.enableLabel, { name: u.displayName })}
                          buttonProps={{ className: 'w-full md:w-auto' }}
                          title={t(($) => $.users.enableTitle, { name: u.displayName })}
                          confirmLabel={t(($) => $.users.enableConfirm)}
                          onConfirm={() => update.mutateAsync({ userId: u.id, input: { disabled: false } })}
                        >
                          <p>{t(($) => $.users.enableBody, { email: u.email })}</p>
                        </ConfirmAction>
                      ) : (
                        <ConfirmAction
                          label={t(($) => $.users.disable)}
                          ariaLabel={t(($) => $.users.disableLabel, { name: u.displayName })}
                          buttonProps={{ className: 'w-full md:w-auto' }}
                          title={t(($) => $.users.disableTitle, { name: u.displayName })}
                          confirmLabel={t(($) => $.users.disableConfirm)}
                          tone="danger"
                          onConfirm={() => update.mutateAsync({ userId: u.id, input: { disabled: true } })}
                        >
                          <p>{t(($) => $.users.disableBody, { email: u.email })}</p>
                          <p>{t(($) => $.users.disableBody2)}</p>
                        </ConfirmAction>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}

      {users.data && total > 0 ? (
        <nav aria-label={t(($) => $.users.pages)} className="flex flex-wrap items-center justify-between gap-3">
          <p id="accounts-range" className="text-sm text-ink-muted">
            {params.q
              ? t(($) => $.users.rangeMatching, { first: formatNumber(first, 0), last: formatNumber(last, 0), count: total, q: params.q })
              : t(($) => $.users.range, { first: formatNumber(first, 0), last: formatNumber(last, 0), count: total })}
          </p>
          <div className="flex gap-2">
            <Button variant="secondary" disabled={params.page <= 1} onClick={() => onParamsChange({ ...params, page: params.page - 1 })}>
              {tc(($) => $.actions.previous)}
            </Button>
            <span className="self-center whitespace-nowrap text-sm">
              {t(($) => $.users.page, { page: params.page, pages })}
            </span>
            <Button variant="secondary" disabled={params.page >= pages} onClick={() => onParamsChange({ ...params, page: params.page + 1 })}>
              {tc(($) => $.actions.next)}
            </Button>
          </div>
        </nav>
      ) : null}

      <ConfirmDialog
        open={pendingRole !== null}
        title={pendingRole ? t(($) => $.users.changeTitle, { name: pendingRole.user.displayName, role: t(($) => $.users.roleArticle[pendingRole.role]) }) : ''}
        confirmLabel={t(($) => $.users.changeConfirm)}
        pending={update.isPending}
        error={roleError}
        onConfirm={() => void confirmRole()}
        onCancel={() => setPendingRole(null)}
      >
        {pendingRole ? (
          <p>
            {t(($) => $.users.changeBody, {
              email: pendingRole.user.email,
              from: t(($) => $.users.roleArticle[pendingRole.user.role]),
              to: t(($) => $.users.roleArticle[pendingRole.role]),
              effect: t(($) => $.users.roleEffects[pendingRole.role]),
            })}
          </p>
        ) : null}
      </ConfirmDialog>
    </div>
  );
}
