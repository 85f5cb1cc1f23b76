/**
 * The permission matrix: generated from the route table itself (app.locals.routeSpecs), it
 * calls every API route as anonymous, owner, another grower, cohort lead, cohort observer and
 * admin, and checks each gets exactly what the route's declared access allows. A new route is
 * covered the moment it is added; a new path parameter needs a fixture below.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Access } from '../../server/http/access';
import type { RouteSpec } from '../../server/http/route';
import { createObjectStorage, type ObjectStorage } from '../../server/lib/object-storage';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

type Actor = 'anonymous' | 'owner' | 'otherGrower' | 'lead' | 'observer' | 'admin';
const actors: Actor[] = ['anonymous', 'owner', 'otherGrower', 'lead', 'observer', 'admin'];

/** What each access rule promises: allowed actors, and the status every other actor gets. */
function expectation(rule: Access): { allowed: Actor[]; denied: number } {
  switch (rule.kind) {
    case 'public':
      return { allowed: actors, denied: 0 };
    case 'signed-in':
      return { allowed: actors.filter((a) => a !== 'anonymous'), denied: 403 };
    case 'role': {
      const map: Record<Actor, string | null> = { anonymous: null, owner: 'grower', otherGrower: 'grower', lead: 'educator', observer: 'grower', admin: 'admin' };
      return { allowed: actors.filter((a) => map[a] && rule.roles.includes(map[a] as 'grower')), denied: 403 };
    }
    case 'cohort-lead':
      return { allowed: ['lead'], denied: 404 };
    case 'cohort-member':
      return { allowed: ['lead', 'owner', 'observer'], denied: 404 };
    case 'resource':
      // The owner always; cohort readers (lead, observer) too when the rule is 'reader'.
      return { allowed: rule.level === 'owner' ? ['owner'] : ['owner', 'lead', 'observer'], denied: 404 };
  }
}

let t: TestApp;
const agents = {} as Record<Actor, ApiAgent>;
const ids = {} as Record<string, string>;

/**
 * Rebuilds every fixture before each route, so destructive calls in one route do not leak into
 * the next: a cohort led by `lead` with `owner` as contributor and `observer` as observer, and
 * the owner's garden, shared trial, plot, pot, seep test, logs of every kind and a photo.
 */
async function resetFixtures() {
  await t.ds.query('DELETE FROM cohorts');
  await t.ds.query('DELETE FROM gardens');
  await t.ds.query('DELETE FROM pots');
  const one = async (sql: string, params: unknown[]) => ((await t.ds.query(sql, params)) as { id: string }[])[0]!.id;
  ids.cohortId = await one(`INSERT INTO cohorts (name, lead_id, join_code) VALUES ('Matrix', $1, 'MATRXC2D') RETURNING id`, [ids.leadUser]);
  ids.membershipId = await one(`INSERT INTO cohort_memberships (cohort_id, user_id, role, pseudonym) VALUES ($1, $2, 'contributor', 'Grower A1') RETURNING id`, [
    ids.cohortId,
    ids.ownerUser,
  ]);
  await t.ds.query(`INSERT INTO cohort_memberships (cohort_id, user_id, role, pseudonym) VALUES ($1, $2, 'observer', 'Observer B2')`, [ids.cohortId, ids.observerUser]);
  ids.gardenId = await one(
    `INSERT INTO gardens (owner_id, name, latitude_deg, longitude_deg, elevation_m, soil_texture) VALUES ($1, 'Back yard', 35.1, -106.6, 1500, 'sandy_loam') RETURNING id`,
    [ids.ownerUser],
  );
  ids.trialId = await one(
    `INSERT INTO trials (garden_id, owner_id, title, crop, planting_date, status) VALUES ($1, $2, 'Matrix tomatoes', 'tomato', '2026-05-01', 'active') RETURNING id`,
    [ids.gardenId, ids.ownerUser],
  );
  await t.ds.query(`INSERT INTO trial_shares (trial_id, cohort_id) VALUES ($1, $2)`, [ids.trialId, ids.cohortId]);
  ids.plotId = await one(`INSERT INTO plots (trial_id, label, treatment, block_key, area_m2) VALUES ($1, 'A1', 'olla', 'A', 2) RETURNING id`, [ids.trialId]);
  ids.potId = await one(`INSERT INTO pots (owner_id, label, capacity_l, widest_diameter_cm, shape, make, plot_id) VALUES ($1, 'P1', 8, 25, 'globe', 'wheel_thrown', $2) RETURNING id`, [
    ids.ownerUser,
    ids.plotId,
  ]);
  ids.seepTestId = await one(`INSERT INTO seep_tests (pot_id, tested_on, setting, litres_lost, hours) VALUES ($1, '2026-04-20', 'air', 1.2, 24) RETURNING id`, [ids.potId]);
  ids.waterEventId = await one(`INSERT INTO water_events (trial_id, plot_id, occurred_at, kind, volume_l, pot_id) VALUES ($1, $2, '2026-06-01T07:00Z', 'olla_refill', 6, $3) RETURNING id`, [
    ids.trialId,
    ids.plotId,
    ids.potId,
  ]);
  ids.moistureReadingId = await one(`INSERT INTO moisture_readings (trial_id, plot_id, taken_at, method, depth_cm, value) VALUES ($1, $2, '2026-06-01T07:00Z', 'vwc', 15, 22) RETURNING id`, [
    ids.trialId,
    ids.plotId,
  ]);
  ids.harvestId = await one(`INSERT INTO harvests (trial_id, plot_id, harvested_on, fresh_kg) VALUES ($1, $2, '2026-07-20', 1.4) RETURNING id`, [ids.trialId, ids.plotId]);
  ids.observationId = await one(`INSERT INTO observations (trial_id, plot_id, observed_at, text) VALUES ($1, $2, '2026-06-02T07:00Z', 'Leaf curl') RETURNING id`, [ids.trialId, ids.plotId]);
  const key = `observations/${ids.observationId}/matrix.png`;
  await storage.put(key, tinyPng, 'image/png');
  ids.photoId = await one(`INSERT INTO photos (observation_id, storage_key, content_type, bytes) VALUES ($1, $2, 'image/png', $3) RETURNING id`, [
    ids.observationId,
    key,
    tinyPng.length,
  ]);
  ids.weatherDayId = await one(`INSERT INTO weather_days (garden_id, day, t_min_c, t_max_c) VALUES ($1, '2026-06-01', 14, 31) RETURNING id`, [ids.gardenId]);
}

