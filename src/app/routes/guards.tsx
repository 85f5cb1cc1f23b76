import { useTranslation } from 'react-i18next';
import { Navigate, Outlet, useLocation, useSearchParams } from 'react-router-dom';
import type { Account } from '@shared/schemas/auth';
import { AppShell } from '@/components/layout/app-shell';
import { paths } from '@/config/paths';
import { useSignOut } from '@/features/auth/api/auth-mutations';
import { useSession } from '@/features/auth/api/get-session';
import { safeNext } from '@/lib/safe-next';
import { SESSION_EXPIRED_FLAG } from '../query-client';

/** Also the router's fallback while the first page's data loads. */
export function Loading() {
  const { t } = useTranslation();
  return (
    <p role="status" className="p-8 text-ink-muted">
      {t(($) => $.loading)}
    </p>
  );
}

function NotAvailable({ roles }: { roles: Account['role'][] }) {
  const { t, i18n } = useTranslation();
  const list = new Intl.ListFormat(i18n.resolvedLanguage, { type: 'disjunction' }).format(roles.map((r) => t(($) => $.roles[r])));
  return (
    <>
      <h1>{t(($) => $.notAvailable.title)}</h1>
      <p className="mt-2 text-ink-muted">{t(($) => $.notAvailable.body, { roles: list })}</p>
    </>
  );
}

/** Signed-in pages: redirects to sign-in (remembering where to come back) when there is no session. */
export function RequireAuth({ roles }: { roles?: Account['role'][] }) {
  const session = useSession();
  const location = useLocation();
  const signOut = useSignOut();
  if (session.isPending) return <Loading />;
  const user = session.data?.user;
  if (!user) {
    const expired = sessionStorage.getItem(SESSION_EXPIRED_FLAG) === '1';
    const next = encodeURIComponent(location.pathname + location.search);
    return <Navigate to={`${paths.signIn}?next=${next}${expired ? '&reason=expired' : ''}`} replace />;
  }
  if (roles && !roles.includes(user.role)) {
    return (
      <AppShell user={user} onSignOut={() => signOut.mutateAsync().then(() => undefined)}>
        <NotAvailable roles={roles} />
      </AppShell>
    );
  }
  return (
    <AppShell user={user} onSignOut={() => signOut.mutateAsync().then(() => undefined)}>
      <Outlet />
    </AppShell>
  );
}

/**
 * Sign-in and sign-up pages: a signed-in visitor goes on to `next` (or home). Signing in or up on
 * this page lands here too, so both roads must lead to the same place.
 */
export function RedirectIfSignedIn() {
  const session = useSession();
  const [params] = useSearchParams();
  if (session.isPending) return <Loading />;
  if (session.data?.user) return <Navigate to={safeNext(params.get('next'))} replace />;
  return <Outlet />;
}

/** Pages open to everyone (the join page): inside the app shell when signed in, bare otherwise. */
export function ShellIfSignedIn() {
  const session = useSession();
  const signOut = useSignOut();
  if (session.isPending) return <Loading />;
  const user = session.data?.user;
  if (!user) return <Outlet />;
  return (
    <AppShell user={user} onSignOut={() => signOut.mutateAsync().then(() => undefined)}>
      <Outlet />
    </AppShell>
  );
}
