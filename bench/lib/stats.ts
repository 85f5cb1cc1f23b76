/** Summary statistics for repeated measurements. Percentiles interpolate linearly between ranks. */

export interface Summary {
  n: number;
  median: number;
  p95: number;
  p99: number;
  q1: number;
  q3: number;
  min: number;
  max: number;
  mean: number;
}

export function percentile(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  if (sorted.length === 1) return sorted[0]!;
  const rank = (p / 100) * (sorted.length - 1);
  const lo = Math.floor(rank);
  const hi = Math.ceil(rank);
  return sorted[lo]! + (sorted[hi]! - sorted[lo]!) * (rank - lo);
}

export function summarise(values: readonly number[]): Summary {
  const s = [...values].sort((a, b) => a - b);
  return {
    n: s.length,
    median: percentile(s, 50),
    p95: percentile(s, 95),
    p99: percentile(s, 99),
    q1: percentile(s, 25),
    q3: percentile(s, 75),
    min: s[0] ?? Number.NaN,
    max: s[s.length - 1] ?? Number.NaN,
    mean: s.reduce((a, b) => a + b, 0) / (s.length || 1),
  };
}

/** Rounds for the report: three significant digits, never exponent notation. */
export function r3(v: number): number {
  if (!Number.isFinite(v) || v === 0) return v;
  const digits = Math.max(0, 2 - Math.floor(Math.log10(Math.abs(v))));
  return Number(v.toFixed(Math.min(digits, 6)));
}

export function roundSummary(s: Summary): Summary {
  return Object.fromEntries(Object.entries(s).map(([k, v]) => [k, k === 'n' ? v : r3(v)])) as unknown as Summary;
}
