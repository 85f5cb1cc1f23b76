/**
 * The benchmark's invented scenario: a regional olla programme in an invented dry country, with
 * thousands of paired trials, dozens of cohorts and a couple of million log rows. Every person,
 * place and number is made up (bench/lib/names.ts).
 *
 * It loads in two halves so the figures can be measured at half and at full size:
 *   phase 0: the benchmark accounts and their trials (the 20-plot trial with a full season of daily
 *            logs, a trial for API writes, trials for imports), the 500-trial cohort, the network
 *            cohort every trial is shared into, and the first half of the regular trials;
 *   phase 1: the second half of the regular trials and their cohorts.
 * People, gardens, trials, plots, pots, memberships and shares go in through COPY (generated here,
 * deterministic); the log rows are generated inside PostgreSQL with INSERT ... SELECT FROM
 * generate_series from one row of parameters per trial, in batches of trials.
 */
import type pg from 'pg';
import { JOIN_CODE_ALPHABET } from '@shared/schemas/cohorts';
import { soilTextures } from '@shared/schemas/gardens';
import { copyRows, type CopyValue } from './copy';
import { BenchRng, personName, placeName, pseudonym } from './names';

export const BENCH_PASSWORD = 'bench-olla-clay-2026';
export const benchEmails = {
  grower: 'bench.grower@bench.seepwise.example',
  lead: 'bench.lead@bench.seepwise.example',
  network: 'bench.network@bench.seepwise.example',
} as const;

/** Logs stop here for trials still running: the scenario's "today" (the season of 2026). */
const LAST_LOG_DAY = '2026-12-01';

export interface ScenarioPlan {
  scale: number;
  /** Regular trials over both phases (a multiple of 4). */
  trials: number;
  /** Trials shared into the big cohort (all from phase 0). */
  bigCohortTrials: number;
  /** Small cohorts (classes and programmes), half per phase. */
  smallCohorts: number;
  /** Season length multiplier: 1 at full scale, shorter seasons for tiny runs. */
  seasonFactor: number;
  featuredPlots: number;
  featuredDays: number;
  importRows: number;
  importRuns: number;
  writePlots: number;
  importPlots: number;
}

export function planScenario(scale: number): ScenarioPlan {
  const trials = Math.max(4, 4 * Math.round(500 * scale));
  const seasonFactor = Math.min(1, scale * 10);
  return {
    scale,
    trials,
    bigCohortTrials: Math.min(trials / 2, Math.max(2, 2 * Math.round(250 * scale))),
    smallCohorts: Math.max(2, 2 * Math.round(20 * scale)),
    seasonFactor,
    featuredPlots: 20,
    featuredDays: Math.max(5, Math.round(150 * seasonFactor)),
    importRows: Math.max(200, Math.round(100_000 * scale)),
    importRuns: scale >= 0.1 ? 3 : 1,
    writePlots: 4,
    importPlots: 24,
  };
}

export interface ScenarioIds {
  featuredTrialId: string;
  writeTrialId: string;
  writePlotIds: string[];
  importTrialIds: string[];
  importPlotLabels: string[];
  bigCohortId: string;
  networkCohortId: string;
}

export interface LoadStep {
  table: string;
  method: 'COPY' | 'INSERT ... SELECT generate_series';
  rows: number;
  ms: number;
}

