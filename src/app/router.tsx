import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, type LoaderFunctionArgs } from 'react-router-dom';
import type { Role } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { usersQueryOptions } from '@/features/admin/api/get-users';
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
import { AccountPage } from './routes/account';
import { AdminOutboxPage, AdminPage, usersParamsFrom } from './routes/admin';
import { ForgotPasswordPage, ResetPasswordPage, SignInPage, SignUpPage, VerifyEmailPage } from './routes/auth-pages';
import { CohortPage } from './routes/cohort';
import { GardenPage } from './routes/garden';
import { GuidesRoute } from './routes/guides';
import { NewGardenPage } from './routes/new-garden';
import { PlannerPage } from './routes/planner';
import { PotsPage } from './routes/pots';
import { RoundPage } from './routes/round';
import { TrialPage } from './routes/trial';
import { UnsubscribePage, unsubscribePath } from './routes/unsubscribe';
import { CohortsPage } from './routes/cohorts';
import { Loading, RedirectIfSignedIn, RequireAuth, ShellIfSignedIn } from './routes/guards';
import { HomePage } from './routes/home';
import { JoinPage } from './routes/join';
import { NotFoundPage } from './routes/not-found';
import { RouteErrorPage } from './routes/route-error';

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
      hydrateFallbackElement: <Loading />,
      errorElement: <RouteErrorPage />,
      children: [
        {
          element: <RedirectIfSignedIn />,
          children: [
            { path: paths.signIn, element: <SignInPage /> },
            { path: paths.signUp, element: <SignUpPage /> },
          ],
        },
        { path: paths.forgotPassword, element: <ForgotPasswordPage /> },
        { path: paths.resetPassword, element: <ResetPasswordPage /> },
        { path: paths.verifyEmail, element: <VerifyEmailPage /> },
        { path: unsubscribePath, element: <UnsubscribePage /> },
        {
          element: <ShellIfSignedIn />,
          children: [{ path: paths.joinCohort, element: <JoinPage /> }],
        },
        {
          element: <RequireAuth />,
          children: [
            {
              path: paths.home,
              element: <HomePage />,
              loader: prefetch(() => [ensure(cohortsQueryOptions()), ensure(gardensQueryOptions()), ensure(trialsQueryOptions())]),
            },
            { path: paths.newGarden, element: <NewGardenPage /> },
            {
              path: paths.garden(':gardenId'),
              element: <GardenPage />,
              loader: prefetch(({ params }) => [ensure(gardenQueryOptions(params.gardenId!)), ensure(trialsQueryOptions(params.gardenId!))]),
            },
            {
              path: paths.trial(':trialId'),
              element: <TrialPage />,
              loader: prefetch(({ params }) => [ensure(trialQueryOptions(params.trialId!)), ensure(plotsQueryOptions(params.trialId!)), ensure(trialAnalysisQueryOptions(params.trialId!))]),
            },
            {
              path: paths.round(':trialId'),
              element: <RoundPage />,
              loader: prefetch(({ params }) => [ensure(trialQueryOptions(params.trialId!)), ensure(roundQueryOptions(params.trialId!))]),
            },
            { path: paths.pots, element: <PotsPage />, loader: prefetch(() => [ensure(potsQueryOptions()), ensure(trialsQueryOptions())]) },
            { path: paths.planner, element: <PlannerPage />, loader: prefetch(() => [ensure(trialsQueryOptions()), ensure(potsQueryOptions())]) },
            { path: paths.guides, element: <GuidesRoute /> },
            { path: paths.account, element: <AccountPage /> },
            { path: paths.cohorts, element: <CohortsPage />, loader: prefetch(() => [ensure(cohortsQueryOptions())]) },
            {
              path: paths.cohort(':cohortId'),
              element: <CohortPage />,
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
              element: <AdminPage />,
              loader: prefetch(({ request }) => [ensure(healthQueryOptions()), ensure(usersQueryOptions(usersParamsFrom(new URL(request.url).searchParams)))], ['admin']),
            },
            { path: paths.adminOutbox, element: <AdminOutboxPage />, loader: prefetch(() => [ensure(outboxQueryOptions())], ['admin']) },
          ],
        },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
