import { useState, type FormEvent } from 'react';
import type { AdminUser, Role } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmAction, ConfirmDialog } from '@/components/ui/confirm-dialog';
import { formatDate } from '@/lib/format';
import { useUpdateUser } from '../api/update-user';
import { useUsers, type UsersParams } from '../api/get-users';

const roleLabels: Record<Role, string> = { grower: 'Grower', educator: 'Educator', admin: 'Admin' };
/** "a grower", "an educator", "an admin". */
function withArticle(role: Role): string {
  const word = roleLabels[role].toLowerCase();
  return `${/^[aeiou]/.test(word) ? 'an' : 'a'} ${word}`;
}

const roleEffects: Record<Role, string> = {
  grower: 'runs their own trials and joins cohorts; cannot start cohorts.',
  educator: 'can also start and lead cohorts.',
  admin: 'can also see every account, change roles, disable accounts and read the development outbox.',
};

interface UsersTableProps {
  params: UsersParams;
  onParamsChange: (next: UsersParams) => void;
  /** The admin's own account: its role and status cannot be changed here. */
  currentUserId: string;
}

/** Accounts with search, paging, role changes and disable / enable, each confirmed first. */
export function UsersTable({ params, onParamsChange, currentUserId }: UsersTableProps) {
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
      setRoleError(err instanceof Error ? err.message : 'Could not change the role.');
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
            Search accounts
          </label>
          <input
            id="account-search"
            type="search"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder="Name or e-mail"
            className="block h-11 w-full rounded-lg border border-sand-300 bg-white px-3 text-base focus:border-terracotta-500 focus:outline-none focus:ring-2 focus:ring-terracotta-200"
          />
        </div>
        <div className="flex gap-2">
          <Button type="submit" className="h-11 flex-1 sm:flex-none">
            Search
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
              Show all
            </Button>
          ) : null}
        </div>
      </form>

      {users.isPending ? (
        <p role="status" className="text-ink-muted">
          Loading accounts…
        </p>
      ) : users.isError ? (
        <Alert tone="error">Could not load the accounts: {users.error.message}</Alert>
      ) : users.data.users.length === 0 ? (
        <p className="text-ink-muted">{params.q ? `No account matches “${params.q}”.` : 'No accounts yet.'}</p>
      ) : (
        <div className="overflow-hidden rounded-card border border-sand-200 bg-white">
          <table className="w-full text-sm" aria-describedby="accounts-range">
            <caption className="sr-only">Accounts</caption>
            <thead className="hidden bg-sand-50 text-left md:table-header-group">
              <tr>
                <th scope="col" className="px-3 py-2 font-medium">
                  Name
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  E-mail
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  Role
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  Status
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  Since
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  <span className="sr-only">Actions</span>
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
                      {isMe ? <span className="ml-2 rounded bg-terracotta-50 px-1.5 py-0.5 text-xs font-medium text-terracotta-800">you</span> : null}
                    </td>
                    <td className="block py-0.5 text-ink-muted [overflow-wrap:anywhere] md:table-cell md:px-3 md:py-2 md:text-ink">
                      {u.email}
                      {u.emailVerified ? null : <span className="ml-1 whitespace-nowrap text-xs text-ink-muted">(not confirmed)</span>}
                    </td>
                    <td className="flex items-center justify-between gap-2 py-1 md:table-cell md:px-3 md:py-2">
                      <span className="text-ink-muted md:hidden" aria-hidden="true">
                        Role
                      </span>
                      <select
                        aria-label={`Role of ${u.displayName}`}
                        value={u.role}
                        disabled={isMe}
                        title={isMe ? 'You cannot change your own role.' : undefined}
                        onChange={(e) => {
                          setRoleError(null);
                          setPendingRole({ user: u, role: e.target.value as Role });
                        }}
                        className="h-10 rounded-lg border border-sand-300 bg-white px-2 text-sm disabled:opacity-60"
                      >
                        {(Object.keys(roleLabels) as Role[]).map((r) => (
                          <option key={r} value={r}>
                            {roleLabels[r]}
                          </option>
                        ))}
                      </select>
                    </td>
                    <td className="flex items-center justify-between gap-2 py-1 md:table-cell md:px-3 md:py-2">
                      <span className="text-ink-muted md:hidden" aria-hidden="true">
                        Status
                      </span>
                      {u.disabled ? (
                        <span className="rounded-full border border-red-300 bg-red-50 px-2 py-0.5 text-xs font-medium text-red-900">Disabled</span>
                      ) : (
                        <span className="rounded-full border border-sage-200 bg-sage-50 px-2 py-0.5 text-xs font-medium text-sage-800">Active</span>
                      )}
                    </td>
                    <td className="flex items-center justify-between gap-2 py-1 md:table-cell md:px-3 md:py-2">
                      <span className="text-ink-muted md:hidden" aria-hidden="true">
                        Since
                      </span>
                      {formatDate(u.createdAt)}
                    </td>
                    <td className="block pt-2 md:table-cell md:px-3 md:py-2 md:text-right">
                      {isMe ? null : u.disabled ? (
                        <ConfirmAction
                          label="Enable"
                          ariaLabel={`Enable ${u.displayName}`}
                          buttonProps={{ className: 'w-full md:w-auto' }}
                          title={`Enable ${u.displayName}?`}
                          confirmLabel="Enable account"
                          onConfirm={() => update.mutateAsync({ userId: u.id, input: { disabled: false } })}
                        >
                          <p>{u.email} can sign in again with their password.</p>
                        </ConfirmAction>
                      ) : (
                        <ConfirmAction
                          label="Disable"
                          ariaLabel={`Disable ${u.displayName}`}
                          buttonProps={{ className: 'w-full md:w-auto' }}
                          title={`Disable ${u.displayName}?`}
                          confirmLabel="Disable account"
                          tone="danger"
                          onConfirm={() => update.mutateAsync({ userId: u.id, input: { disabled: true } })}
                        >
                          <p>{u.email} is signed out everywhere at once and cannot sign in until you enable the account again.</p>
                          <p>Nothing they recorded is deleted.</p>
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
        <nav aria-label="Account pages" className="flex flex-wrap items-center justify-between gap-3">
          <p id="accounts-range" className="text-sm text-ink-muted">
            {first}–{last} of {total} account{total === 1 ? '' : 's'}
            {params.q ? ` matching “${params.q}”` : ''}
          </p>
          <div className="flex gap-2">
            <Button variant="secondary" disabled={params.page <= 1} onClick={() => onParamsChange({ ...params, page: params.page - 1 })}>
              Previous
            </Button>
            <span className="self-center text-sm">
              Page {params.page} of {pages}
            </span>
            <Button variant="secondary" disabled={params.page >= pages} onClick={() => onParamsChange({ ...params, page: params.page + 1 })}>
              Next
            </Button>
          </div>
        </nav>
      ) : null}

      <ConfirmDialog
        open={pendingRole !== null}
        title={pendingRole ? `Make ${pendingRole.user.displayName} ${withArticle(pendingRole.role)}?` : ''}
        confirmLabel="Change role"
        pending={update.isPending}
        error={roleError}
        onConfirm={() => void confirmRole()}
        onCancel={() => setPendingRole(null)}
      >
        {pendingRole ? (
          <p>
            {pendingRole.user.email} is now {withArticle(pendingRole.user.role)}. As {withArticle(pendingRole.role)} they {roleEffects[pendingRole.role]}
          </p>
        ) : null}
      </ConfirmDialog>
    </div>
  );
}