/** A 1×1 PNG. */
const tinyPng = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');
let storage: ObjectStorage;

beforeAll(async () => {
  t = await startTestApp({ authLimits: { signInPerWindow: 1000, resetPerWindow: 1000, windowMs: 60_000 } });
  storage = createObjectStorage({ endpoint: t.s3.endpoint, bucket: 'test-photos', region: 'us-east-1', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' });
  for (const actor of actors) {
    agents[actor] = new ApiAgent(t.app);
    if (actor === 'anonymous') {
      await agents[actor].refreshCsrf();
      continue;
    }
    const u = await agents[actor].signUp({ email: uniqueEmail(actor), role: actor === 'lead' ? 'educator' : 'grower' });
    if (actor === 'admin') await t.ds.query(`UPDATE users SET role = 'admin' WHERE id = $1`, [u.id]);
    ids[`${actor}User`] = u.id;
  }
  await resetFixtures();
});

afterAll(async () => {
  await t.close();
});

/** Path parameters and the fixture each stands for. */
const paramFixture: Record<string, () => string> = {
  cohortId: () => ids.cohortId!,
  membershipId: () => ids.membershipId!,
  userId: () => ids.otherGrowerUser!,
  gardenId: () => ids.gardenId!,
  trialId: () => ids.trialId!,
  plotId: () => ids.plotId!,
  potId: () => ids.potId!,
  seepTestId: () => ids.seepTestId!,
  waterEventId: () => ids.waterEventId!,
  moistureReadingId: () => ids.moistureReadingId!,
  harvestId: () => ids.harvestId!,
  observationId: () => ids.observationId!,
  photoId: () => ids.photoId!,
  weatherDayId: () => ids.weatherDayId!,
  table: () => 'water-events',
};

function fillPath(path: string) {
  return path.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    const f = paramFixture[name];
    if (!f) throw new Error(`permission matrix: add a fixture for path parameter :${name}`);
    return f();
  });
}

describe('permission matrix', () => {
  it('covers a non-trivial route table', () => {
    const specs = t.app.locals.routeSpecs as RouteSpec[];
    expect(specs.length).toBeGreaterThan(20);
  });

  it('guards every route that names a grower-owned record or a cohort by that record, not by a role', () => {
    // A rule like signedIn on /trials/:trialId would pass the matrix below while leaking every
    // trial to every account; this check stops such a table entry.
    const specs = t.app.locals.routeSpecs as RouteSpec[];
    const loose = specs.filter((s) => {
      const first = /:([A-Za-z]+)/.exec(s.path)?.[1];
      if (!first) return false;
      if (first === 'userId') return !(s.access.kind === 'role' && s.access.roles.join() === 'admin');
      return s.access.kind !== 'resource' && s.access.kind !== 'cohort-lead' && s.access.kind !== 'cohort-member';
    });
    expect(loose.map((s) => `${s.method} ${s.path}`)).toEqual([]);
  });

  it('gives every actor on every route exactly what its access rule says', async () => {
    const specs = t.app.locals.routeSpecs as RouteSpec[];
    const leaks: string[] = [];
    for (const spec of specs) {
      // Sign-out would end the actors' sessions; it is covered by the auth tests.
      if (spec.path === '/auth/sign-out') continue;
      await resetFixtures();
      const { allowed, denied } = expectation(spec.access);
      // Denied actors first, so an allowed destructive call cannot hide a leak.
      const order = [...actors.filter((a) => !allowed.includes(a)), ...actors.filter((a) => allowed.includes(a))];
      for (const actor of order) {
        const url = `/api${fillPath(spec.path)}`;
        const agent = agents[actor];
        const res = spec.method === 'get' ? await agent.get(url) : await agent[spec.method](url, {});
        const expectedDenial = actor === 'anonymous' && spec.access.kind !== 'public' ? 401 : denied;
        if (allowed.includes(actor)) {
          if ([401, 403].includes(res.status) || (res.status === 404 && spec.access.kind !== 'public')) {
            leaks.push(`${spec.method.toUpperCase()} ${spec.path} as ${actor}: expected access, got ${res.status} ${res.body?.error?.message}`);
          }
        } else if (res.status !== expectedDenial) {
          leaks.push(`${spec.method.toUpperCase()} ${spec.path} as ${actor}: expected ${expectedDenial}, got ${res.status}`);
        }
        expect(res.status).toBeLessThan(500);
      }
    }
    expect(leaks).toEqual([]);
  }, 300_000);
});
