/**
 * Days are the garden's days: a garden has an IANA time zone, and every daily bucket and every
 * "today" uses it.
 *
 * Offsets are from the IANA tz database (tzdata; the same rules ship with ICU in Node and with the
 * system zoneinfo PostgreSQL reads): America/Los_Angeles keeps Pacific Daylight Time, UTC−7, from
 * the second Sunday of March to the first Sunday of November (US rule since 2007), so in June
 * 2026-06-02T03:00:00Z is 2026-06-01 20:00 there. America/Denver keeps Mountain Daylight Time,
 * UTC−6, over the same dates.
 */
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cumulativePoints, type PlotWaterDays } from '@shared/analysis/trial-analysis';
import { guessMapping, normaliseRows } from '@shared/import/csv-import';
import { canonicalTimeZone } from '@shared/time-zone';
import { makePairedTrial } from '../helpers/notebook-fixtures';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const parse = (text: string) => Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });

async function grower() {
  const a = new ApiAgent(t.app);
  await a.signUp({ email: uniqueEmail('tz') });
  return a;
}

const gardenBody = { name: 'Shade bed', latitudeDeg: 34.1, longitudeDeg: -118.2, elevationM: 90, soilTexture: 'loam' };

describe('the garden time zone', () => {
  it('is stored as given, spelled as Intl spells it, and UTC when left out', async () => {
    const a = await grower();
    const la = await a.post('/api/gardens', { ...gardenBody, timeZone: 'America/Los_Angeles' });
    expect(la.status).toBe(201);
    expect(la.body.data.timeZone).toBe('America/Los_Angeles');
    const [row] = (await t.ds.query('SELECT time_zone FROM gardens WHERE id = $1', [la.body.data.id])) as { time_zone: string }[];
    expect(row!.time_zone).toBe('America/Los_Angeles');

    const plain = await a.post('/api/gardens', gardenBody);
    expect(plain.body.data.timeZone).toBe('UTC');

    // IANA names are matched without regard to case (tz database Theory file); stored in the database's spelling.
    const lower = await a.post('/api/gardens', { ...gardenBody, timeZone: 'america/denver' });
    expect(lower.status).toBe(201);
    expect(lower.body.data.timeZone).toBe('America/Denver');

    const edited = await a.patch(`/api/gardens/${plain.body.data.id}`, { timeZone: 'Europe/Madrid' });
    expect(edited.status).toBe(200);
    expect(edited.body.data.timeZone).toBe('Europe/Madrid');
    // A PATCH naming another field leaves the zone alone.
    const renamed = await a.patch(`/api/gardens/${plain.body.data.id}`, { name: 'Renamed' });
    expect(renamed.body.data.timeZone).toBe('Europe/Madrid');
  });

  it('refuses a name that is not a zone with 400 and the reason unknown_time_zone, writing nothing', async () => {
    const a = await grower();
    const before = (await t.ds.query('SELECT count(*)::int AS n FROM gardens')) as { n: number }[];
    for (const timeZone of ['Mars/Olympus_Mons', '+02:00', 'UTC+3', '']) {
      const res = await a.post('/api/gardens', { ...gardenBody, timeZone });
      expect(res.status, timeZone).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      const detail = (res.body.error.details as { path: string; reason?: string }[]).find((d) => d.path === 'timeZone');
      expect(detail, timeZone).toBeDefined();
      if (timeZone !== '') expect(detail!.reason).toBe('unknown_time_zone');
    }
    const g = (await a.post('/api/gardens', gardenBody)).body.data;
    const patch = await a.patch(`/api/gardens/${g.id}`, { timeZone: 'Nowhere/Special' });
    expect(patch.status).toBe(400);
    expect(patch.body.error.details[0]).toMatchObject({ path: 'timeZone', reason: 'unknown_time_zone' });
    const after = (await t.ds.query('SELECT count(*)::int AS n FROM gardens')) as { n: number }[];
    expect(after[0]!.n).toBe(before[0]!.n + 1);
    expect((await a.get(`/api/gardens/${g.id}`)).body.data.timeZone).toBe('UTC');
  });

  it('refuses cleanly (400, not 500) a name Node knows and PostgreSQL does not', async () => {
    // ICU still lists the old SystemV/* zones; the tz database dropped them in 2020b, so the system
    // zoneinfo PostgreSQL reads has none. Both facts are checked here rather than assumed.
    const name = 'SystemV/AST4';
    expect(canonicalTimeZone(name)).toBe(name);
    expect(await t.ds.query('SELECT 1 FROM pg_timezone_names WHERE name = $1', [name])).toEqual([]);
    const a = await grower();
    const res = await a.post('/api/gardens', { ...gardenBody, timeZone: name });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', reason: 'unknown_time_zone' });
    expect(res.body.error.details).toEqual([{ path: 'timeZone', message: expect.any(String), reason: 'unknown_time_zone' }]);
    expect(await t.ds.query(`SELECT 1 FROM gardens WHERE time_zone = $1`, [name])).toEqual([]);
  });
});

