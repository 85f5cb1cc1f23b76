import { useTranslation } from 'react-i18next';
import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { paths } from '@/config/paths';

/** Shown when a page fails to load in a way the page itself could not handle. */
export function RouteErrorPage() {
  const { t } = useTranslation();
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : '';
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1>{t(($) => $.errorPage.title)}</h1>
      <p className="mt-2 text-ink-muted">{t(($) => $.errorPage.body)}</p>
      {message ? <p className="mt-2 text-sm text-ink-muted">{message}</p> : null}
      <Link className="mt-4 inline-block text-terracotta-700 underline" to={paths.home}>
        {t(($) => $.errorPage.home)}
      </Link>
    </main>
  );
}
