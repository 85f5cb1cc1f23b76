/**
 * The Saltbush Bend demo season: loads once, is complete enough for every screen, hides the
 * data problems it is meant to hide (a cracked pot, gallons typed as litres), and the real
 * analysis reads a clear water saving from it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { looksLikeWrongVolumeUnit, median } from '../../shared/analysis/robust';
import { LITRES_PER_US_GALLON } from '../../shared/units';
import { DEMO_PASSWORD, seedDemoIfEmpty } from '../../server/db/seed/demo';
import { GROWERS } from '../../server/db/seed/cast';
import { generateSeason } from '../../server/db/seed/season';
import { createLogger } from '../../server/lib/logger';
import { ApiAgent, startTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let seeded: boolean;

beforeAll(async () => {
  t = await startTestApp();
  // After the season, so open trials read as "still running" at a fixed moment.
  t.clock.now = new Date('2026-12-01T12:00:00Z');
  seeded = await seedDemoIfEmpty(t.ds, createLogger('silent'));
});
afterAll(async () => {
  await t.close();
});

async function one<T>(sql: string, params: unknown[] = []): Promise<T> {
  const rows = (await t.ds.query(sql, params)) as T[];
  return rows[0]!;
}

async function trialOf(email: string, extra = ''): Promise<{ id: string; planting_date: string; end_date: string | null }> {
  return one(
    `SELECT t.id, t.planting_date::text, t.end_date::text FROM trials t JOIN users u ON u.id = t.owner_id
      WHERE u.email = $1 ${extra} ORDER BY t.planting_date LIMIT 1`,
    [email],
  );
}

describe('seedDemoIfEmpty', () => {
  it('loads into an empty database once, and never twice', async () => {
    expect(seeded).toBe(true);
    const before = await one<{ users: number; events: number }>(
      `SELECT (SELECT count(*)::int FROM users) AS users, (SELECT count(*)::int FROM water_events) AS events`,
    );
    expect(await seedDemoIfEmpty(t.ds, createLogger('silent'))).toBe(false);
    const after = await one<{ users: number; events: number }>(
      `SELECT (SELECT count(*)::int FROM users) AS users, (SELECT count(*)::int FROM water_events) AS events`,
    );
    expect(after).toEqual(before);
  });

  it('generates the same season from the same seed', () => {
    const ids = Object.fromEntries(GROWERS.map((g) => [g.email, g.email]));
    const volumes = () => generateSeason(ids, 'cohort').water_events.map((w) => [w.occurred_at, w.volume_l]);
    expect(volumes()).toEqual(volumes());
  });

  it('has a season big enough for every screen', async () => {
    const c = await one<Record<string, number>>(`
      SELECT (SELECT count(*)::int FROM gardens) AS gardens,
             (SELECT count(*)::int FROM trials) AS trials,
             (SELECT count(*)::int FROM trial_shares s JOIN cohorts c ON c.id = s.cohort_id
               WHERE c.name = 'Saltbush Bend Garden Network' AND s.withdrawn_at IS NULL) AS shared,
             (SELECT count(*)::int FROM water_events) AS water,
             (SELECT count(*)::int FROM moisture_readings) AS moisture,
             (SELECT count(*)::int FROM harvests) AS harvests,
             (SELECT count(*)::int FROM observations) AS observations,
             (SELECT count(*)::int FROM seep_tests) AS seep_tests,
             (SELECT count(*)::int FROM pots WHERE plot_id IS NULL) AS shelf_pots,
             (SELECT count(*)::int FROM cohort_memberships m JOIN cohorts c ON c.id = m.cohort_id
               WHERE c.name = 'Saltbush Bend Garden Network' AND m.role = 'contributor') AS contributors`);
    expect(c.gardens).toBeGreaterThanOrEqual(12);
    expect(c.trials).toBeGreaterThanOrEqual(12);
    expect(c.shared).toBeGreaterThanOrEqual(10);
    expect(c.water).toBeGreaterThanOrEqual(5000);
    expect(c.moisture).toBeGreaterThan(0);
    expect(c.harvests).toBeGreaterThan(0);
    expect(c.observations).toBeGreaterThan(0);
    expect(c.seep_tests).toBeGreaterThan(0);
    expect(c.shelf_pots).toBeGreaterThan(0);
    expect(c.contributors).toBeGreaterThanOrEqual(12);
    // Both ET0 methods appear: some gardens log humidity, wind and sunshine, the rest only temperatures.
    const methods = await one<{ full: number; bare: number }>(
      `SELECT count(DISTINCT garden_id) FILTER (WHERE rh_min_pct IS NOT NULL)::int AS full, count(DISTINCT garden_id) FILTER (WHERE rh_min_pct IS NULL AND NOT forecast)::int AS bare FROM weather_days`,
    );
    expect(methods.full).toBeGreaterThan(0);
    expect(methods.bare).toBeGreaterThan(0);
  });

  it('has a weather day for every garden-day of every trial, and a frost in the forecast', async () => {
    const missing = await one<{ n: number }>(`
      SELECT count(*)::int AS n
        FROM trials t
        CROSS JOIN LATERAL generate_series(
          t.planting_date,
          COALESCE(t.end_date, (SELECT max(occurred_at)::date FROM water_events w WHERE w.trial_id = t.id)),
          interval '1 day') AS d
        LEFT JOIN weather_days w ON w.garden_id = t.garden_id AND w.day = d::date AND NOT w.forecast
       WHERE w.id IS NULL`);
    expect(missing.n).toBe(0);
    const frost = await one<{ n: number }>(`SELECT count(*)::int AS n FROM weather_days WHERE forecast AND t_min_c <= 0 AND day >= '2026-09-20'`);
    expect(frost.n).toBeGreaterThanOrEqual(1);
  });

  it('puts a pot in every olla plot and keeps the trials randomised', async () => {
    const bare = await one<{ n: number }>(
      `SELECT count(*)::int AS n FROM plots p WHERE p.treatment = 'olla' AND NOT EXISTS (SELECT 1 FROM pots WHERE plot_id = p.id)`,
    );
    expect(bare.n).toBe(0);
    const unseeded = await one<{ n: number }>(`SELECT count(*)::int AS n FROM trials WHERE randomisation_seed IS NULL`);
    expect(unseeded.n).toBe(0);
    // Every pair holds one olla and one surface plot.
    const badPairs = await one<{ n: number }>(`
      SELECT count(*)::int AS n FROM (
        SELECT trial_id, block_key FROM plots GROUP BY 1, 2
        HAVING count(*) FILTER (WHERE treatment = 'olla') <> 1 OR count(*) FILTER (WHERE treatment = 'surface') <> 1) x`);
    expect(badPairs.n).toBe(0);
  });

  it('has exactly one cracked pot, noted, lifted and replaced, with later refills on the replacement', async () => {
    const cracked = (await t.ds.query(`SELECT id, label, owner_id, plot_id FROM pots WHERE condition = 'cracked'`)) as {
      id: string;
      label: string;
      owner_id: string;
      plot_id: string | null;
    }[];
    expect(cracked).toHaveLength(1);
    const pot = cracked[0]!;
    expect(pot.plot_id).toBeNull();
    const note = await one<{ n: number }>(`SELECT count(*)::int AS n FROM observations WHERE entered_by = $1 AND text LIKE '%' || $2 || '%'`, [
      pot.owner_id,
      pot.label,
    ]);
    expect(note.n).toBeGreaterThanOrEqual(1);
    const lastOnCracked = await one<{ at: Date }>(`SELECT max(occurred_at) AS at FROM water_events WHERE pot_id = $1`, [pot.id]);
    const replacement = await one<{ id: string; installed_on: string; plot_id: string }>(
      `SELECT r.id, r.installed_on::text, r.plot_id FROM pots r
        WHERE r.owner_id = $1 AND r.installed_on > (SELECT min(planting_date) FROM trials WHERE owner_id = $1) AND r.plot_id IS NOT NULL`,
      [pot.owner_id],
    );
    const refillsAfter = await one<{ n: number }>(`SELECT count(*)::int AS n FROM water_events WHERE pot_id = $1 AND occurred_at > $2`, [
      replacement.id,
      lastOnCracked.at,
    ]);
    expect(refillsAfter.n).toBeGreaterThan(10);
  });

  it("hides one grower's gallons typed as litres: a stretch whose median is about 1/3.785 of the rest", async () => {
    const trial = await trialOf('wendell@saltbush.example');
    const refills = (await t.ds.query(`SELECT occurred_at, volume_l FROM water_events WHERE trial_id = $1 AND kind = 'olla_refill' ORDER BY occurred_at`, [
      trial.id,
    ])) as {
      occurred_at: Date;
      volume_l: number;
    }[];
    const flags = looksLikeWrongVolumeUnit(refills.map((r) => r.volume_l));
    expect(flags.length).toBeGreaterThanOrEqual(20);
    expect(flags.every((f) => f.kind === 'looks-like-gallons-typed-as-litres')).toBe(true);
    // The flags sit in one stretch of weeks, and that stretch as a whole is about 3.785 times too small.
    const times = flags.map((f) => refills[f.index]!.occurred_at.getTime());
    const from = Math.min(...times);
    const to = Math.max(...times);
    expect((to - from) / 86_400_000).toBeGreaterThanOrEqual(14);
    const inside = refills.filter((r) => r.occurred_at.getTime() >= from && r.occurred_at.getTime() <= to).map((r) => r.volume_l);
    const outside = refills.filter((r) => r.occurred_at.getTime() < from || r.occurred_at.getTime() > to).map((r) => r.volume_l);
    expect(median(outside) / median(inside) / LITRES_PER_US_GALLON).toBeGreaterThan(0.85);
    expect(median(outside) / median(inside) / LITRES_PER_US_GALLON).toBeLessThan(1.15);
    // Nobody else's logs look like gallons typed as litres. (Large legitimate volumes, such as a
    // pot's first fill or a refill after days away, can look "converted twice": that is for the
    // flag's reader to judge.)
    const others = (await t.ds.query(
      `SELECT t.id, w.kind, array_agg(w.volume_l ORDER BY w.occurred_at) AS volumes FROM trials t JOIN water_events w ON w.trial_id = t.id
        WHERE t.id <> $1 GROUP BY t.id, w.kind`,
      [trial.id],
    )) as { id: string; kind: string; volumes: number[] }[];
    for (const o of others) {
      const typedAsLitres = looksLikeWrongVolumeUnit(o.volumes).filter((f) => f.kind === 'looks-like-gallons-typed-as-litres');
      expect(typedAsLitres, `${o.id} ${o.kind}`).toEqual([]);
    }
  });

  it('closes one trial without a harvest and leaves Ruth’s second trial private', async () => {
    const noHarvest = await one<{ n: number }>(
      `SELECT count(*)::int AS n FROM trials t WHERE t.status = 'closed' AND NOT EXISTS (SELECT 1 FROM harvests h WHERE h.trial_id = t.id)`,
    );
    expect(noHarvest.n).toBe(1);
    const ruth = (await t.ds.query(
      `SELECT t.status, EXISTS (SELECT 1 FROM trial_shares s WHERE s.trial_id = t.id) AS shared FROM trials t JOIN users u ON u.id = t.owner_id
        WHERE u.email = 'ruth@saltbush.example' ORDER BY t.planting_date`,
    )) as { status: string; shared: boolean }[];
    expect(ruth).toEqual([
      { status: 'closed', shared: true },
      { status: 'active', shared: false },
    ]);
  });

  it("lets Ruth read her shared trial's results: a paired water test with olla using less", async () => {
    const trial = await trialOf('ruth@saltbush.example', `AND EXISTS (SELECT 1 FROM trial_shares s WHERE s.trial_id = t.id)`);
    const ruth = new ApiAgent(t.app);
    expect((await ruth.signIn('ruth@saltbush.example', DEMO_PASSWORD)).status).toBe(200);
    const res = await ruth.get(`/api/trials/${trial.id}/analysis`);
    expect(res.status).toBe(200);
    const cmp = res.body.data.comparisons[0];
    expect(cmp).toMatchObject({ treatment: 'olla', control: 'surface' });
    expect(cmp.metrics.waterMm.kind).toBe('test');
    expect(Number.isFinite(cmp.metrics.waterMm.result.pValue)).toBe(true);
    expect(cmp.metrics.waterMm.result.meanDifference).toBeLessThan(0);
    const depth = Object.fromEntries(res.body.data.treatments.map((x: { treatment: string; depthMm: number }) => [x.treatment, x.depthMm]));
    expect(depth.olla).toBeLessThan(depth.surface);
    expect(cmp.waterSavingPercent).toBeGreaterThan(0);
    expect(res.body.data.cropWater.weatherDays).toBeGreaterThan(100);
  });

  it('opens the Results tab of every trial for its owner', async () => {
    const trials = (await t.ds.query(
      `SELECT t.id, t.title, u.email, EXISTS (SELECT 1 FROM trial_shares s WHERE s.trial_id = t.id) AS shared
         FROM trials t JOIN users u ON u.id = t.owner_id ORDER BY u.email, t.planting_date`,
    )) as { id: string; title: string; email: string; shared: boolean }[];
    const agents = new Map<string, ApiAgent>();
    const savings: number[] = [];
    for (const trial of trials) {
      let agent = agents.get(trial.email);
      if (!agent) {
        agent = new ApiAgent(t.app);
        expect((await agent.signIn(trial.email, DEMO_PASSWORD)).status).toBe(200);
        agents.set(trial.email, agent);
      }
      const res = await agent.get(`/api/trials/${trial.id}/analysis`);
      expect(res.status, trial.title).toBe(200);
      if (!trial.shared) continue;
      // In the network's trials the pots saved water (Ruth's private bean trial is two weeks old:
      // the pots' first fills still outweigh what they saved).
      const cmp = res.body.data.comparisons[0];
      expect(cmp.waterSavingPercent, trial.title).toBeGreaterThan(0);
      if (res.body.data.plots.length > 2) expect(cmp.metrics.waterMm.kind, trial.title).toBe('test');
      savings.push(cmp.waterSavingPercent);
    }
    // An honest spread between the network's gardens: some save a lot, some little.
    expect(Math.min(...savings)).toBeLessThan(40);
    expect(Math.max(...savings)).toBeGreaterThan(60);
  });

  it('gives the single-pair grower a description instead of a test', async () => {
    const trial = await trialOf('lupe@saltbush.example');
    const lupe = new ApiAgent(t.app);
    expect((await lupe.signIn('lupe@saltbush.example', DEMO_PASSWORD)).status).toBe(200);
    const res = await lupe.get(`/api/trials/${trial.id}/analysis`);
    expect(res.status).toBe(200);
    expect(res.body.data.comparisons[0].metrics.waterMm).toMatchObject({ kind: 'descriptive', n: 1 });
  });
});