describe("days are the garden's days", () => {
  /** A refill at 2026-06-02T03:00:00Z: 20:00 on 1 June in Los Angeles (PDT, UTC−7), 03:00 on 2 June in a UTC garden. */
  const refillAt = '2026-06-02T03:00:00Z';

  async function refilled(timeZone: string) {
    const a = await grower();
    const f = await makePairedTrial(a, { timeZone });
    const olla = f.plots.find((p) => p.treatment === 'olla')!;
    const res = await a.post(`/api/trials/${f.trial.id}/water-events`, { plotId: olla.id, potId: f.pots[0]!.id, occurredAt: refillAt, kind: 'olla_refill', volumeL: 6 });
    expect(res.status).toBe(201);
    return { a, f, olla };
  }

  for (const [timeZone, day] of [
    ['America/Los_Angeles', '2026-06-01'],
    ['UTC', '2026-06-02'],
  ] as const) {
    it(`a refill at ${refillAt} counts on ${day} in a garden in ${timeZone}: analysis, export, record list`, async () => {
      t.clock.now = new Date('2026-06-20T12:00:00Z');
      const { a, f, olla } = await refilled(timeZone);

      const analysis = await a.get(`/api/trials/${f.trial.id}/analysis`);
      expect(analysis.status).toBe(200);
      const series = (analysis.body.data.waterDays as PlotWaterDays[]).find((s) => s.plotId === olla.id)!;
      expect(cumulativePoints(series)).toEqual([[day, 6]]);

      const csv = parse((await a.get(`/api/trials/${f.trial.id}/export/water-events.csv`)).text);
      expect(csv.data).toHaveLength(1);
      expect(csv.data[0]!.occurred_at).toBe('2026-06-02T03:00:00Z');
      expect(csv.data[0]!.day).toBe(day);

      // The record list's from/to are the garden's days too.
      const onDay = await a.get(`/api/trials/${f.trial.id}/water-events?from=${day}&to=${day}`);
      expect(onDay.body.data).toHaveLength(1);
      const other = day === '2026-06-01' ? '2026-06-02' : '2026-06-01';
      const offDay = await a.get(`/api/trials/${f.trial.id}/water-events?from=${other}&to=${other}`);
      expect(offDay.body.data).toHaveLength(0);
    });
  }

  it('moisture readings are averaged per garden day too', async () => {
    t.clock.now = new Date('2026-06-20T12:00:00Z');
    const a = await grower();
    const f = await makePairedTrial(a, { timeZone: 'America/Los_Angeles' });
    for (const p of f.plots) {
      const res = await a.post(`/api/trials/${f.trial.id}/moisture-readings`, { plotId: p.id, takenAt: refillAt, method: 'vwc', depthCm: 15, value: 20 });
      expect(res.status).toBe(201);
    }
    const analysis = await a.get(`/api/trials/${f.trial.id}/analysis`);
    const series = analysis.body.data.moisture.series as { day: string; treatment: string; method: string; value: number }[];
    expect(series.map((x) => x.day)).toEqual(['2026-06-01', '2026-06-01']);
    const csv = parse((await a.get(`/api/trials/${f.trial.id}/export/moisture-readings.csv`)).text);
    expect(new Set(csv.data.map((r) => r.day))).toEqual(new Set(['2026-06-01']));
  });

  it('"within the trial" uses the garden\'s day and its tomorrow, across midnight', async () => {
    // Planted 2 June; at 2026-06-02T05:00Z it is still 22:00 on 1 June in Los Angeles (PDT, UTC−7).
    t.clock.now = new Date('2026-06-02T05:00:00Z');
    const a = await grower();
    const f = await makePairedTrial(a, { timeZone: 'America/Los_Angeles', plantingDate: '2026-06-02' });
    const plotId = f.plots.find((p) => p.treatment === 'surface')!.id;
    const water = (occurredAt: string) => a.post(`/api/trials/${f.trial.id}/water-events`, { plotId, occurredAt, kind: 'surface', volumeL: 5 });

    // 04:00Z on 2 June is 21:00 on 1 June at the garden: before planting.
    const early = await water('2026-06-02T04:00:00Z');
    expect(early.status).toBe(400);
    expect(early.body.error.reason).toBe('date_outside_trial');
    // 08:00Z on 2 June is 01:00 on 2 June at the garden: the planting day, tomorrow there.
    expect((await water('2026-06-02T08:00:00Z')).status).toBe(201);
    // 08:00Z on 3 June is 01:00 on 3 June at the garden: the day after tomorrow there, refused.
    const future = await water('2026-06-03T08:00:00Z');
    expect(future.status).toBe(400);
    expect(future.body.error.reason).toBe('date_outside_trial');

    // The same rule for an import: a row's day is the garden's day.
    const imported = await a.post(`/api/trials/${f.trial.id}/import`, {
      kind: 'water-events',
      rows: [{ line: 2, plotLabel: f.plots.find((p) => p.id === plotId)!.label, occurredAt: '2026-06-02T04:00:00.000Z', kind: 'surface', volumeL: 3 }],
    });
    expect(imported.status).toBe(400);
    expect(imported.body.error.details.rows[0]).toMatchObject({ code: 'outsideTrial', params: { day: '2026-06-01', planted: '2026-06-02' } });
  });

  it("a CSV date without a time is that calendar day in the garden's zone, wherever the browser is", async () => {
    t.clock.now = new Date('2026-06-20T12:00:00Z');
    for (const timeZone of ['America/Los_Angeles', 'Asia/Tokyo', 'UTC']) {
      const a = await grower();
      const f = await makePairedTrial(a, { timeZone });
      // What the import wizard does in the browser (shared/import/csv-import.ts), with the garden's zone.
      const headers = ['plot', 'date', 'kind', 'litres'];
      const { records, errors } = normaliseRows([[f.plots[0]!.label, '2026-06-01', 'surface', '4']], {
        kind: 'water-events',
        headers,
        mapping: guessMapping(headers, 'water-events'),
        units: {},
        dateFormat: 'iso',
        timeZone,
      });
      expect(errors).toEqual([]);
      expect((await a.post(`/api/trials/${f.trial.id}/import`, { kind: 'water-events', rows: records })).status).toBe(201);
      const csv = parse((await a.get(`/api/trials/${f.trial.id}/export/water-events.csv`)).text);
      expect(csv.data.map((r) => r.day), timeZone).toEqual(['2026-06-01']);
    }
  });

  it('"today" for frost warnings is the garden\'s today, across midnight', async () => {
    // 2026-10-21T03:00Z is 21:00 on 20 October in Denver (MDT, UTC−6) and already 21 October in UTC.
    t.clock.now = new Date('2026-10-20T15:00:00Z');
    const gardens: Record<string, { a: ApiAgent; gardenId: string }> = {};
    for (const timeZone of ['America/Denver', 'UTC']) {
      const a = await grower();
      const f = await makePairedTrial(a, { timeZone, plantingDate: '2026-05-01' });
      // A forecast frost for the night of 20 October (the garden's tonight, where it is still the 20th).
      const put = await a.put(`/api/gardens/${f.garden.id}/weather`, { day: '2026-10-20', tMinC: -1, tMaxC: 11, forecast: true });
      expect(put.status).toBe(200);
      gardens[timeZone] = { a, gardenId: f.garden.id };
    }
    t.clock.now = new Date('2026-10-21T03:00:00Z');
    const denver = await gardens['America/Denver']!.a.get('/api/frost-warnings');
    expect(denver.body.data).toEqual([expect.objectContaining({ gardenId: gardens['America/Denver']!.gardenId, today: '2026-10-20', nights: [{ day: '2026-10-20', tMinC: -1, forecast: true }] })]);
    // In the UTC garden the 20th is over: no warning for a past night.
    const utc = await gardens.UTC!.a.get('/api/frost-warnings');
    expect(utc.body.data).toEqual([]);
  });

  it("the analysis's as-of day is the garden's today", async () => {
    // 2026-06-20T05:00Z is 22:00 on 19 June in Los Angeles.
    t.clock.now = new Date('2026-06-20T05:00:00Z');
    const a = await grower();
    const la = await makePairedTrial(a, { timeZone: 'America/Los_Angeles' });
    const utc = await makePairedTrial(a, { timeZone: 'UTC' });
    expect((await a.get(`/api/trials/${la.trial.id}/analysis`)).body.data.asOf).toBe('2026-06-19');
    expect((await a.get(`/api/trials/${utc.trial.id}/analysis`)).body.data.asOf).toBe('2026-06-20');
  });
});