const addDays = (day: string, n: number) => new Date(Date.parse(`${day}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
const minDay = (a: string, b: string) => (a < b ? a : b);
const round = (v: number, d = 1) => Number(v.toFixed(d));

const crops = ['tomato', 'sweet-pepper', 'squash-zucchini', 'sweet-melon', 'watermelon', 'lettuce', 'green-beans', 'cucumber'] as const;
/** Invented round numbers in the spirit of server/db/seed/model.ts: days to first pick, kg per m² per 60-day picking season, fruit mass, plants per m². */
const cropProfile: Record<(typeof crops)[number], { firstPick: number; kgPerM2: number; fruitKg: number; plantsPerM2: number }> = {
  tomato: { firstPick: 70, kgPerM2: 5.5, fruitKg: 0.14, plantsPerM2: 1 },
  'sweet-pepper': { firstPick: 74, kgPerM2: 2.6, fruitKg: 0.12, plantsPerM2: 3 },
  'squash-zucchini': { firstPick: 55, kgPerM2: 6.5, fruitKg: 0.32, plantsPerM2: 0.7 },
  'sweet-melon': { firstPick: 78, kgPerM2: 4.5, fruitKg: 1.3, plantsPerM2: 0.7 },
  watermelon: { firstPick: 85, kgPerM2: 4, fruitKg: 5, plantsPerM2: 0.5 },
  lettuce: { firstPick: 40, kgPerM2: 2, fruitKg: 0.3, plantsPerM2: 9 },
  'green-beans': { firstPick: 50, kgPerM2: 1.1, fruitKg: 0.008, plantsPerM2: 12 },
  cucumber: { firstPick: 50, kgPerM2: 5, fruitKg: 0.3, plantsPerM2: 1.5 },
};

interface Rows {
  users: CopyValue[][];
  cohorts: CopyValue[][];
  gardens: CopyValue[][];
  trials: CopyValue[][];
  plots: CopyValue[][];
  pots: CopyValue[][];
  cohort_memberships: CopyValue[][];
  trial_shares: CopyValue[][];
  bench_trial_params: CopyValue[][];
}

const columns: Record<keyof Rows, string[]> = {
  users: ['id', 'email', 'password_hash', 'display_name', 'role', 'language', 'unit_system', 'email_verified_at', 'created_at'],
  cohorts: ['id', 'name', 'description', 'kind', 'lead_id', 'join_code', 'licence', 'created_at'],
  gardens: ['id', 'owner_id', 'name', 'latitude_deg', 'longitude_deg', 'elevation_m', 'soil_texture', 'coastal', 'notes', 'created_at'],
  trials: [
    'id', 'garden_id', 'owner_id', 'title', 'crop', 'variety', 'planting_date', 'end_date', 'design', 'treatments', 'question',
    'kc_overrides', 'stress_thresholds', 'status', 'randomisation_seed', 'created_at',
  ],
  plots: ['id', 'trial_id', 'label', 'treatment', 'block_key', 'area_m2', 'setting', 'mulch', 'lid', 'plant_count'],
  pots: ['id', 'owner_id', 'label', 'capacity_l', 'height_cm', 'widest_diameter_cm', 'neck_diameter_cm', 'shape', 'clay_body', 'make', 'firing_cone', 'installed_on', 'plot_id', 'condition'],
  cohort_memberships: ['id', 'cohort_id', 'user_id', 'role', 'pseudonym', 'created_at'],
  trial_shares: ['id', 'trial_id', 'cohort_id', 'shared_at', 'withdrawn_at'],
  bench_trial_params: [
    'trial_id', 'owner_id', 'garden_id', 'phase', 'batch', 'first_day', 'last_day', 'refill_every', 'surface_rate', 'surface_mm', 'olla_fill_l',
    'moisture_every', 'method', 'depth_cm', 'first_pick', 'pick_every', 'kg_per_m2_pick', 'fruit_kg',
  ],
};

const PARAMS_DDL = `
  CREATE UNLOGGED TABLE IF NOT EXISTS bench_trial_params (
    trial_id uuid PRIMARY KEY, owner_id uuid NOT NULL, garden_id uuid NOT NULL, phase int NOT NULL, batch int NOT NULL,
    first_day date NOT NULL, last_day date NOT NULL, refill_every int NOT NULL, surface_rate float8 NOT NULL, surface_mm float8 NOT NULL,
    olla_fill_l float8 NOT NULL, moisture_every int NOT NULL, method text NOT NULL, depth_cm float8 NOT NULL,
    first_pick date, pick_every int NOT NULL, kg_per_m2_pick float8 NOT NULL, fruit_kg float8 NOT NULL)`;

/** Trials per INSERT ... SELECT statement (progress is printed per batch). */
const BATCH_TRIALS = 250;

interface TrialSpec {
  id: string;
  ownerId: string;
  gardenId: string;
  title: string;
  crop: (typeof crops)[number];
  plantingDate: string;
  endDate: string | null;
  lastLogDay: string;
  status: 'active' | 'closed';
  design: 'paired' | 'rcbd';
  pairs: number;
  logs: {
    refillEvery: number;
    surfaceRate: number;
    surfaceMm: number;
    moistureEvery: number;
    method: 'vwc' | 'tensiometer' | 'probe_index';
    depthCm: number;
    harvest: boolean;
  } | null;
  plotLabel?: (block: number, treatment: 'olla' | 'surface') => string;
}

class Builder {
  readonly rows: Rows = { users: [], cohorts: [], gardens: [], trials: [], plots: [], pots: [], cohort_memberships: [], trial_shares: [], bench_trial_params: [] };
  private paramIndex = 0;
  constructor(
    private readonly plan: ScenarioPlan,
    private readonly phase: number,
    private readonly passwordHash: string,
  ) {}

  user(rng: BenchRng, email: string, role: 'grower' | 'educator', id = rng.uuid(), name = personName(rng)): string {
    this.rows.users.push([id, email, this.passwordHash, name, role, rng.chance(0.2) ? 'es' : 'en', rng.chance(0.25) ? 'us' : 'metric', '2026-01-10T12:00:00Z', '2026-01-10T12:00:00Z']);
    return id;
  }

  cohort(rng: BenchRng, id: string, name: string, kind: 'programme' | 'class' | 'network', leadId: string): string {
    let code = '';
    for (let i = 0; i < 10; i++) code += rng.pick([...JOIN_CODE_ALPHABET]);
    this.rows.cohorts.push([id, name, `${name}: growers comparing buried clay pots with surface watering (invented benchmark data).`, kind, leadId, code, 'CC-BY-4.0', '2026-01-15T09:00:00Z']);
    return id;
  }

  garden(rng: BenchRng, ownerId: string): string {
    const id = rng.uuid();
    this.rows.gardens.push([
      id,
      ownerId,
      `${placeName(rng)} garden`,
      round(rng.uniform(28, 38), 3),
      round(rng.uniform(-118, -100), 3),
      Math.round(rng.uniform(150, 1900)),
      rng.pick(soilTextures),
      rng.chance(0.05),
      '',
      '2026-02-01T10:00:00Z',
    ]);
    return id;
  }

  member(rng: BenchRng, cohortId: string, userId: string, index: number, role: 'contributor' | 'observer' = 'contributor') {
    this.rows.cohort_memberships.push([rng.uuid(), cohortId, userId, role, pseudonym(index, role), '2026-02-10T10:00:00Z']);
  }

  share(rng: BenchRng, trialId: string, cohortId: string, plantingDate: string, withdrawn = false) {
    this.rows.trial_shares.push([rng.uuid(), trialId, cohortId, `${addDays(plantingDate, -7)}T18:00:00Z`, withdrawn ? `${addDays(plantingDate, 30)}T18:00:00Z` : null]);
  }

  /** A trial with its plots (olla and surface in every pair or block), pots in the olla plots, and its log parameters. */
  trial(rng: BenchRng, t: TrialSpec): { plotIds: string[]; plotLabels: string[] } {
    const profile = cropProfile[t.crop];
    this.rows.trials.push([
      t.id, t.gardenId, t.ownerId, t.title, t.crop, rng.pick(['', 'Heirloom', 'Early', 'Compact']), t.plantingDate, t.endDate, t.design,
      ['olla', 'surface'], 'Do buried clay pots use less water than surface watering for the same harvest?', {}, {}, t.status, rng.uuid().slice(0, 16),
      `${addDays(t.plantingDate, -21)}T20:00:00Z`,
    ]);
    const setting = rng.weighted(['in_ground', 'raised_bed', 'container'] as const, [6, 3, 1]);
    const mulch = rng.chance(0.5);
    const lid = rng.chance(0.8);
    const potsPerPlot = rng.weighted([1, 2], [7, 3]);
    const capacity = rng.pick([4, 6, 8, 10, 12]);
    const shape = rng.pick(['globe', 'bottle', 'cylinder', 'twin_pot'] as const);
    const clay = rng.pick(['earthenware', 'terracotta', 'stoneware', 'mixed', 'unknown'] as const);
    const make = rng.pick(['wheel_thrown', 'coil_built', 'slip_cast', 'joined_terracotta'] as const);
    const cone = rng.pick(['04', '05', '06', null]);
    const plotIds: string[] = [];
    const plotLabels: string[] = [];
    for (let b = 1; b <= t.pairs; b++) {
      const block = `${t.design === 'paired' ? 'P' : 'B'}${b}`;
      const area = round(rng.uniform(1, 3.5) * 2, 0) / 2;
      for (const treatment of ['olla', 'surface'] as const) {
        const id = rng.uuid();
        const label = t.plotLabel ? t.plotLabel(b, treatment) : `${block}-${treatment === 'olla' ? 'O' : 'S'}`;
        plotIds.push(id);
        plotLabels.push(label);
        this.rows.plots.push([id, t.id, label, treatment, block, area, setting, mulch, lid, Math.max(1, Math.round(area * profile.plantsPerM2))]);
        if (treatment === 'olla') {
          for (let k = 1; k <= potsPerPlot; k++) {
            const d = round(Math.cbrt((capacity * 1000) / (0.6 * 0.785 * 1.1)), 0);
            this.rows.pots.push([
              rng.uuid(), t.ownerId, `${label}#${k} ${t.id.slice(0, 4)}`, capacity, round(d * 1.1, 0), d, rng.pick([5, 6, 7, 8]), shape, clay, make, cone, t.plantingDate, id,
              rng.chance(0.02) ? 'cracked' : 'sound',
            ]);
          }
        }
      }
    }
    if (t.logs) {
      const firstPick = addDays(t.plantingDate, Math.max(1, Math.round(profile.firstPick * this.plan.seasonFactor)));
      const pickEvery = rng.int(3, 6);
      this.rows.bench_trial_params.push([
        t.id, t.ownerId, t.gardenId, this.phase, Math.floor(this.paramIndex++ / BATCH_TRIALS), t.plantingDate, t.lastLogDay,
        t.logs.refillEvery, t.logs.surfaceRate, t.logs.surfaceMm, potsPerPlot * capacity, t.logs.moistureEvery, t.logs.method, t.logs.depthCm,
        t.logs.harvest ? firstPick : null, pickEvery, round((profile.kgPerM2 * pickEvery) / 60, 4), profile.fruitKg,
      ]);
    }
    return { plotIds, plotLabels };
  }
}

