/**
 * GET /api/cohorts/:cohortId/results and the lead's exclusions, end to end: growers create and
 * share trials through the API, the server sums their logs in SQL, and the shared assembly pools
 * them. The BCG cohort sets each trial's two pairs so that its effect and variance are the BCG
 * yi and vi, so the published random-effects results check the whole path.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { logRiskRatio } from '@shared/analysis/meta';
import { forestTrials } from '@shared/charts/cohort-charts';
import { cohortResultsSchema, type CohortResults } from '@shared/schemas/cohort-results';
import { LITRES_PER_US_GALLON } from '@shared/units';
import { makePairedTrial } from '../helpers/notebook-fixtures';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  // Logs dated in the 2026 season must not count as "in the future".
  t.clock.now = new Date('2026-09-30T12:00:00Z');
});
afterAll(async () => {
  await t.close();
});

interface Person {
  a: ApiAgent;
  id: string;
  email: string;
  displayName: string;
}

async function person(prefix: string, role: 'grower' | 'educator' = 'grower'): Promise<Person> {
  const a = new ApiAgent(t.app);
  const email = uniqueEmail(prefix);
  const displayName = `Realname ${prefix} ${Math.random().toString(36).slice(2, 8)}`;
  const u = await a.signUp({ email, displayName, role });
  return { a, id: u.id, email, displayName };
}

async function cohortWith(lead: Person, members: { p: Person; role: 'contributor' | 'observer' }[]) {
  const cohort = (await lead.a.post('/api/cohorts', { name: `Olla cohort ${Math.random().toString(36).slice(2, 6)}` })).body.data;
  for (const m of members) {
    const res = await m.p.a.post('/api/cohorts/join', { code: cohort.joinCode, role: m.role });
    if (res.status !== 201) throw new Error(`join: ${res.status} ${JSON.stringify(res.body)}`);
  }
  return cohort as { id: string; joinCode: string };
}

async function share(p: Person, trialId: string, cohortId: string) {
  const res = await p.a.post(`/api/trials/${trialId}/shares`, { cohortId });
  if (res.status !== 201) throw new Error(`share: ${res.status} ${JSON.stringify(res.body)}`);
}

/** A garden, then a paired trial with the given number of pairs (olla plot area 1.5 m², surface 2 m²), active. */
async function pairedTrial(p: Person, gardenId: string, opts: { pairs: number; crop?: string; title?: string }) {
  const trial = (
    await p.a.post(`/api/gardens/${gardenId}/trials`, {
      title: opts.title ?? 'Secret trial title',
      crop: opts.crop ?? 'tomato',
      plantingDate: '2026-05-01',
      design: 'paired',
    })
  ).body.data;
  const plots: { olla: string; surface: string }[] = [];
  for (let i = 0; i < opts.pairs; i++) {
    const key = `P${i + 1}`;
    const o = (await p.a.post(`/api/trials/${trial.id}/plots`, { label: `${key}-o`, blockKey: key, areaM2: 1.5, treatment: 'olla' })).body.data;
    const s = (await p.a.post(`/api/trials/${trial.id}/plots`, { label: `${key}-s`, blockKey: key, areaM2: 2, treatment: 'surface' })).body.data;
    plots.push({ olla: o.id, surface: s.id });
  }
  const status = await p.a.post(`/api/trials/${trial.id}/status`, { status: 'active' });
  if (status.status !== 200) throw new Error(`status: ${status.status}`);
  return { trialId: trial.id as string, plots };
}

async function garden(p: Person) {
  return (
    await p.a.post('/api/gardens', { name: 'Secret garden name', latitudeDeg: 35.0844, longitudeDeg: -106.6504, elevationM: 1500, soilTexture: 'sandy_loam' })
  ).body.data.id as string;
}

