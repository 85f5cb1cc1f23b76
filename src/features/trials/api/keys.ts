import { queryRoots } from '@/lib/query-roots';

/** Query keys of the trial feature, built only here. */
export const trialKeys = {
  all: ['trials'] as const,
  lists: queryRoots.trialsList,
  list: (gardenId?: string) => ['trials', 'list', { gardenId }] as const,
  detail: (id: string) => ['trials', 'detail', id] as const,
  plots: (id: string) => ['trials', 'plots', id] as const,
  audit: (id: string) => ['trials', 'audit', id] as const,
  shares: (id: string) => ['trials', 'shares', id] as const,
  /** Other features' data that depends on a trial (analysis, logs, round). */
  dependents: (id: string) => [queryRoots.trialAnalysis(id), queryRoots.logs(id), queryRoots.round(id)] as const,
  gardens: ['gardens'] as const,
};