/** A regular grower trial: closed 2026 summer season, or (8 %) an autumn trial still running. */
function regularTrial(plan: ScenarioPlan, i: number, ownerId: string, gardenId: string): { rng: BenchRng; spec: TrialSpec } {
  const rng = new BenchRng(`trial:${i}`);
  const crop = rng.pick(crops);
  const active = rng.chance(0.08);
  const plantingDate = active ? addDays('2026-08-10', rng.int(0, 30)) : addDays('2026-03-01', rng.int(0, 100));
  const days = Math.max(5, Math.round(rng.uniform(110, 150) * plan.seasonFactor));
  const last = addDays(plantingDate, days - 1);
  return {
    rng,
    spec: {
      id: rng.uuid(),
      ownerId,
      gardenId,
      title: `${crop} olla trial ${i + 1}`,
      crop,
      plantingDate,
      endDate: active ? null : last,
      lastLogDay: active ? minDay(last, LAST_LOG_DAY) : last,
      status: active ? 'active' : 'closed',
      design: rng.chance(0.8) ? 'paired' : 'rcbd',
      pairs: rng.weighted([2, 3, 4, 5], [25, 35, 30, 10]),
      logs: {
        refillEvery: rng.int(2, 3),
        surfaceRate: round(rng.uniform(0.75, 0.95), 3),
        surfaceMm: round(rng.uniform(4, 8), 2),
        moistureEvery: rng.int(2, 4),
        method: rng.weighted(['vwc', 'tensiometer', 'probe_index'] as const, [2, 1, 1]),
        depthCm: rng.pick([10, 15, 20]),
        harvest: !rng.chance(0.03),
      },
    },
  };
}