type Entry = { type: 'water'; entry: object } | { type: 'harvest'; entry: object } | { type: 'moisture'; entry: object };
async function round(p: Person, trialId: string, entries: Entry[]) {
  const res = await p.a.post(`/api/trials/${trialId}/round`, { entries });
  if (res.status !== 201) throw new Error(`round: ${res.status} ${JSON.stringify(res.body)}`);
}
const water = (plotId: string, occurredAt: string, kind: 'olla_refill' | 'surface', volumeL: number): Entry => ({
  type: 'water',
  entry: { plotId, occurredAt, kind, volumeL },
});
const harvest = (plotId: string, harvestedOn: string, freshKg: number): Entry => ({ type: 'harvest', entry: { plotId, harvestedOn, freshKg } });

async function results(a: ApiAgent, cohortId: string, query = '') {
  const res = await a.get(`/api/cohorts/${cohortId}/results${query}`);
  expect(res.status).toBe(200);
  return cohortResultsSchema.parse(res.body.data) as CohortResults;
}

// BCG vaccine trials (Colditz et al. 1994; R metafor `dat.bcg`): tpos, tneg, cpos, cneg (REFERENCES.md), and each
// trial's allocation as listed for dat.bcg on the metafor project's "Testing Factors and Linear Combinations" page.
const bcg: Array<[number, number, number, number, string]> = [
  [4, 119, 11, 128, 'random'],
  [6, 300, 29, 274, 'random'],
  [3, 228, 11, 209, 'random'],
  [62, 13536, 248, 12619, 'random'],
  [33, 5036, 47, 5761, 'alternate'],
  [180, 1361, 372, 1079, 'alternate'],
  [8, 2537, 10, 619, 'random'],
  [505, 87886, 499, 87892, 'random'],
  [29, 7470, 45, 7232, 'random'],
  [17, 1699, 65, 1600, 'systematic'],
  [186, 50448, 141, 27197, 'systematic'],
  [5, 2493, 3, 2338, 'systematic'],
  [27, 16886, 29, 17825, 'systematic'],
];
const cropForAlloc: Record<string, string> = { random: 'tomato', alternate: 'lettuce', systematic: 'cucumber' };

