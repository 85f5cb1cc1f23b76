/**
 * Key roots shared across features, for invalidation only: a log written in one feature must
 * refresh another feature's trial analysis and Round. Each feature still builds its full keys
 * from these roots in its own factory.
 */
export const queryRoots = {
  trialAnalysis: (trialId: string) => ['analysis', 'trial', trialId] as const,
  round: (trialId: string) => ['round', trialId] as const,
  logs: (trialId: string) => ['logs', trialId] as const,
  trialsList: ['trials', 'list'] as const,
  pots: ['pots'] as const,
};
