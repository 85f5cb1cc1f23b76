import type { ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { LanguageSwitch } from '@/i18n/language-switch';
import { Logo } from './logo';

/** Centered card layout for sign-in, sign-up and reset pages. */
export function PublicLayout({ title, intro, children }: { title: string; intro?: ReactNode; children: ReactNode }) {
  const { t } = useTranslation();
  return (
    <div className="flex min-h-screen flex-col items-center bg-sand-100 px-4 py-10">
      <div className="mb-8 flex w-full max-w-md flex-wrap items-center justify-between gap-3">
        <Link to={paths.home} aria-label={t(($) => $.homeLink)}>
          <Logo />
        </Link>
        <LanguageSwitch />
      </div>
      <main className="w-full max-w-md rounded-card border border-sand-200 bg-white p-6 shadow-sm sm:p-8">
        <h1 className="mb-2">{title}</h1>
        {intro ? <div className="mb-6 text-ink-muted">{intro}</div> : null}
        {children}
      </main>
      <p className="mt-8 max-w-md text-center text-sm text-ink-muted">
        {t(($) => $.publicTagline)}
      </p>
    </div>
  );
}