describe('GET /api/cohorts/:cohortId/results on the BCG trials', () => {
  let lead: Person;
  let cohortId: string;

  beforeAll(async () => {
    lead = await person('lead', 'educator');
    const growers = [await person('bcg-a'), await person('bcg-b'), await person('bcg-c')];
    cohortId = (
      await cohortWith(
        lead,
        growers.map((p) => ({ p, role: 'contributor' as const })),
      )
    ).id;
    const gardens = await Promise.all(growers.map(garden));
    for (const [i, [a, b, c, d, alloc]] of bcg.entries()) {
      const g = growers[i % 3]!;
      const { effect: y, variance: v } = logRiskRatio({ treatmentEvents: a, treatmentNonEvents: b, controlEvents: c, controlNonEvents: d });
      const { trialId, plots } = await pairedTrial(g, gardens[i % 3]!, { pairs: 2, crop: cropForAlloc[alloc] });
      // Pair log ratios y ± √v (mean y, s²/n = v). Depths: surface 30 mm on 2 m² = 60 L; olla 30·e^(y±√v) mm on 1.5 m².
      // The olla water arrives in two refills on different days, so the SQL must sum them.
      const entries: Entry[] = [];
      for (const [j, sign] of [1, -1].entries()) {
        const ollaL = 30 * Math.exp(y + sign * Math.sqrt(v)) * 1.5;
        entries.push(water(plots[j]!.olla, '2026-06-02T07:00:00Z', 'olla_refill', ollaL / 2));
        entries.push(water(plots[j]!.olla, '2026-06-04T07:00:00Z', 'olla_refill', ollaL / 2));
        entries.push(water(plots[j]!.surface, '2026-06-02T07:00:00Z', 'surface', 60));
      }
      await round(g, trialId, entries);
      await share(g, trialId, cohortId);
    }
  });

  it('reproduces the published DerSimonian-Laird results through SQL and the cohort assembly', async () => {
    const r = await results(lead.a, cohortId);
    expect(r.options).toMatchObject({ method: 'DL', includeSinglePairs: false, excludeFlagged: false });
    const w = r.effects.waterLogRatio;
    expect(w.k).toBe(13);
    expect(r.counts.flagged).toBe(0);
    const p = w.pooled!;
    expect(p.q).toBeCloseTo(152.233, 3); // Q = 152.2330, df 12 (REFERENCES.md, V+R)
    expect(p.df).toBe(12);
    expect(p.tau2).toBeCloseTo(0.3088, 4); // DL τ² 0.3088 (REFERENCES.md, V(t)+R)
    expect(p.estimate).toBeCloseTo(-0.7141, 4); // DL estimate −0.7141 (REFERENCES.md, V(t)+R)
    expect(p.se).toBeCloseTo(0.1787, 4); // DL SE 0.1787 (REFERENCES.md, V(t)+R)
    expect(p.ci[0]).toBeCloseTo(-1.0644, 4); // DL 95% CI (−1.0644, −0.3638) (REFERENCES.md, V(t)+R)
    expect(p.ci[1]).toBeCloseTo(-0.3638, 4);
    expect(p.i2).toBeCloseTo(92.12, 2); // DL I² 92.12 % (REFERENCES.md, V(t)+R)
    expect(p.display.estimate).toBeCloseTo((1 - Math.exp(p.estimate)) * 100, 10); // saving % = (1 − exp(estimate))·100
    expect(w.forest).toHaveLength(13);
    expect(w.sensitivity.leaveOneOut).toHaveLength(13);
    // No harvests were logged: the harvest effects have nothing to pool and say so.
    expect(r.effects.wueLogRatio.k).toBe(0);
    expect(r.effects.wueLogRatio.reason).toMatch(/at least 2 trials/);
    expect(r.trials[0]!.completeness).toMatchObject({ harvestRecords: 0, pairsMissingHarvest: 2 });
  });

  it('reproduces the published REML results with method=REML', async () => {
    const p = (await results(lead.a, cohortId, '?method=REML')).effects.waterLogRatio.pooled!;
    expect(p.method).toBe('REML');
    expect(p.tau2).toBeCloseTo(0.3132, 4); // REML τ² 0.3132 (REFERENCES.md, V+R)
    expect(p.estimate).toBeCloseTo(-0.7145, 4); // REML estimate −0.7145 (REFERENCES.md, V+R)
    expect(p.se).toBeCloseTo(0.1798, 4); // REML SE 0.1798 (REFERENCES.md, V+R)
    expect(p.i2).toBeCloseTo(92.22, 2); // REML I² 92.22 % (REFERENCES.md, V+R)
  });

  it('tests the allocation subgroups (coded as crop) like an independent recomputation (recomputed, not published)', async () => {
    // Recomputed in Python (numpy/scipy): each allocation pooled with its own DL τ², Q_between on 1/SE² weights.
    const crop = (await results(lead.a, cohortId)).effects.waterLogRatio.subgroups.find((s) => s.moderator === 'crop')!;
    expect(crop.test!.q).toBeCloseTo(1.536769, 5);
    expect(crop.test!.df).toBe(2);
    expect(crop.levels.find((l) => l.level === 'tomato')!.estimate).toBeCloseTo(-1.004161, 5);
    expect(crop.warning).toMatch(/"lettuce"/); // 2 trials < 3
  });

  it('refuses an unknown method or a non-boolean flag with field messages', async () => {
    const res = await lead.a.get(`/api/cohorts/${cohortId}/results?method=ML&includeSinglePairs=yes`);
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['includeSinglePairs', 'method']);
  });
});

