/**
 * Figure 4: log-entry writes through the API (POST /api/trials/:id/water-events, signed in, with
 * the CSRF token) driven by autocannon on loopback for a bounded time, against the same number of
 * single-row INSERTs straight into PostgreSQL over a pool of the app's size.
 */
import autocannon from 'autocannon';
import pg from 'pg';
import type { SessionClient } from '../lib/session-client';
import { r3, roundSummary, summarise, type Summary } from '../lib/stats';

export interface WritesFigure {
  connections: number;
  poolSize: number;
  durationS: number | null;
  amount: number | null;
  api: {
    requests: number;
    /** Requests sent, including those still in flight when the run stopped. */
    sent: number;
    ok: number;
    errors: number;
    non2xx: number;
    timeouts: number;
    requestsPerSecond: { mean: number; median: number; p2_5: number; p97_5: number; min: number; max: number };
    latencyMs: { p50: number; p90: number; p99: number; max: number };
    rowsWritten: number;
  };
  direct: { rows: number; seconds: number; rowsPerSecond: number; perSecond: Summary; latencyMs: Summary };
  /** API requests/s ÷ direct rows/s. */
  ratio: number;
}

export async function measureWrites(o: {
  client: SessionClient;
  databaseUrl: string;
  trialId: string;
  plotIds: string[];
  userId: string;
  connections: number;
  poolSize: number;
  durationS: number | null;
  amount: number | null;
}): Promise<WritesFigure> {
  const pool = new pg.Pool({ connectionString: o.databaseUrl, max: o.poolSize });
  const count = async () => Number(((await pool.query('SELECT count(*)::int AS n FROM water_events WHERE trial_id = $1', [o.trialId])).rows[0] as { n: number }).n);
  // Plots alternate olla, surface (see scenario.ts); the readings fall inside the running trial.
  const body = (i: number) => {
    const plot = i % o.plotIds.length;
    const day = 1 + (i % 28);
    return {
      plotId: o.plotIds[plot]!,
      occurredAt: `2026-11-${String(day).padStart(2, '0')}T${String(7 + (i % 10)).padStart(2, '0')}:${String(i % 60).padStart(2, '0')}:00Z`,
      kind: plot % 2 === 0 ? 'olla_refill' : 'surface',
      volumeL: plot % 2 === 0 ? 6.5 : 11.2,
      source: 'mains',
    };
  };
  try {
    const before = await count();
    let n = 0;
    const result = await autocannon({
      url: `${o.client.baseUrl}/api/trials/${o.trialId}/water-events`,
      method: 'POST',
      connections: o.connections,
      ...(o.amount ? { amount: o.amount } : { duration: o.durationS ?? 10 }),
      timeout: 10,
      headers: { cookie: o.client.cookie, 'x-csrf-token': o.client.csrf, 'content-type': 'application/json', accept: 'application/json' },
      requests: [{ setupRequest: (req) => ({ ...req, body: JSON.stringify(body(n++)) }) }],
    });
    const rowsWritten = (await count()) - before;
    const ok = result['2xx'];

    // The same number of rows, single-row INSERTs, as many in flight as autocannon had connections.
    const rows = Math.max(1, ok);
    const latencies: number[] = [];
    const completions: number[] = [];
    let next = 0;
    const t0 = performance.now();
    const worker = async () => {
      while (next < rows) {
        const i = next++;
        const b = body(i);
        const s = performance.now();
        await pool.query(
          `INSERT INTO water_events (trial_id, plot_id, entered_by, occurred_at, kind, volume_l, source, fertiliser, pot_id, notes)
           VALUES ($1, $2, $3, $4, $5, $6, $7, false, NULL, '') RETURNING id`,
          [o.trialId, b.plotId, o.userId, b.occurredAt, b.kind, b.volumeL, b.source],
        );
        const e = performance.now();
        latencies.push(e - s);
        completions.push(e - t0);
      }
    };
    await Promise.all(Array.from({ length: o.connections }, worker));
    const seconds = (performance.now() - t0) / 1000;
    // Per-second throughput samples (whole seconds only, like autocannon's).
    const buckets = new Map<number, number>();
    for (const c of completions) buckets.set(Math.floor(c / 1000), (buckets.get(Math.floor(c / 1000)) ?? 0) + 1);
    const whole = [...buckets.entries()].filter(([sec]) => sec < Math.floor(seconds)).map(([, v]) => v);
    const rowsPerSecond = rows / seconds;
    // Completed writes over the run's wall time, the same measure as the direct side's rows/s.
    const apiRate = ok / (result.duration || 1);
    return {
      connections: o.connections,
      poolSize: o.poolSize,
      durationS: o.amount ? null : (o.durationS ?? 10),
      amount: o.amount,
      api: {
        requests: result.requests.total,
        sent: result.requests.sent,
        ok,
        errors: result.errors,
        non2xx: result.non2xx,
        timeouts: result.timeouts,
        requestsPerSecond: {
          mean: r3(apiRate),
          median: r3(result.requests.p50),
          p2_5: r3(result.requests.p2_5),
          p97_5: r3(result.requests.p97_5),
          min: r3(result.requests.min),
          max: r3(result.requests.max),
        },
        latencyMs: { p50: result.latency.p50, p90: result.latency.p90, p99: result.latency.p99, max: result.latency.max },
        rowsWritten,
      },
      direct: { rows, seconds: r3(seconds), rowsPerSecond: r3(rowsPerSecond), perSecond: roundSummary(summarise(whole.length ? whole : [rowsPerSecond])), latencyMs: roundSummary(summarise(latencies)) },
      ratio: apiRate / rowsPerSecond,
    };
  } finally {
    await pool.end();
  }
}
