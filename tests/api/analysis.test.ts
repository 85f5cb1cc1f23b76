/**
 * GET /api/trials/:id/analysis end to end: logs go in through the API, the server sums them in
 * SQL and the shared functions produce results that are checked against published values.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  t.clock.now = new Date('2026-09-30T12:00:00Z');
});
afterAll(async () => {
  await t.close();
});

// Student's sleep data (Cushny & Peebles 1905; R datasets::sleep), drug 1 and drug 2.
const drug1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const drug2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

async function setUp(pairs: number, opts: { latitudeDeg?: number; elevationM?: number } = {}) {
  const a = new ApiAgent(t.app);
  await a.signUp({ email: uniqueEmail() });
  const garden = (
    await a.post('/api/gardens', { name: 'Ref garden', latitudeDeg: opts.latitudeDeg ?? 50.8, longitudeDeg: 4.35, elevationM: opts.elevationM ?? 100, soilTexture: 'loam' })
  ).body.data;
  const trial = (await a.post(`/api/gardens/${garden.id}/trials`, { title: 'Reference', crop: 'tomato', plantingDate: '2026-05-01', design: 'paired' })).body.data;
  const plots: Record<string, { olla: string; surface: string }> = {};
  for (let i = 0; i < pairs; i++) {
    const key = `P${String(i + 1).padStart(2, '0')}`;
    const o = (await a.post(`/api/trials/${trial.id}/plots`, { label: `${key}-o`, blockKey: key, areaM2: 1, treatment: 'olla' })).body.data;
    const s = (await a.post(`/api/trials/${trial.id}/plots`, { label: `${key}-s`, blockKey: key, areaM2: 1, treatment: 'surface' })).body.data;
    plots[key] = { olla: o.id, surface: s.id };
  }
  await a.post(`/api/trials/${trial.id}/status`, { status: 'active' });
  return { a, garden, trial, plots };
}

describe('GET /api/trials/:trialId/analysis', () => {
  it("reproduces R's paired t-test on the sleep data when the pairs' water depths are those values", async () => {
    const { a, trial, plots } = await setUp(10);
    const keys = Object.keys(plots).sort();
    // On 1 m² plots, litres equal millimetres. +10 keeps every volume positive; differences are unchanged.
    // Two events per plot check that the SQL sums them.
    for (const [i, key] of keys.entries()) {
      const p = plots[key]!;
      const o = drug1[i]! + 10;
      const s = drug2[i]! + 10;
      await a.post(`/api/trials/${trial.id}/water-events`, { plotId: p.olla, occurredAt: '2026-06-01T07:00:00Z', kind: 'olla_refill', volumeL: o / 2 });
      await a.post(`/api/trials/${trial.id}/water-events`, { plotId: p.olla, occurredAt: '2026-06-02T07:00:00Z', kind: 'olla_refill', volumeL: o / 2 });
      await a.post(`/api/trials/${trial.id}/water-events`, { plotId: p.surface, occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: s });
    }
    const res = await a.get(`/api/trials/${trial.id}/analysis`);
    expect(res.status).toBe(200);
    const cmp = res.body.data.comparisons[0];
    expect(cmp).toMatchObject({ treatment: 'olla', control: 'surface' });
    const water = cmp.metrics.waterMm;
    expect(water.kind).toBe('test');
    // R: t.test(extra ~ group, data = sleep, paired = TRUE): t = -4.0621, df = 9, p-value = 0.002833,
    // 95 percent CI -2.4598858 -0.7001142, mean difference -1.58 (REFERENCES.md, V+R).
    expect(water.result.t).toBeCloseTo(-4.0621, 4);
    expect(water.result.df).toBe(9);
    expect(water.result.pValue).toBeCloseTo(0.002833, 6);
    expect(water.result.ci[0]).toBeCloseTo(-2.4598858, 6);
    expect(water.result.ci[1]).toBeCloseTo(-0.7001142, 6);
    // R: wilcox.test(..., paired = TRUE): V = 0, p-value = 0.009091 (with ties: normal approximation).
    expect(water.result.wilcoxon.statistic).toBe(0);
    expect(water.result.wilcoxon.pValue).toBeCloseTo(0.009091, 5);
    // Season totals: sum of (drug + 10) over the ten pairs.
    const ollaTotal = drug1.reduce((s, v) => s + v + 10, 0);
    const surfaceTotal = drug2.reduce((s, v) => s + v + 10, 0);
    const treatments = Object.fromEntries(res.body.data.treatments.map((x: { treatment: string; waterL: number }) => [x.treatment, x.waterL]));
    expect(treatments.olla).toBeCloseTo(ollaTotal, 9);
    expect(treatments.surface).toBeCloseTo(surfaceTotal, 9);
    expect(cmp.waterSavingPercent).toBeCloseTo((1 - ollaTotal / surfaceTotal) * 100, 9);
  });

  it('computes FAO-56 ET0 from a logged weather day (Example 18, Brussels, 6 July: 3.9 mm/day)', async () => {
    const { a, garden, trial } = await setUp(1);
    // FAO-56 Example 18: 50°48'N, 100 m, J = 187, Tmax 21.5, Tmin 12.3, RHmax 84, RHmin 63,
    // wind 10 km/h at 10 m, 9.25 h sunshine; ETo = 3.9 mm/day (full chain 3.8803; REFERENCES.md).
    const put = await a.put(`/api/gardens/${garden.id}/weather`, {
      day: '2026-07-06',
      tMinC: 12.3,
      tMaxC: 21.5,
      rhMinPct: 63,
      rhMaxPct: 84,
      windSpeedMs: 10 / 3.6,
      windHeightM: 10,
      sunshineHours: 9.25,
    });
    expect(put.status).toBe(200);
    const res = await a.get(`/api/trials/${trial.id}/analysis`);
    const cw = res.body.data.cropWater;
    expect(cw.weatherDays).toBe(1);
    expect(cw.methods['penman-monteith']).toBe(1);
    expect(cw.totalEt0Mm).toBeCloseTo(3.88, 2);
    // Tomato on day 66 after planting is in development: Kc between ini 0.6 and mid 1.15 (FAO-56 Table 12).
    expect(cw.totalEtcMm).toBeGreaterThan(0.6 * cw.totalEt0Mm);
    expect(cw.totalEtcMm).toBeLessThan(1.15 * cw.totalEt0Mm);
  });

  it('with a single pair shows totals only and says no test is possible', async () => {
    const { a, trial, plots } = await setUp(1);
    const p = plots.P01!;
    await a.post(`/api/trials/${trial.id}/water-events`, { plotId: p.olla, occurredAt: '2026-06-01T07:00:00Z', kind: 'olla_refill', volumeL: 30 });
    await a.post(`/api/trials/${trial.id}/water-events`, { plotId: p.surface, occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 75 });
    await a.post(`/api/trials/${trial.id}/harvests`, { plotId: p.olla, harvestedOn: '2026-08-01', freshKg: 3 });
    await a.post(`/api/trials/${trial.id}/harvests`, { plotId: p.surface, harvestedOn: '2026-08-01', freshKg: 2.5 });
    const res = await a.get(`/api/trials/${trial.id}/analysis`);
    const cmp = res.body.data.comparisons[0];
    expect(cmp.metrics.waterMm.kind).toBe('descriptive');
    expect(cmp.metrics.waterMm.reason).toMatch(/no test across pairs is possible/);
    expect(cmp.waterSavingPercent).toBeCloseTo(60, 9);
    // Water-use efficiency in kg per m³: 3 kg / 0.030 m³ = 100; 2.5 / 0.075 = 33.3.
    const plotsOut = Object.fromEntries(res.body.data.plots.map((x: { treatment: string; wueKgPerM3: number }) => [x.treatment, x.wueKgPerM3]));
    expect(plotsOut.olla).toBeCloseTo(100, 9);
    expect(plotsOut.surface).toBeCloseTo(2.5 / 0.075, 9);
    expect(cmp.wueRatio).toBeCloseTo(3, 9);
  });

  it('is readable by a cohort lead once shared, and not before', async () => {
    const { a, trial } = await setUp(2);
    const lead = new ApiAgent(t.app);
    await lead.signUp({ email: uniqueEmail('lead'), role: 'educator' });
    // The aggregates run while the access check does (access.reader concurrent): an outsider still gets
    // the same 404 as for a trial that does not exist, and nothing of the trial.
    const outsider = await lead.get(`/api/trials/${trial.id}/analysis`);
    const missing = await lead.get(`/api/trials/00000000-0000-4000-8000-000000000000/analysis`);
    expect(outsider.status).toBe(404);
    expect(outsider.body.data).toBeUndefined();
    expect(outsider.body).toEqual(missing.body);
    expect((await new ApiAgent(t.app).get(`/api/trials/${trial.id}/analysis`)).status).toBe(401);
    const cohort = (await lead.post('/api/cohorts', { name: 'Readers' })).body.data;
    await a.post('/api/cohorts/join', { code: cohort.joinCode });
    await a.post(`/api/trials/${trial.id}/shares`, { cohortId: cohort.id });
    expect((await lead.get(`/api/trials/${trial.id}/analysis`)).status).toBe(200);
  });
});