describe('cohort results: privacy, flags, exclusions, withdrawal, single pairs', () => {
  let lead: Person;
  let g1: Person;
  let g2: Person;
  let observer: Person;
  let outsider: Person;
  let cohortId: string;
  const trials: Record<string, string> = {};
  const logged: { trialId: string; treatment: 'olla' | 'surface'; litres: number }[] = [];

  beforeAll(async () => {
    lead = await person('lead2', 'educator');
    g1 = await person('grower1');
    g2 = await person('grower2');
    observer = await person('student');
    outsider = await person('outsider');
    cohortId = (
      await cohortWith(lead, [
        { p: g1, role: 'contributor' },
        { p: g2, role: 'contributor' },
        { p: observer, role: 'observer' },
      ])
    ).id;

    const log = async (p: Person, trialId: string, plots: { id: string; treatment: string }[], entries: Entry[]) => {
      await round(p, trialId, entries);
      for (const e of entries) {
        if (e.type !== 'water') continue;
        const w = e.entry as { plotId: string; volumeL: number };
        logged.push({ trialId, treatment: plots.find((x) => x.id === w.plotId)!.treatment as 'olla' | 'surface', litres: w.volumeL });
      }
    };
    const weekly = (plotId: string, kind: 'olla_refill' | 'surface', volumes: number[]) =>
      volumes.map((v, i) => water(plotId, new Date(Date.UTC(2026, 5, 1 + 7 * i, 7)).toISOString(), kind, v));

    // Q1: two pairs, water and harvests, plain (makePairedTrial: 2 m² plots, a 10 L pot in each olla plot).
    const q1 = await makePairedTrial(g1.a, { title: 'Secret trial title' });
    trials.q1 = q1.trial.id;
    const q1o = q1.plots.filter((p) => p.treatment === 'olla');
    const q1s = q1.plots.filter((p) => p.treatment === 'surface');
    await log(g1, q1.trial.id, q1.plots, [
      ...weekly(q1o[0]!.id, 'olla_refill', [6, 6.5, 6]),
      ...weekly(q1o[1]!.id, 'olla_refill', [5.5, 6, 6.2]),
      ...weekly(q1s[0]!.id, 'surface', [14, 15, 16]),
      ...weekly(q1s[1]!.id, 'surface', [15, 14, 15]),
      ...q1.plots.map((p, i) => harvest(p.id, '2026-08-01', 2 + i * 0.1)),
    ]);

    // Q2: refills of ~5 L a week, but one week entered about 3.785 times too large (litres taken for gallons).
    const q2 = await makePairedTrial(g1.a, { title: 'Secret trial title' });
    trials.q2 = q2.trial.id;
    const q2o = q2.plots.filter((p) => p.treatment === 'olla');
    const q2s = q2.plots.filter((p) => p.treatment === 'surface');
    const big = 5 * LITRES_PER_US_GALLON; // US gallon = 3.785411784 L (NIST Handbook 44)
    await log(g1, q2.trial.id, q2.plots, [
      ...weekly(q2o[0]!.id, 'olla_refill', [5, 5.1, 4.9, big, 5, 5.2]),
      ...weekly(q2o[1]!.id, 'olla_refill', [5.1, 5, 5, big, 4.9, 5]),
      ...weekly(q2s[0]!.id, 'surface', [13, 14, 13, 14, 13, 14]),
      ...weekly(q2s[1]!.id, 'surface', [14, 13, 14, 13, 14, 13]),
    ]);

    // Q3: watered, then closed without any harvest.
    const q3 = await makePairedTrial(g2.a, { title: 'Secret trial title' });
    trials.q3 = q3.trial.id;
    await log(g2, q3.trial.id, q3.plots, [
      ...q3.plots.map((p, i) =>
        water(p.id, '2026-06-03T07:00:00Z', p.treatment === 'olla' ? 'olla_refill' : 'surface', p.treatment === 'olla' ? 6 + i * 0.4 : 16),
      ),
      ...q3.plots.map((p) => water(p.id, '2026-06-10T07:00:00Z', p.treatment === 'olla' ? 'olla_refill' : 'surface', p.treatment === 'olla' ? 5.5 : 15)),
    ]);
    expect((await g2.a.post(`/api/trials/${q3.trial.id}/status`, { status: 'closed' })).status).toBe(200);

    // Q4: a single pair.
    const gid = await garden(g2);
    const q4 = await pairedTrial(g2, gid, { pairs: 1 });
    trials.q4 = q4.trialId;
    const q4plots = [
      { id: q4.plots[0]!.olla, treatment: 'olla' },
      { id: q4.plots[0]!.surface, treatment: 'surface' },
    ];
    await log(g2, q4.trialId, q4plots, [
      water(q4.plots[0]!.olla, '2026-06-03T07:00:00Z', 'olla_refill', 9),
      water(q4.plots[0]!.surface, '2026-06-03T07:00:00Z', 'surface', 30),
    ]);

    // Q5: two pairs, to be withdrawn.
    const q5 = await makePairedTrial(g2.a, { title: 'Secret trial title' });
    trials.q5 = q5.trial.id;
    await log(g2, q5.trial.id, q5.plots, [
      ...q5.plots.map((p, i) =>
        water(p.id, '2026-06-05T07:00:00Z', p.treatment === 'olla' ? 'olla_refill' : 'surface', p.treatment === 'olla' ? 6 + i * 0.3 : 15 + i),
      ),
    ]);

    for (const key of ['q1', 'q2']) await share(g1, trials[key]!, cohortId);
    for (const key of ['q3', 'q4', 'q5']) await share(g2, trials[key]!, cohortId);
  });

  it('serves the lead and an observer pseudonyms, whole-degree regions and no names, e-mails, gardens or titles', async () => {
    const members = (await lead.a.get(`/api/cohorts/${cohortId}/members`)).body.data as { pseudonym: string; role: string }[];
    const pseudonyms = new Set(members.map((m) => m.pseudonym));
    for (const who of [lead, observer]) {
      const res = await who.a.get(`/api/cohorts/${cohortId}/results`);
      expect(res.status).toBe(200);
      const json = JSON.stringify(res.body);
      for (const p of [lead, g1, g2, observer]) {
        expect(json).not.toContain(p.displayName);
        expect(json).not.toContain(p.email);
        expect(json).not.toContain(p.id); // user ids neither
      }
      expect(json).not.toContain('Secret garden name');
      expect(json).not.toContain('Secret trial title');
      const r = cohortResultsSchema.parse(res.body.data);
      expect(r.trials).toHaveLength(5);
      for (const row of r.trials) {
        expect(pseudonyms.has(row.pseudonym)).toBe(true);
        // Stored at 0.1° (35.1, −106.7); shown at whole degrees.
        expect(row.region).toEqual({ latitudeDeg: 35, longitudeDeg: -107, label: '35°N, 107°W' });
      }
    }
  });

  it('shows contributors the same page with their own trials marked', async () => {
    const r = await results(g1.a, cohortId);
    expect(
      r.trials
        .filter((x) => x.mine)
        .map((x) => x.trialId)
        .sort(),
    ).toEqual([trials.q1, trials.q2].sort());
  });

  it('answers 404 to a non-member and 401 to an anonymous caller', async () => {
    expect((await outsider.a.get(`/api/cohorts/${cohortId}/results`)).status).toBe(404);
    const anon = new ApiAgent(t.app);
    await anon.refreshCsrf();
    expect((await anon.get(`/api/cohorts/${cohortId}/results`)).status).toBe(401);
  });

  it('summarises each trial: pairs, pots, completeness from the logs', async () => {
    const r = await results(lead.a, cohortId);
    const q1 = r.trials.find((x) => x.trialId === trials.q1)!;
    expect(q1.pairs).toBe(2);
    expect(q1.potCapacitiesL).toEqual([10]); // makePairedTrial puts a 10 L pot in each olla plot
    // Pot and plot features come back from SQL arrays (bool[], text[]) as plain values: makePairedTrial's globe,
    // wheel-thrown pots of unknown clay, in-ground plots without mulch, pots with lids (the schema defaults).
    expect(q1.moderators).toEqual({
      potCapacity: '6–10 L',
      potShape: 'globe',
      clayBody: 'unknown',
      potMake: 'wheel_thrown',
      crop: 'tomato',
      soilTexture: 'sandy_loam',
      setting: 'in_ground',
      mulch: 'bare',
      lid: 'lid',
    });
    // Planted 2026-05-01, clock 2026-09-30, no end date: 153 days inclusive; water logged on 3 days (1, 8, 15 June).
    expect(q1.completeness).toMatchObject({ expectedDays: 153, daysWithWater: 3, harvestRecords: 4, pairsMissingHarvest: 0 });
    expect(q1.completeness.share).toBeCloseTo(3 / 153, 12);
    expect(q1.effects.harvestPerPlantDiff.pairs).toBe(2);
  });

  it('flags the wrong-unit week and the trial closed without a harvest', async () => {
    const r = await results(lead.a, cohortId);
    const q2 = r.trials.find((x) => x.trialId === trials.q2)!;
    const unit = q2.flags.find((f) => f.kind === 'wrong-unit')!;
    expect(unit.weeks).toHaveLength(1);
    expect(unit.weeks[0]).toMatchObject({ series: 'olla_refill', weekStart: '2026-06-22', kind: 'looks-like-gallons-converted-twice' });
    const q3 = r.trials.find((x) => x.trialId === trials.q3)!;
    expect(q3.flags.map((f) => f.kind)).toContain('closed-without-harvest');
    expect(r.trials.find((x) => x.trialId === trials.q1)!.flags).toEqual([]);
    // excludeFlagged leaves them out of the main estimate; the sensitivity block shows both.
    const w = r.effects.waterLogRatio;
    expect(
      forestTrials(r, 'waterLogRatio')
        .filter((f) => f.flagged)
        .map((f) => f.trialId)
        .sort(),
    ).toEqual([trials.q2, trials.q3].sort());
    const strict = (await results(lead.a, cohortId, '?excludeFlagged=true')).effects.waterLogRatio;
    expect(strict.k).toBe(w.k - 2);
    expect(strict.forest.map((f) => f.trialId)).not.toContain(trials.q2);
    expect(strict.sensitivity.withFlagged!.estimate).toBeCloseTo(w.pooled!.estimate, 12);
  });

  it('lets a single-pair trial in only when the lead opts in', async () => {
    const off = (await results(lead.a, cohortId)).effects.waterLogRatio;
    const withSingles = await results(lead.a, cohortId, '?includeSinglePairs=true');
    const on = withSingles.effects.waterLogRatio;
    expect(on.k).toBe(off.k + 1);
    const row = forestTrials(withSingles, 'waterLogRatio').find((f) => f.trialId === trials.q4)!;
    expect(row.source).toBe('season-totals');
    // Season totals: 9 L on 1.5 m² against 30 L on 2 m².
    expect(row.estimate).toBeCloseTo(Math.log(9 / 1.5 / (30 / 2)), 12);
    expect(row.variance).toBeCloseTo(on.singlePairs.imputedVariance!, 15);
    expect(on.singlePairs.rule).toMatch(/not a published rule/);
  });

  it('adds cumulative water per treatment by ISO week over the pooled trials', async () => {
    const r = await results(lead.a, cohortId);
    const last = (treatment: 'olla' | 'surface') => r.progress.filter((p) => p.treatment === treatment).at(-1)!;
    for (const treatment of ['olla', 'surface'] as const) {
      const total = logged.filter((l) => l.treatment === treatment).reduce((s, l) => s + l.litres, 0);
      expect(last(treatment).cumulativeLitres).toBeCloseTo(total, 9);
    }
    expect(r.progress[0]).toMatchObject({ weekStart: '2026-06-01', isoWeek: '2026-W23' });
  });

  it('records an exclusion with its reason, takes the trial out of the pooled estimate, and puts it back on delete', async () => {
    const before = (await results(lead.a, cohortId)).effects.waterLogRatio;
    const res = await lead.a.post(`/api/cohorts/${cohortId}/exclusions`, { trialId: trials.q1, reason: 'Pots were swapped mid-season' });
    expect(res.status).toBe(201);
    expect(res.body.data).toMatchObject({ trialId: trials.q1, reason: 'Pots were swapped mid-season', excludedByMe: true });
    const rows = await t.ds.query('SELECT reason, excluded_by FROM trial_exclusions WHERE cohort_id = $1 AND trial_id = $2', [cohortId, trials.q1]);
    expect(rows).toEqual([{ reason: 'Pots were swapped mid-season', excluded_by: lead.id }]);

    const after = await results(observer.a, cohortId);
    expect(after.exclusions).toHaveLength(1);
    expect(after.exclusions[0]).toMatchObject({ trialId: trials.q1, reason: 'Pots were swapped mid-season', excludedByMe: false });
    expect(after.effects.waterLogRatio.k).toBe(before.k - 1);
    expect(after.effects.waterLogRatio.forest.map((f) => f.trialId)).not.toContain(trials.q1);
    expect(after.effects.waterLogRatio.pooled!.estimate).not.toBeCloseTo(before.pooled!.estimate, 6);
    expect(after.trials.find((x) => x.trialId === trials.q1)!.effects.waterLogRatio.note).toBe('Excluded by the lead.');

    expect((await lead.a.post(`/api/cohorts/${cohortId}/exclusions`, { trialId: trials.q1, reason: 'Again' })).status).toBe(409);
    expect((await lead.a.delete(`/api/cohorts/${cohortId}/exclusions/${trials.q1}`)).status).toBe(204);
    expect(await t.ds.query('SELECT 1 FROM trial_exclusions WHERE cohort_id = $1', [cohortId])).toEqual([]);
    const restored = (await results(lead.a, cohortId)).effects.waterLogRatio;
    expect(restored.k).toBe(before.k);
    expect(restored.pooled!.estimate).toBeCloseTo(before.pooled!.estimate, 12);
  });

  it('refuses exclusions from members, without a reason, or of trials not shared here', async () => {
    expect((await g1.a.post(`/api/cohorts/${cohortId}/exclusions`, { trialId: trials.q2, reason: 'Mine is odd' })).status).toBe(404);
    expect((await observer.a.delete(`/api/cohorts/${cohortId}/exclusions/${trials.q2}`)).status).toBe(404);
    const short = await lead.a.post(`/api/cohorts/${cohortId}/exclusions`, { trialId: trials.q2, reason: ' ' });
    expect(short.status).toBe(400);
    expect(short.body.error.details[0].path).toBe('reason');
    const gid = await garden(outsider);
    const other = await pairedTrial(outsider, gid, { pairs: 2 });
    const notShared = await lead.a.post(`/api/cohorts/${cohortId}/exclusions`, { trialId: other.trialId, reason: 'Not ours' });
    expect(notShared.status).toBe(400);
    expect(notShared.body.error.details[0].path).toBe('trialId');
    expect(await t.ds.query('SELECT 1 FROM trial_exclusions WHERE cohort_id = $1', [cohortId])).toEqual([]);
  });

  it('drops a withdrawn trial on the next request', async () => {
    const before = await results(lead.a, cohortId);
    expect(before.trials.map((x) => x.trialId)).toContain(trials.q5);
    expect((await g2.a.delete(`/api/trials/${trials.q5}/shares/${cohortId}`)).status).toBe(200);
    const after = await results(observer.a, cohortId);
    expect(after.trials.map((x) => x.trialId)).not.toContain(trials.q5);
    expect(JSON.stringify(after)).not.toContain(trials.q5!);
    expect(after.effects.waterLogRatio.k).toBe(before.effects.waterLogRatio.k - 1);
  });
});
