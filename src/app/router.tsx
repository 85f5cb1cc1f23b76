import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter } from 'react-router-dom';
import { paths } from '@/config/paths';
import { sessionQueryOptions } from '@/features/auth/api/get-session';
import { ForgotPasswordPage, ResetPasswordPage, SignInPage, SignUpPage, VerifyEmailPage } from './routes/auth-pages';
import { RedirectIfSignedIn, RequireAuth } from './routes/guards';
import { HomePage } from './routes/home';
import { NotFoundPage } from './routes/not-found';

export function createAppRouter(queryClient: QueryClient) {
  const sessionLoader = async () => {
    await queryClient.ensureQueryData(sessionQueryOptions());
    return null;
  };
  return createBrowserRouter([
    {
      loader: sessionLoader,
      hydrateFallbackElement: <p className="p-8">Loading…</p>,
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
        {
          element: <RequireAuth />,
          children: [{ path: paths.home, element: <HomePage /> }],
        },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