/** Which growers and trials belong to a phase. Grower g owns regular trials 2g and 2g + 1. */
function phaseRange(plan: ScenarioPlan, phase: number) {
  const growers = plan.trials / 2;
  return phase === 0 ? { from: 0, to: growers / 2 } : { from: growers / 2, to: growers };
}

/** Builds every COPY row of one phase. Ids are deterministic, so phase 1 can refer to phase 0's cohorts. */
function buildPhase(plan: ScenarioPlan, phase: number, passwordHash: string): { rows: Rows; ids: ScenarioIds } {
  const b = new Builder(plan, phase, passwordHash);
  const root = new BenchRng('root');
  // The ids of the shared actors are drawn first, identically in both phases.
  const benchGrowerId = root.uuid();
  const benchLeadId = root.uuid();
  const networkLeadId = root.uuid();
  const networkCohortId = root.uuid();
  const bigCohortId = root.uuid();
  const smallCohortIds = Array.from({ length: plan.smallCohorts }, () => root.uuid());
  const educatorIds = Array.from({ length: plan.smallCohorts }, () => root.uuid());
  const ids: ScenarioIds = { featuredTrialId: '', writeTrialId: '', writePlotIds: [], importTrialIds: [], importPlotLabels: [], bigCohortId, networkCohortId };

  const half = plan.smallCohorts / 2;
  const phaseCohorts = phase === 0 ? [0, half] : [half, plan.smallCohorts];
  if (phase === 0) {
    const rng = new BenchRng('bench-accounts');
    b.user(rng, benchEmails.grower, 'grower', benchGrowerId, 'Bench Grower');
    b.user(rng, benchEmails.lead, 'educator', benchLeadId, 'Bench Programme Lead');
    b.user(rng, benchEmails.network, 'educator', networkLeadId, 'Bench Network Lead');
    b.cohort(rng, bigCohortId, 'Dryland Olla Programme 2026', 'programme', benchLeadId);
    b.cohort(rng, networkCohortId, 'Basin-wide Garden Network', 'network', networkLeadId);
    b.member(rng, networkCohortId, benchGrowerId, 0);

    const garden = b.garden(rng, benchGrowerId);
    // The 20-plot trial: ten pairs, a full season of daily logs on every plot.
    ids.featuredTrialId = rng.uuid();
    b.trial(rng, {
      id: ids.featuredTrialId,
      ownerId: benchGrowerId,
      gardenId: garden,
      title: 'Twenty-plot tomato season (benchmark)',
      crop: 'tomato',
      plantingDate: '2026-04-01',
      endDate: addDays('2026-04-01', plan.featuredDays - 1),
      lastLogDay: addDays('2026-04-01', plan.featuredDays - 1),
      status: 'closed',
      design: 'paired',
      pairs: plan.featuredPlots / 2,
      logs: { refillEvery: 1, surfaceRate: 1, surfaceMm: 6, moistureEvery: 1, method: 'vwc', depthCm: 15, harvest: true },
    });
    b.share(rng, ids.featuredTrialId, networkCohortId, '2026-04-01');

    // A running trial for API writes, and fresh running trials for the imports (not shared: no audit trail).
    ids.writeTrialId = rng.uuid();
    const write = b.trial(rng, {
      id: ids.writeTrialId, ownerId: benchGrowerId, gardenId: garden, title: 'Autumn lettuce (benchmark writes)', crop: 'lettuce',
      plantingDate: '2026-09-01', endDate: null, lastLogDay: LAST_LOG_DAY, status: 'active', design: 'paired', pairs: plan.writePlots / 2, logs: null,
    });
    ids.writePlotIds = write.plotIds;
    for (let k = 0; k < plan.importRuns; k++) {
      const importTrialId = rng.uuid();
      const imp = b.trial(rng, {
        id: importTrialId, ownerId: benchGrowerId, gardenId: garden, title: `Logger import ${k + 1} (benchmark)`, crop: 'cucumber',
        plantingDate: '2026-08-01', endDate: null, lastLogDay: LAST_LOG_DAY, status: 'active', design: 'paired', pairs: plan.importPlots / 2, logs: null,
        plotLabel: (block, treatment) => `L${String(block).padStart(2, '0')}-${treatment === 'olla' ? 'O' : 'S'}`,
      });
      ids.importTrialIds.push(importTrialId);
      ids.importPlotLabels = imp.plotLabels;
    }
  }

  for (let c = phaseCohorts[0]!; c < phaseCohorts[1]!; c++) {
    const rng = new BenchRng(`cohort:${c}`);
    b.user(rng, `educator-${String(c + 1).padStart(3, '0')}@bench.seepwise.example`, 'educator', educatorIds[c]!);
    b.cohort(rng, smallCohortIds[c]!, `${placeName(rng)} ${rng.pick(['Biology class', 'Growers circle', 'Allotment programme', 'School garden club'])} ${c + 1}`, c % 2 ? 'class' : 'programme', educatorIds[c]!);
  }

  const { from, to } = phaseRange(plan, phase);
  const bigGrowers = plan.bigCohortTrials / 2;
  const smallMemberCount = new Map<string, number>();
  for (let g = from; g < to; g++) {
    const rng = new BenchRng(`grower:${g}`);
    const userId = b.user(rng, `grower-${String(g + 1).padStart(5, '0')}@bench.seepwise.example`, 'grower');
    const gardens = [b.garden(rng, userId)];
    if (rng.chance(0.1)) gardens.push(b.garden(rng, userId));
    b.member(rng, networkCohortId, userId, g + 1);
    let cohortId: string;
    if (g < bigGrowers) {
      cohortId = bigCohortId;
      b.member(rng, bigCohortId, userId, g);
    } else {
      const c = phase === 0 ? (g - bigGrowers) % half : half + ((g - from) % half);
      cohortId = smallCohortIds[c]!;
      const n = smallMemberCount.get(cohortId) ?? 0;
      smallMemberCount.set(cohortId, n + 1);
      b.member(rng, cohortId, userId, n);
    }
    for (const i of [2 * g, 2 * g + 1]) {
      const { rng: trng, spec } = regularTrial(plan, i, userId, gardens[i % gardens.length]!);
      b.trial(trng, spec);
      b.share(trng, spec.id, networkCohortId, spec.plantingDate);
      // A few growers withdrew a trial from their class cohort after a month (never from the big one).
      b.share(trng, spec.id, cohortId, spec.plantingDate, cohortId !== bigCohortId && trng.chance(0.02));
    }
  }
  return { rows: b.rows, ids };
}

