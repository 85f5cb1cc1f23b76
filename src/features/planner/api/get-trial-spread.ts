import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TrialAnalysis } from '@shared/analysis/trial-analysis';
import { api } from '@/lib/api-client';
import { plannerKeys } from './keys';

type AnalysisResponse = TrialAnalysis & { asOf: string };

/** What a finished (or running) trial says about the spread of its pair differences in water. */
export type TrialSpread =
  | {
      kind: 'spread';
      treatment: string;
      control: string;
      pairs: number;
      /** Standard deviation of the pair differences in water applied, mm. */
      sdMm: number;
      /** Mean of the control plots' water over the pairs, mm (to turn the spread into a share). */
      controlMeanMm: number;
    }
  /** Why there is none, as a code the screen words in the reader's language (`detail`: the analysis's own reason). */
  | { kind: 'none'; reason: 'noPair' | 'notTestable' | 'noSpread'; detail?: string };

export function spreadFromAnalysis(a: AnalysisResponse): TrialSpread {
  const c = a.comparisons[0];
  if (!c) return { kind: 'none', reason: 'noPair' };
  const m = c.metrics.waterMm;
  if (m.kind !== 'test') return { kind: 'none', reason: 'notTestable', detail: m.reason };
  if (!(m.result.sdDifference > 0)) return { kind: 'none', reason: 'noSpread' };
  const controlMeanMm = c.pairs.length ? c.pairs.reduce((s, p) => s + p.waterMm[1], 0) / c.pairs.length : 0;
  return { kind: 'spread', treatment: c.treatment, control: c.control, pairs: m.n, sdMm: m.result.sdDifference, controlMeanMm };
}

export const getTrialAnalysis = (trialId: string) => api.get<AnalysisResponse>(`/api/trials/${trialId}/analysis`);

export const trialSpreadQueryOptions = (trialId: string) =>
  queryOptions({ queryKey: plannerKeys.trialAnalysis(trialId), queryFn: () => getTrialAnalysis(trialId), select: spreadFromAnalysis });

export function useTrialSpread(trialId: string | null) {
  return useQuery({ ...trialSpreadQueryOptions(trialId ?? ''), enabled: Boolean(trialId) });
}
