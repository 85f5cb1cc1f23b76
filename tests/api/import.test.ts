import { createHash } from 'node:crypto';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { guessMapping, normaliseRows, type ImportKind } from '@shared/import/csv-import';
import { makePairedTrial } from '../helpers/notebook-fixtures';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  t.clock.now = new Date('2026-09-30T12:00:00Z');
});
afterAll(async () => {
  await t.close();
});

async function grower() {
  const a = new ApiAgent(t.app);
  await a.signUp({ email: uniqueEmail() });
  return a;
}
const count = async (table: string, trialId: string) =>
  ((await t.ds.query(`SELECT count(*)::int AS n FROM ${table} WHERE trial_id = $1`, [trialId])) as { n: number }[])[0]!.n;

describe('POST /api/trials/:trialId/import', () => {
  it('writes nothing when one row is bad, and lists every problem with its line', async () => {
    const a = await grower();
    const { trial } = await makePairedTrial(a);
    const rows = [
      { line: 2, plotLabel: 'A1', occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 5 },
      { line: 3, plotLabel: 'Z9', occurredAt: '2026-06-02T07:00:00Z', kind: 'surface', volumeL: 5 },
      { line: 4, plotLabel: 'A1', occurredAt: '2026-06-03T07:00:00Z', kind: 'surface', volumeL: -1 },
      { line: 5, plotLabel: 'A1', occurredAt: '2025-06-03T07:00:00Z', kind: 'surface', volumeL: 3 },
    ];
    const res = await a.post(`/api/trials/${trial.id}/import`, { kind: 'water-events', rows });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/3 problems found: nothing was imported/);
    expect(res.body.error.details.total).toBe(3);
    expect(res.body.error.details.rows.map((r: { line: number }) => r.line)).toEqual([3, 4, 5]);
    // Every problem travels as a code the client words in the reader's language; a value the
    // record schema refuses carries zod's issue facts and the record's field as its column.
    expect(res.body.error).toMatchObject({ reason: 'import_rows_invalid', params: { count: 3 } });
    expect(res.body.error.details.rows.map((r: { code?: string }) => r.code)).toEqual(['unknownPlot', 'invalidValue', 'outsideTrial']);
    expect(res.body.error.details.rows[1]).toMatchObject({
      column: 'volumeL',
      reason: 'Volume must be more than zero.',
      issue: { code: 'too_small', origin: 'number', minimum: 0, inclusive: false },
    });
    expect(await count('water_events', trial.id)).toBe(0);
  });

  it('reports a re-imported file as already imported and adds nothing', async () => {
    const a = await grower();
    const { trial } = await makePairedTrial(a);
    const rows = Array.from({ length: 30 }, (_, i) => ({
      line: i + 2,
      plotLabel: i % 2 ? 'A1' : 'B1',
      occurredAt: `2026-06-${String((i % 28) + 1).padStart(2, '0')}T07:00:00Z`,
      kind: 'surface',
      volumeL: 4,
    }));
    // Two identical rows (same plot, same minute, same volume) are two records, not one.
    rows.push({ ...rows[0]!, line: 32 });
    const first = await a.post(`/api/trials/${trial.id}/import`, { kind: 'water-events', rows });
    expect(first.status).toBe(201);
    expect(first.body.data).toEqual({ received: 31, inserted: 31, alreadyImported: 0 });
    const again = await a.post(`/api/trials/${trial.id}/import`, { kind: 'water-events', rows });
    expect(again.status).toBe(200);
    expect(again.body.data).toEqual({ received: 31, inserted: 0, alreadyImported: 31 });
    expect(await count('water_events', trial.id)).toBe(31);
  });

  it('recognises rows imported by the earlier unnest-based version (same fingerprint), so they are not imported twice', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const a1 = plots.find((p) => p.label === 'A1')!;
    const rows = [
      { line: 2, plotLabel: 'A1', takenAt: '2026-06-01T07:00:00Z', method: 'vwc', depthCm: 15, value: 21.5 },
      { line: 3, plotLabel: 'A1', takenAt: '2026-06-01T08:00:00Z', method: 'vwc', depthCm: 15, value: 21.5 },
    ];
    // The key that version stored: sha256 of kind | the validated record as sorted [key, value] pairs | occurrence
    // number (server/services/import.service.ts at commit 14f1545, written out here as it was).
    const record = { plotId: a1.id, takenAt: '2026-06-01T07:00:00Z', method: 'vwc', depthCm: 15, value: 21.5 };
    const canonical = JSON.stringify(
      Object.keys(record)
        .sort()
        .map((k) => [k, record[k as keyof typeof record]]),
    );
    const oldKey = `imp_${createHash('sha256').update(`moisture-readings|${canonical}|1`).digest('hex').slice(0, 56)}`;
    await t.ds.query(
      `INSERT INTO moisture_readings (trial_id, plot_id, entered_by, idempotency_key, taken_at, method, depth_cm, value) VALUES ($1, $2, NULL, $3, '2026-06-01T07:00:00Z', 'vwc', 15, 21.5)`,
      [trial.id, a1.id, oldKey],
    );
    const res = await a.post(`/api/trials/${trial.id}/import`, { kind: 'moisture-readings', rows });
    expect(res.status).toBe(201);
    expect(res.body.data).toEqual({ received: 2, inserted: 1, alreadyImported: 1 });
    expect(await count('moisture_readings', trial.id)).toBe(2);
  });

  it('keeps tabs, line breaks and backslashes in notes exactly (they travel through COPY text format)', async () => {
    const a = await grower();
    const { trial } = await makePairedTrial(a);
    const notes = 'filled from the barrel\tthen\nthe hose \\N, "quoted"\r\nend';
    const res = await a.post(`/api/trials/${trial.id}/import`, {
      kind: 'water-events',
      rows: [{ line: 2, plotLabel: 'B2', occurredAt: '2026-06-01T07:00:00-06:00', kind: 'surface', volumeL: 5, notes }],
    });
    expect(res.status).toBe(201);
    const stored = (await t.ds.query('SELECT notes, occurred_at, source, fertiliser FROM water_events WHERE trial_id = $1', [trial.id])) as {
      notes: string;
      occurred_at: Date;
      source: string;
      fertiliser: boolean;
    }[];
    expect(stored).toHaveLength(1);
    expect(stored[0]!.notes).toBe(notes.trim());
    expect(stored[0]!.occurred_at.toISOString()).toBe('2026-06-01T13:00:00.000Z');
    // The schema's defaults (waterEventInputSchema) are what is stored for cells the file left out.
    expect(stored[0]!.source).toBe('mains');
    expect(stored[0]!.fertiliser).toBe(false);
  });

  it('imports weather days into the garden and reports the same days again as already imported', async () => {
    const a = await grower();
    const { trial, garden } = await makePairedTrial(a);
    const rows = [
      { line: 2, day: '2026-06-01', tMinC: 12.5, tMaxC: 29, rainMm: 0 },
      { line: 3, day: '2026-06-02', tMinC: 13, tMaxC: 31.5, rainMm: 2.4, rhMinPct: 18 },
    ];
    const first = await a.post(`/api/trials/${trial.id}/import`, { kind: 'weather-days', rows });
    expect(first.status).toBe(201);
    expect(first.body.data).toEqual({ received: 2, inserted: 2, alreadyImported: 0 });
    const again = await a.post(`/api/trials/${trial.id}/import`, { kind: 'weather-days', rows });
    expect(again.body.data).toEqual({ received: 2, inserted: 0, alreadyImported: 2 });
    const stored = (await t.ds.query(`SELECT day::text, t_max_c, rain_mm, rh_min_pct, wind_height_m FROM weather_days WHERE garden_id = $1 ORDER BY day`, [
      garden.id,
    ])) as unknown[];
    expect(stored).toEqual([
      { day: '2026-06-01', t_max_c: 29, rain_mm: 0, rh_min_pct: null, wind_height_m: 2 },
      { day: '2026-06-02', t_max_c: 31.5, rain_mm: 2.4, rh_min_pct: 18, wind_height_m: 2 },
    ]);
  });

  it('lists rows that are not records with their line, and writes nothing', async () => {
    const a = await grower();
    const { trial } = await makePairedTrial(a);
    const rows = [
      { line: 2, plotLabel: 'A1', occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 5 },
      null,
      ['A1', 'x'],
      { line: 5, plotLabel: { nested: true }, occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 5 },
      { line: 6, plotLabel: 'A1', occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 5, notes: 'a\u0000b' },
    ];
    const res = await a.post(`/api/trials/${trial.id}/import`, { kind: 'water-events', rows });
    expect(res.status).toBe(400);
    expect(res.body.error.details.rows.map((r: { line: number; column: string }) => [r.line, r.column])).toEqual([
      [3, ''],
      [4, ''],
      [5, 'plot'],
      [6, 'notes'],
    ]);
    expect(res.body.error.details.rows.map((r: { code?: string }) => r.code)).toEqual(['notRecord', 'notRecord', 'unknownPlot', 'nulCharacter']);
    expect(await count('water_events', trial.id)).toBe(0);
  });

  it('refuses other growers and closed trials', async () => {
    const a = await grower();
    const { trial } = await makePairedTrial(a);
    const b = await grower();
    const row = { plotLabel: 'A1', occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 5 };
    expect((await b.post(`/api/trials/${trial.id}/import`, { kind: 'water-events', rows: [row] })).status).toBe(404);
    await a.post(`/api/trials/${trial.id}/status`, { status: 'closed' });
    expect((await a.post(`/api/trials/${trial.id}/import`, { kind: 'water-events', rows: [row] })).status).toBe(409);
  });

  it('round trip: a trial exported and imported into a new trial gives the same analysis', async () => {
    const a = await grower();
    const src = await makePairedTrial(a, { title: 'Source' });
    let k = 0;
    for (const p of src.plots) {
      for (let d = 1; d <= 9; d++) {
        k += 1;
        await a.post(`/api/trials/${src.trial.id}/water-events`, {
          plotId: p.id,
          occurredAt: `2026-06-0${d}T0${d % 9}:15:00Z`,
          kind: p.treatment === 'olla' ? 'olla_refill' : 'surface',
          volumeL: p.treatment === 'olla' ? 3 + ((k * 7) % 5) / 2 : 8 + ((k * 3) % 7) / 3,
        });
      }
      await a.post(`/api/trials/${src.trial.id}/harvests`, { plotId: p.id, harvestedOn: '2026-08-01', freshKg: 1 + (k % 4) / 3, count: 5 });
      await a.post(`/api/trials/${src.trial.id}/moisture-readings`, {
        plotId: p.id,
        takenAt: '2026-06-05T08:00:00Z',
        method: 'vwc',
        depthCm: 15,
        value: 20 + (k % 6),
      });
    }
    // A new trial with the same plots and the same assignment.
    const dst = (await a.post(`/api/gardens/${src.garden.id}/trials`, { title: 'Copy', crop: 'tomato', plantingDate: '2026-05-01' })).body.data;
    for (const p of src.plots) await a.post(`/api/trials/${dst.id}/plots`, { label: p.label, blockKey: p.blockKey, areaM2: 2, treatment: p.treatment });
    await a.post(`/api/trials/${dst.id}/status`, { status: 'active' });

    for (const kind of ['water-events', 'harvests', 'moisture-readings'] as ImportKind[]) {
      const csv = (await a.get(`/api/trials/${src.trial.id}/export/${kind}.csv`)).text.replace(/^\uFEFF/, '');
      const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: true });
      const [headers, ...rows] = parsed.data as string[][];
      const { records, errors } = normaliseRows(rows, {
        kind,
        headers: headers!,
        mapping: guessMapping(headers!, kind),
        units: {},
        dateFormat: 'iso',
        timeZone: 'UTC',
      });
      expect(errors).toEqual([]);
      const res = await a.post(`/api/trials/${dst.id}/import`, { kind, rows: records });
      expect(res.body.error).toBeUndefined();
      expect(res.status).toBe(201);
    }
    const before = (await a.get(`/api/trials/${src.trial.id}/analysis`)).body.data;
    const after = (await a.get(`/api/trials/${dst.id}/analysis`)).body.data;
    // Ids differ between the trials; sums may differ in the last bits with summation order.
    const round = (v: unknown): unknown =>
      typeof v === 'number'
        ? Number(v.toPrecision(10))
        : Array.isArray(v)
          ? v.map(round)
          : v && typeof v === 'object'
            ? Object.fromEntries(Object.entries(v).map(([k, x]) => [k, round(x)]))
            : v;
    const strip = (x: { plots: { id: string }[]; waterDays: { plotId: string }[] }) =>
      round({ ...x, plots: x.plots.map(({ id: _id, ...rest }) => rest), waterDays: x.waterDays.map(({ plotId: _p, ...rest }) => rest) });
    expect(strip(after)).toEqual(strip(before));
    expect(before.comparisons[0].metrics.waterMm.kind).toBe('test');
  });
});
