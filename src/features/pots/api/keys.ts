import { queryRoots } from '@/lib/query-roots';

/** Query keys of the pot feature, built only here. */
export const potKeys = {
  all: queryRoots.pots,
  list: (trialId?: string) => [...queryRoots.pots, 'list', { trialId }] as const,
  /** The Round of a trial lists the pots in its plots, so a pot that moves refreshes it. */
  round: (trialId: string) => queryRoots.round(trialId),
};
