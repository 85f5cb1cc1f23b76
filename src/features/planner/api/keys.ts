import { queryRoots } from '@/lib/query-roots';

/** Query keys of the planner, built only here. */
export const plannerKeys = {
  /** The trial's analysis, shared with the Results tab (same request, same cache entry). */
  trialAnalysis: (trialId: string) => queryRoots.trialAnalysis(trialId),
};