async function timed<T>(fn: () => Promise<T>): Promise<{ value: T; ms: number }> {
  const t0 = performance.now();
  const value = await fn();
  return { value, ms: performance.now() - t0 };
}

const logSql = {
  water_events: `
    INSERT INTO water_events (trial_id, plot_id, entered_by, occurred_at, kind, volume_l, source, fertiliser, notes)
    SELECT s.trial_id, s.plot_id, s.owner_id, (s.d + time '13:00' + s.r1 * interval '3 hours') AT TIME ZONE 'UTC',
           CASE WHEN s.treatment = 'olla' THEN 'olla_refill' ELSE 'surface' END,
           round((CASE WHEN s.treatment = 'olla' THEN s.olla_fill_l * (0.55 + 0.4 * s.r2) ELSE s.area_m2 * s.surface_mm * (0.8 + 0.4 * s.r2) END)::numeric, 1)::float8,
           CASE WHEN s.r3 < 0.15 THEN 'rainwater' ELSE 'mains' END, s.r4 < 0.03,
           CASE WHEN s.r4 > 0.985 THEN 'Topped up after a windy afternoon.' ELSE '' END
      FROM (SELECT b.trial_id, p.id AS plot_id, b.owner_id, p.treatment, p.area_m2, b.olla_fill_l, b.surface_mm, b.surface_rate, b.refill_every, b.first_day,
                   g.d::date AS d, random() AS r1, random() AS r2, random() AS r3, random() AS r4, random() AS r5
              FROM bench_trial_params b
              JOIN plots p ON p.trial_id = b.trial_id
              CROSS JOIN LATERAL generate_series(b.first_day::timestamp, b.last_day::timestamp, interval '1 day') AS g(d)
             WHERE b.phase = $1 AND b.batch = $2) s
     WHERE CASE WHEN s.treatment = 'olla' THEN (s.d - s.first_day) % s.refill_every = 0 ELSE s.r5 < s.surface_rate END`,
  moisture_readings: `
    INSERT INTO moisture_readings (trial_id, plot_id, entered_by, taken_at, method, depth_cm, value)
    SELECT s.trial_id, s.plot_id, s.owner_id, (s.d + time '14:00' + s.r1 * interval '2 hours') AT TIME ZONE 'UTC', s.method, s.depth_cm,
           CASE s.method
             WHEN 'vwc' THEN round((CASE WHEN s.treatment = 'olla' THEN 21 + 7 * s.r2 ELSE 14 + 10 * s.r2 END)::numeric, 1)::float8
             WHEN 'tensiometer' THEN round(CASE WHEN s.treatment = 'olla' THEN 8 + 15 * s.r2 ELSE 12 + 40 * s.r2 END)::float8
             ELSE round(CASE WHEN s.treatment = 'olla' THEN 5 + 3 * s.r2 ELSE 3 + 4 * s.r2 END)::float8
           END
      FROM (SELECT b.trial_id, p.id AS plot_id, b.owner_id, p.treatment, b.method, b.depth_cm, g.d::date AS d, random() AS r1, random() AS r2
              FROM bench_trial_params b
              JOIN plots p ON p.trial_id = b.trial_id
              CROSS JOIN LATERAL generate_series(b.first_day::timestamp, b.last_day::timestamp, make_interval(days => b.moisture_every)) AS g(d)
             WHERE b.phase = $1 AND b.batch = $2) s`,
  harvests: `
    INSERT INTO harvests (trial_id, plot_id, entered_by, harvested_on, fresh_kg, count, marketable_kg, notes)
    SELECT s.trial_id, s.plot_id, s.owner_id, s.d, s.kg, GREATEST(1, round(s.kg / s.fruit_kg))::int, round((s.kg * (0.8 + 0.15 * s.r2))::numeric, 2)::float8, ''
      FROM (SELECT b.trial_id, p.id AS plot_id, b.owner_id, g.d::date AS d, b.fruit_kg, random() AS r2,
                   round((p.area_m2 * b.kg_per_m2_pick * CASE WHEN p.treatment = 'olla' THEN 1.0 ELSE 0.92 END * (0.5 + random()))::numeric, 2)::float8 + 0.01 AS kg
              FROM bench_trial_params b
              JOIN plots p ON p.trial_id = b.trial_id
              CROSS JOIN LATERAL generate_series(b.first_pick::timestamp, b.last_day::timestamp, make_interval(days => b.pick_every)) AS g(d)
             WHERE b.phase = $1 AND b.batch = $2 AND b.first_pick IS NOT NULL) s`,
  weather_days: `
    INSERT INTO weather_days (garden_id, day, forecast, t_min_c, t_max_c, rain_mm, rh_min_pct, rh_max_pct, wind_speed_ms, wind_height_m, sunshine_hours, entered_by)
    SELECT s.garden_id, s.d, false, round((s.tmax - 11 - 4 * s.r2)::numeric, 1)::float8, round(s.tmax::numeric, 1)::float8,
           CASE WHEN s.r3 < 0.08 THEN round((s.r4 * 18)::numeric, 1)::float8 ELSE 0 END,
           round(12 + 25 * s.r5)::float8, round(50 + 40 * s.r6)::float8, round((1 + 3.5 * s.r7)::numeric, 1)::float8, 2,
           round((8 + 5 * s.r8)::numeric, 1)::float8, s.owner_id
      FROM (SELECT w.garden_id, w.owner_id, g.d::date AS d,
                   29 + 7 * sin(2 * pi() * (extract(doy FROM g.d) - 110) / 365.0) + 6 * (random() - 0.5) AS tmax,
                   random() AS r2, random() AS r3, random() AS r4, random() AS r5, random() AS r6, random() AS r7, random() AS r8
              FROM (SELECT b.garden_id, gd.owner_id, min(b.first_day) AS f, max(b.last_day) AS l
                      FROM bench_trial_params b JOIN gardens gd ON gd.id = b.garden_id
                     WHERE b.phase = $1 GROUP BY b.garden_id, gd.owner_id) w
              CROSS JOIN LATERAL generate_series(w.f::timestamp, w.l::timestamp, interval '1 day') AS g(d)) s`,
};

