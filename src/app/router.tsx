import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import { createBrowserRouter, type LoaderFunctionArgs } from 'react-router-dom';
import type { Role } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { i18n } from '@/i18n';
import { usersParamsFrom, usersQueryOptions } from '@/features/admin/api/get-users';
import { healthQueryOptions } from '@/features/admin/api/get-health';
import { outboxQueryOptions } from '@/features/admin/api/get-outbox';
import { sessionQueryOptions } from '@/features/auth/api/get-session';
import { cohortQueryOptions } from '@/features/cohorts/api/get-cohort';
import { cohortMembersQueryOptions } from '@/features/cohorts/api/get-cohort-members';
import { cohortsQueryOptions } from '@/features/cohorts/api/get-cohorts';
import { cohortResultsQueryOptions } from '@/features/cohort-results/api/get-cohort-results';
import { resultsQueryFromSearch } from '@/features/cohort-results/hooks/use-results-options';
import { trialAnalysisQueryOptions } from '@/features/analysis/api/get-trial-analysis';
import { gardenQueryOptions } from '@/features/gardens/api/get-garden';
import { gardensQueryOptions } from '@/features/gardens/api/get-gardens';
import { roundQueryOptions } from '@/features/round/api/get-round';
import { potsQueryOptions } from '@/features/pots/api/get-pots';
import { plotsQueryOptions } from '@/features/trials/api/get-plots';
import { trialQueryOptions } from '@/features/trials/api/get-trial';
import { trialsQueryOptions } from '@/features/trials/api/get-trials';
import { SignInPage } from './routes/sign-in';
import { Loading, RedirectIfSignedIn, RequireAuth, ShellIfSignedIn } from './routes/guards';
import { NotFoundPage } from './routes/not-found';
import { RootLayout } from './routes/root-layout';
import { RouteErrorPage } from './routes/route-error';

/**
 * A page loaded on first use (its own chunk, with its feature code): `lazy` for React Router.
 * Only the public pages, the guards and the error pages ship with the first page; every signed-in
 * page is fetched when someone goes there (the service worker precaches the chunks for offline use,
 * vite.config.ts). While one loads, the current page stays up under RootLayout's progress bar.
 */
const lazyPage =
  <M,>(load: () => Promise<M>, pick: (m: M) => ComponentType, namespaces: string[] = []) =>
  async () => {
    // The page's strings come with its code: a namespace first asked for during render would
    // suspend the whole app (one boundary, in app.tsx) and blank the page for a moment.
    const [m] = await Promise.all([load().catch(reloadOnceForNewBuild), i18n.loadNamespaces(namespaces)]);
    return { Component: pick(m) };
  };

const RELOADED_FLAG = 'seepwise.chunk-reload';

/**
 * A page's chunk did not load. After a new release the old build's chunks are gone from the server
 * and the service worker's cache, so a tab opened before it asks for files that no longer exist:
 * one reload picks up the new build. If it fails again (offline and never cached, a real fault),
 * the error goes to the route error page.
 */
function reloadOnceForNewBuild(err: unknown): never {
  try {
    const last = Number(sessionStorage.getItem(RELOADED_FLAG)) || 0;
    if (Date.now() - last > 30_000) {
      sessionStorage.setItem(RELOADED_FLAG, String(Date.now()));
      window.location.reload();
    }
  } catch {
    /* no sessionStorage: show the error */
  }
  throw err;
}

