import { NavLink, useSearchParams } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { HealthCard } from '@/features/admin/components/health-card';
import { OutboxList } from '@/features/admin/components/outbox-list';
import { UsersTable } from '@/features/admin/components/users-table';
import { usersParamsFrom } from '@/features/admin/api/get-users';
import { cn } from '@/lib/utils';

function AdminTabs() {
  const tab = ({ isActive }: { isActive: boolean }) =>
    cn('inline-flex min-h-11 items-center rounded-lg px-4 text-sm font-medium', isActive ? 'bg-terracotta-50 text-terracotta-800' : 'text-ink-muted hover:bg-sand-100 hover:text-ink');
  return (
    <nav aria-label="Admin sections" className="flex gap-1 border-b border-sand-200 pb-2">
      <NavLink to={paths.admin} end className={tab}>
        Accounts and health
      </NavLink>
      <NavLink to={paths.adminOutbox} className={tab}>
        Outbox
      </NavLink>
    </nav>
  );
}

export function AdminPage() {
  const user = useCurrentUser();
  const [search, setSearch] = useSearchParams();
  const params = usersParamsFrom(search);
  return (
    <div className="space-y-6">
      <div>
        <h1>Admin</h1>
        <p className="mt-1 text-ink-muted">Accounts, roles and the state of the server.</p>
      </div>
      <AdminTabs />
      <HealthCard />
      <Card role="region" aria-labelledby="accounts-heading" className="space-y-4">
        <h2 id="accounts-heading">Accounts</h2>
        <UsersTable
          params={params}
          currentUserId={user?.id ?? ''}
          onParamsChange={(p) => {
            const next = new URLSearchParams();
            if (p.q) next.set('q', p.q);
            if (p.page > 1) next.set('page', String(p.page));
            setSearch(next);
          }}
        />
      </Card>
    </div>
  );
}

export function AdminOutboxPage() {
  return (
    <div className="space-y-6">
      <div>
        <h1>Outbox</h1>
        <p className="mt-1 max-w-2xl text-ink-muted">
          E-mails the development mail sink caught instead of sending: confirmations, password resets and cohort invitations. Shown as plain text.
        </p>
      </div>
      <AdminTabs />
      <OutboxList />
    </div>
  );
}