/**
 * Loads one phase into the database behind `client` and returns what it did, step by step.
 * `log` receives progress lines.
 */
export async function loadPhase(
  client: pg.ClientBase,
  plan: ScenarioPlan,
  phase: number,
  passwordHash: string,
  log: (m: string) => void,
): Promise<{ ids: ScenarioIds; steps: LoadStep[]; ms: number }> {
  const t0 = performance.now();
  const steps: LoadStep[] = [];
  const { rows, ids } = buildPhase(plan, phase, passwordHash);
  await client.query(PARAMS_DDL);
  await client.query('SELECT setseed($1)', [phase === 0 ? 0.17 : 0.29]);
  // Bulk-load mode for this connection only: the generated rows are consistent by construction, so
  // foreign-key triggers are skipped (indexes and unique constraints are still maintained).
  await client.query('SET session_replication_role = replica');
  try {
    return await loadRows(client, phase, rows, ids, steps, t0, log);
  } finally {
    await client.query('RESET session_replication_role');
  }
}

async function loadRows(client: pg.ClientBase, phase: number, rows: Rows, ids: ScenarioIds, steps: LoadStep[], t0: number, log: (m: string) => void) {
  for (const table of Object.keys(columns) as (keyof Rows)[]) {
    const { value, ms } = await timed(() => copyRows(client, table, columns[table], rows[table]));
    steps.push({ table, method: 'COPY', rows: value, ms });
  }
  log(`phase ${phase}: ${rows.trials.length} trials, ${rows.plots.length} plots, ${rows.users.length} people copied`);
  const batches = Math.max(0, ...rows.bench_trial_params.map((r) => r[4] as number)) + 1;
  for (const table of ['water_events', 'moisture_readings', 'harvests'] as const) {
    let total = 0;
    let ms = 0;
    for (let batch = 0; batch < batches; batch++) {
      const r = await timed(() => client.query(logSql[table], [phase, batch]));
      total += r.value.rowCount ?? 0;
      ms += r.ms;
    }
    steps.push({ table, method: 'INSERT ... SELECT generate_series', rows: total, ms });
    log(`phase ${phase}: ${table} ${total.toLocaleString('en')} rows in ${(ms / 1000).toFixed(1)} s`);
  }
  const w = await timed(() => client.query(logSql.weather_days, [phase]));
  steps.push({ table: 'weather_days', method: 'INSERT ... SELECT generate_series', rows: w.value.rowCount ?? 0, ms: w.ms });
  log(`phase ${phase}: weather_days ${(w.value.rowCount ?? 0).toLocaleString('en')} rows in ${(w.ms / 1000).toFixed(1)} s`);
  return { ids, steps, ms: performance.now() - t0 };
}

/** The ids of the scenario's actors and featured trials, without loading anything (they are deterministic): for `--reuse-db`. */
export function scenarioIds(plan: ScenarioPlan): ScenarioIds {
  return buildPhase(plan, 0, 'unused').ids;
}
