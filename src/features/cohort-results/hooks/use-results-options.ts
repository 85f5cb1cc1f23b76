import { useCallback, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { CohortResultsQuery, EffectKey } from '@shared/schemas/cohort-results';

/**
 * The effect names, checked complete against the schema's type. Not imported as a value: the
 * router reads this module eagerly, and the schema module would bring zod into the first page.
 */
const EFFECTS: Record<EffectKey, true> = { waterLogRatio: true, wueLogRatio: true, harvestPerPlantDiff: true };

/**
 * The results options live in the page address (?method=REML&excludeFlagged=true&measure=…), so
 * a lead can send a class the exact view they discussed.
 */
export function resultsQueryFromSearch(sp: URLSearchParams): CohortResultsQuery {
  return {
    method: sp.get('method') === 'REML' ? 'REML' : 'DL',
    confidence: 0.95,
    includeSinglePairs: sp.get('includeSinglePairs') === 'true',
    excludeFlagged: sp.get('excludeFlagged') === 'true',
  };
}

export function measureFromSearch(sp: URLSearchParams): EffectKey {
  const m = sp.get('measure');
  return Object.hasOwn(EFFECTS, m ?? '') ? (m as EffectKey) : 'waterLogRatio';
}

export interface ResultsOptionsPatch {
  method?: CohortResultsQuery['method'];
  includeSinglePairs?: boolean;
  excludeFlagged?: boolean;
  measure?: EffectKey;
}

function apply(sp: URLSearchParams, patch: ResultsOptionsPatch): URLSearchParams {
  const next = new URLSearchParams(sp);
  const put = (key: string, value: string, fallback: string) => (value === fallback ? next.delete(key) : next.set(key, value));
  if (patch.method) put('method', patch.method, 'DL');
  if (patch.includeSinglePairs !== undefined) put('includeSinglePairs', String(patch.includeSinglePairs), 'false');
  if (patch.excludeFlagged !== undefined) put('excludeFlagged', String(patch.excludeFlagged), 'false');
  if (patch.measure) put('measure', patch.measure, 'waterLogRatio');
  return next;
}

export function useResultsOptions() {
  const [sp, setSp] = useSearchParams();
  const key = sp.toString();
  // The address changes only after the router has run the page's loader. Until then the switches
  // show the reader's click from this pending copy; any change of the address replaces it.
  const [pending, setPending] = useState<{ base: string; params: URLSearchParams } | null>(null);
  if (pending && pending.base !== key) setPending(null);
  const current = pending && pending.base === key ? pending.params : sp;
  const query = useMemo(() => resultsQueryFromSearch(current), [current]);
  const measure = measureFromSearch(current);
  const set = useCallback(
    (patch: ResultsOptionsPatch) => {
      const next = apply(current, patch);
      setPending({ base: key, params: next });
      setSp(next, { replace: true, preventScrollReset: true });
    },
    [current, key, setSp],
  );
  return { query, measure, set };
}
