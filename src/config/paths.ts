/** Every client URL, in one place. */
export const paths = {
  home: '/',
  signIn: '/sign-in',
  signUp: '/sign-up',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password',
  verifyEmail: '/verify-email',
  account: '/account',
  guides: '/guides',
  admin: '/admin',
  adminOutbox: '/admin/outbox',
  cohorts: '/cohorts',
  cohort: (id: string) => `/cohorts/${id}`,
  joinCohort: '/join',
} as const;
