import { useTranslation } from 'react-i18next';
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
  const { t } = useTranslation('admin');
  const tab = ({ isActive }: { isActive: boolean }) =>
    cn('inline-flex min-h-11 items-center rounded-lg px-4 text-sm font-medium', isActive ? 'bg-terracotta-50 text-terracotta-800' : 'text-ink-muted hover:bg-sand-100 hover:text-ink');
  return (
    <nav aria-label={t(($) => $.sections)} className="flex gap-1 border-b border-sand-200 pb-2">
      <NavLink to={paths.admin} end className={tab}>
        {t(($) => $.tabAccounts)}
      </NavLink>
      <NavLink to={paths.adminOutbox} className={tab}>
        {t(($) => $.tabOutbox)}
      </NavLink>
    </nav>
  );
}

export function AdminPage() {
  const { t } = useTranslation('admin');
  const user = useCurrentUser();
  const [search, setSearch] = useSearchParams();
  const params = usersParamsFrom(search);
  return (
    <div className="space-y-6">
      <div>
        <h1>{t(($) => $.title)}</h1>
        <p className="mt-1 text-ink-muted">{t(($) => $.intro)}</p>
      </div>
      <AdminTabs />
      <HealthCard />
      <Card role="region" aria-labelledby="accounts-heading" className="space-y-4">
        <h2 id="accounts-heading">{t(($) => $.accounts)}</h2>
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
  const { t } = useTranslation('admin');
  return (
    <div className="space-y-6">
      <div>
        <h1>{t(($) => $.outbox.title)}</h1>
        <p className="mt-1 max-w-2xl text-ink-muted">
          {t(($) => $.outbox.intro)}
        </p>
      </div>
      <AdminTabs />
      <OutboxList />
    </div>
  );
}