export function createAppRouter(queryClient: QueryClient) {
  const sessionLoader = async () => {
    await queryClient.ensureQueryData(sessionQueryOptions());
    return null;
  };

  /**
   * Starts a page's data before it renders, for signed-in callers with the right role. A failure
   * is left in the query cache for the page to explain (not found, no access), never thrown here.
   */
  const prefetch =
    (load: (args: LoaderFunctionArgs) => Promise<unknown>[], roles?: Role[]) =>
    async (args: LoaderFunctionArgs) => {
      const session = await queryClient.ensureQueryData(sessionQueryOptions());
      const role = session.user?.role;
      if (!role || (roles && !roles.includes(role))) return null;
      await Promise.all(load(args).map((p) => p.catch(() => undefined)));
      return null;
    };
  const ensure = queryClient.ensureQueryData.bind(queryClient);

  return createBrowserRouter([
    {
      loader: sessionLoader,
      element: <RootLayout />,
      hydrateFallbackElement: <Loading />,
      errorElement: <RouteErrorPage />,
      children: [
        {
          element: <RedirectIfSignedIn />,
          children: [
            { path: paths.signIn, element: <SignInPage /> },
            { path: paths.signUp, lazy: lazyPage(() => import('./routes/auth-pages'), (m) => m.SignUpPage, ['auth']) },
          ],
        },
        { path: paths.forgotPassword, lazy: lazyPage(() => import('./routes/auth-pages'), (m) => m.ForgotPasswordPage, ['auth']) },
        { path: paths.resetPassword, lazy: lazyPage(() => import('./routes/auth-pages'), (m) => m.ResetPasswordPage, ['auth']) },
        { path: paths.verifyEmail, lazy: lazyPage(() => import('./routes/auth-pages'), (m) => m.VerifyEmailPage, ['auth']) },
        { path: paths.unsubscribe, lazy: lazyPage(() => import('./routes/unsubscribe'), (m) => m.UnsubscribePage, ['notifications']) },
        {
          element: <ShellIfSignedIn />,
          children: [{ path: paths.joinCohort, lazy: lazyPage(() => import('./routes/join'), (m) => m.JoinPage, ['cohorts', 'auth']) }],
        },
        {
          element: <RequireAuth />,
          children: [
            {
              path: paths.home,
              lazy: lazyPage(() => import('./routes/home'), (m) => m.HomePage, ['home', 'trials', 'gardens', 'cohorts', 'notifications']),
              loader: prefetch(() => [ensure(cohortsQueryOptions()), ensure(gardensQueryOptions()), ensure(trialsQueryOptions())]),
            },
            { path: paths.newGarden, lazy: lazyPage(() => import('./routes/new-garden'), (m) => m.NewGardenPage, ['gardens']) },
            {
              path: paths.garden(':gardenId'),
              lazy: lazyPage(() => import('./routes/garden'), (m) => m.GardenPage, ['gardens', 'trials', 'logs', 'charts', 'notifications']),
              loader: prefetch(({ params }) => [ensure(gardenQueryOptions(params.gardenId!)), ensure(trialsQueryOptions(params.gardenId!))]),
            },
            {
              path: paths.trial(':trialId'),
              lazy: lazyPage(() => import('./routes/trial'), (m) => m.TrialPage, ['trials', 'logs', 'analysis', 'charts', 'import', 'gardens', 'pots', 'round']),
              loader: prefetch(({ params }) => [ensure(trialQueryOptions(params.trialId!)), ensure(plotsQueryOptions(params.trialId!)), ensure(trialAnalysisQueryOptions(params.trialId!))]),
            },
            {
              path: paths.round(':trialId'),
              lazy: lazyPage(() => import('./routes/round'), (m) => m.RoundPage, ['round', 'trials', 'logs']),
              loader: prefetch(({ params }) => [ensure(trialQueryOptions(params.trialId!)), ensure(roundQueryOptions(params.trialId!))]),
            },
            { path: paths.pots, lazy: lazyPage(() => import('./routes/pots'), (m) => m.PotsPage, ['pots', 'trials', 'charts']), loader: prefetch(() => [ensure(potsQueryOptions()), ensure(trialsQueryOptions())]) },
            { path: paths.planner, lazy: lazyPage(() => import('./routes/planner'), (m) => m.PlannerPage, ['planner', 'pots', 'trials']), loader: prefetch(() => [ensure(trialsQueryOptions()), ensure(potsQueryOptions())]) },
            { path: paths.guides, lazy: lazyPage(() => import('./routes/guides'), (m) => m.GuidesRoute, ['guides']) },
            { path: paths.account, lazy: lazyPage(() => import('./routes/account'), (m) => m.AccountPage, ['account', 'auth', 'notifications']) },
            { path: paths.cohorts, lazy: lazyPage(() => import('./routes/cohorts'), (m) => m.CohortsPage, ['cohorts']), loader: prefetch(() => [ensure(cohortsQueryOptions())]) },
            {
              path: paths.cohort(':cohortId'),
              lazy: lazyPage(() => import('./routes/cohort'), (m) => m.CohortPage, ['cohorts', 'cohortResults', 'charts', 'pots', 'gardens', 'analysis']),
              loader: prefetch(({ params, request }) => {
                // The pooled results start with the page but are not awaited: they may take longer than the cohort itself.
                void queryClient.prefetchQuery(cohortResultsQueryOptions(params.cohortId!, resultsQueryFromSearch(new URL(request.url).searchParams)));
                return [ensure(cohortQueryOptions(params.cohortId!)), ensure(cohortMembersQueryOptions(params.cohortId!))];
              }),
            },
          ],
        },
        {
          element: <RequireAuth roles={['admin']} />,
          children: [
            {
              path: paths.admin,
              lazy: lazyPage(() => import('./routes/admin'), (m) => m.AdminPage, ['admin']),
              loader: prefetch(({ request }) => [ensure(healthQueryOptions()), ensure(usersQueryOptions(usersParamsFrom(new URL(request.url).searchParams)))], ['admin']),
            },
            { path: paths.adminOutbox, lazy: lazyPage(() => import('./routes/admin'), (m) => m.AdminOutboxPage, ['admin']), loader: prefetch(() => [ensure(outboxQueryOptions())], ['admin']) },
          ],
        },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
