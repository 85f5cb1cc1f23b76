import { Suspense, useState, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { NavLink, useNavigate } from 'react-router-dom';
import type { Account } from '@shared/schemas/auth';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { paths } from '@/config/paths';
import { useOutboxSummary } from '@/features/offline/outbox';
import { useAccountLanguage } from '@/i18n/use-account-language';
import { UnitsProvider } from '@/lib/units';
import { cn } from '@/lib/utils';
import { Logo } from './logo';

export interface NavItem {
  to: string;
  /** Key under `nav` in the common namespace. */
  label: 'home' | 'pots' | 'planner' | 'cohorts' | 'guides' | 'account' | 'admin';
  /** Roles that see the item; omitted: everyone signed in. */
  roles?: Account['role'][];
}

const navItems: NavItem[] = [
  { to: paths.home, label: 'home' },
  { to: paths.pots, label: 'pots' },
  { to: paths.planner, label: 'planner' },
  { to: paths.cohorts, label: 'cohorts' },
  { to: paths.guides, label: 'guides' },
  { to: paths.account, label: 'account' },
  { to: paths.admin, label: 'admin', roles: ['admin'] },
];

export function visibleNavItems(role: Account['role']) {
  return navItems.filter((i) => !i.roles || i.roles.includes(role));
}

export function AppShell({ user, onSignOut, children }: { user: Account; onSignOut: () => Promise<void>; children: ReactNode }) {
  const { t } = useTranslation();
  useAccountLanguage(user.language);
  const [open, setOpen] = useState(false);
  const navigate = useNavigate();
  const items = visibleNavItems(user.role);
  // Signing out clears this phone's cache, the outbox with it: ask first while records wait there.
  const outbox = useOutboxSummary();
  const unsent = outbox.waiting + outbox.refused;
  const [askSignOut, setAskSignOut] = useState(false);
  const [signingOut, setSigningOut] = useState(false);
  const doSignOut = async () => {
    setSigningOut(true);
    try {
      await onSignOut();
      navigate(paths.signIn);
    } finally {
      setSigningOut(false);
      setAskSignOut(false);
    }
  };
  const signOut = async () => {
    if (unsent > 0) setAskSignOut(true);
    else await doSignOut();
  };
  return (
    <div className="min-h-screen">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2">
        {t(($) => $.skipToContent)}
      </a>
      <header className="border-b border-sand-200 bg-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3 md:flex-nowrap">
          <NavLink to={paths.home} aria-label={t(($) => $.homeLink)}>
            <Logo />
          </NavLink>
          <button
            type="button"
            className="ml-auto min-h-11 rounded-lg border border-sand-300 px-4 py-2 text-sm font-medium md:hidden"
            aria-expanded={open}
            aria-controls="main-nav"
            onClick={() => setOpen((v) => !v)}
          >
            {t(($) => $.menu)}
          </button>
          <nav id="main-nav" aria-label={t(($) => $.mainNav)} className={cn('order-last basis-full md:order-none md:ml-6 md:flex md:basis-auto md:items-center', open ? 'block' : 'hidden md:flex')}>
            <ul className="flex flex-col gap-1 md:flex-row md:gap-1">
              {items.map((item) => (
                <li key={item.to}>
                  <NavLink
                    to={item.to}
                    end={item.to === paths.home}
                    onClick={() => setOpen(false)}
                    className={({ isActive }) =>
                      cn('block rounded-lg px-3 py-3 text-base font-medium md:py-2 md:text-sm', isActive ? 'bg-terracotta-50 text-terracotta-800' : 'text-ink-muted hover:bg-sand-100 hover:text-ink')
                    }
                  >
                    {t(($) => $.nav[item.label])}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
          <div className="hidden items-center gap-3 md:ml-auto md:flex">
            <span className="text-sm text-ink-muted">
              {user.displayName} <span className="rounded bg-sand-100 px-1.5 py-0.5 text-xs capitalize">{t(($) => $.roles[user.role])}</span>
            </span>
            <button type="button" className="text-sm font-medium text-terracotta-700 underline" onClick={() => void signOut()}>
              {t(($) => $.signOut)}
            </button>
          </div>
        </div>
        {open ? (
          <div className="border-t border-sand-200 px-4 py-2 md:hidden">
            <button type="button" className="min-h-11 text-base font-medium text-terracotta-700 underline" onClick={() => void signOut()}>
              {t(($) => $.signOutAs, { name: user.displayName })}
            </button>
          </div>
        ) : null}
      </header>
      <main id="main" className="mx-auto max-w-6xl px-4 py-6">
        <UnitsProvider system={user.unitSystem}>
          {/* A part of a page whose strings are still loading waits here, under the header, not blanking the app. */}
          <Suspense fallback={<p role="status">{t(($) => $.loading)}</p>}>{children}</Suspense>
        </UnitsProvider>
      </main>
      <ConfirmDialog
        open={askSignOut}
        title={t(($) => $.signOutUnsent.title, { count: unsent })}
        confirmLabel={t(($) => $.signOutUnsent.discard)}
        cancelLabel={t(($) => $.signOutUnsent.stay)}
        tone="danger"
        pending={signingOut}
        onConfirm={() => void doSignOut()}
        onCancel={() => setAskSignOut(false)}
      >
        <p>{t(($) => $.signOutUnsent.body)}</p>
      </ConfirmDialog>
    </div>
  );
}
