/** Every client URL, in one place. */
export const paths = {
  home: '/',
  signIn: '/sign-in',
  signUp: '/sign-up',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password',
  verifyEmail: '/verify-email',
  /** The unsubscribe link in every e-mail (the server writes `${publicUrl}/unsubscribe?token=…`). */
  unsubscribe: '/unsubscribe',
  account: '/account',
  guides: '/guides',
  admin: '/admin',
  adminOutbox: '/admin/outbox',
  cohorts: '/cohorts',
  cohort: (id: string) => `/cohorts/${id}`,
  joinCohort: '/join',
  newGarden: '/gardens/new',
  garden: (id: string) => `/gardens/${id}`,
  trial: (id: string) => `/trials/${id}`,
  round: (id: string) => `/trials/${id}/round`,
  pots: '/pots',
  planner: '/planner',
} as const;
