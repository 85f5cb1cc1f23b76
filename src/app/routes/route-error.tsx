import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { paths } from '@/config/paths';

/** Shown when a page fails to load in a way the page itself could not handle. */
export function RouteErrorPage() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : 'Unknown error';
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1>Something went wrong</h1>
      <p className="mt-2 text-ink-muted">This page could not be shown. Reload to try again; nothing you saved is lost.</p>
      <p className="mt-2 text-sm text-ink-faint">{message}</p>
      <Link className="mt-4 inline-block text-terracotta-700 underline" to={paths.home}>
        Go home
      </Link>
    </main>
  );
}
