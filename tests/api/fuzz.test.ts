/**
 * Property-based fuzzing of every state-changing API route, read from the route table itself
 * (app.locals.routeSpecs, method ≠ get). Each route is called on real resources its caller may
 * change (the permission-matrix fixture idea: the caller owns the garden, trial, plot, pot and
 * logs, leads the cohort and is an admin) with arbitrary JSON, wrong types, huge strings, deep
 * nesting and prototype-pollution keys. Whatever arrives: never a 5xx, always the one error shape
 * when refused, and a refused request writes not one row in any table.
 */
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorCodes } from '@shared/api-error';
import type { RouteSpec } from '../../server/http/route';
import { createObjectStorage, type ObjectStorage } from '../../server/lib/object-storage';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
let me: ApiAgent;
let anonymous: ApiAgent;
let storage: ObjectStorage;
const ids = {} as Record<string, string>;
let meEmail = '';
const PASSWORD = 'tomato-basin-clay-42';

/** A 1×1 PNG. */
const tinyPng = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

/** The photo fixture's object, stored once (a deleted object is simply gone; the row is what routes check). */
const PHOTO_KEY = 'observations/fuzz/fixture.png';

/** The caller's world, rebuilt whenever a successful request changed it. */
async function resetFixtures() {
  await t.ds.query('DELETE FROM cohorts');
  await t.ds.query('DELETE FROM gardens');
  await t.ds.query('DELETE FROM pots');
  await t.ds.query(`UPDATE users SET role = 'admin', disabled_at = NULL WHERE id = $1`, [ids.meUser]);
  await t.ds.query(`UPDATE users SET role = 'grower', disabled_at = NULL WHERE id = $1`, [ids.otherUser]);
  const one = async (sql: string, params: unknown[]) => ((await t.ds.query(sql, params)) as { id: string }[])[0]!.id;
  ids.cohortId = await one(`INSERT INTO cohorts (name, lead_id, join_code) VALUES ('Fuzz', $1, 'FUZZC2D3') RETURNING id`, [ids.meUser]);
  ids.membershipId = await one(
    `INSERT INTO cohort_memberships (cohort_id, user_id, role, pseudonym) VALUES ($1, $2, 'contributor', 'Grower F1') RETURNING id`,
    [ids.cohortId, ids.otherUser],
  );
  ids.gardenId = await one(
    `INSERT INTO gardens (owner_id, name, latitude_deg, longitude_deg, elevation_m, soil_texture) VALUES ($1, 'Back yard', 35.1, -106.6, 1500, 'sandy_loam') RETURNING id`,
    [ids.meUser],
  );
  ids.trialId = await one(
    `INSERT INTO trials (garden_id, owner_id, title, crop, planting_date, status) VALUES ($1, $2, 'Fuzz tomatoes', 'tomato', '2026-05-01', 'active') RETURNING id`,
    [ids.gardenId, ids.meUser],
  );
  await t.ds.query(`INSERT INTO trial_shares (trial_id, cohort_id) VALUES ($1, $2)`, [ids.trialId, ids.cohortId]);
  ids.plotId = await one(`INSERT INTO plots (trial_id, label, treatment, block_key, area_m2) VALUES ($1, 'A1', 'olla', 'A', 2) RETURNING id`, [ids.trialId]);
  ids.potId = await one(
    `INSERT INTO pots (owner_id, label, capacity_l, widest_diameter_cm, shape, make, plot_id) VALUES ($1, 'P1', 8, 25, 'globe', 'wheel_thrown', $2) RETURNING id`,
    [ids.meUser, ids.plotId],
  );
  ids.seepTestId = await one(`INSERT INTO seep_tests (pot_id, tested_on, setting, litres_lost, hours) VALUES ($1, '2026-04-20', 'air', 1.2, 24) RETURNING id`, [
    ids.potId,
  ]);
  ids.waterEventId = await one(
    `INSERT INTO water_events (trial_id, plot_id, occurred_at, kind, volume_l, pot_id) VALUES ($1, $2, '2026-06-01T07:00Z', 'olla_refill', 6, $3) RETURNING id`,
    [ids.trialId, ids.plotId, ids.potId],
  );
  ids.moistureReadingId = await one(
    `INSERT INTO moisture_readings (trial_id, plot_id, taken_at, method, depth_cm, value) VALUES ($1, $2, '2026-06-01T07:00Z', 'vwc', 15, 22) RETURNING id`,
    [ids.trialId, ids.plotId],
  );
  ids.harvestId = await one(`INSERT INTO harvests (trial_id, plot_id, harvested_on, fresh_kg) VALUES ($1, $2, '2026-07-20', 1.4) RETURNING id`, [
    ids.trialId,
    ids.plotId,
  ]);
  ids.observationId = await one(
    `INSERT INTO observations (trial_id, plot_id, observed_at, text) VALUES ($1, $2, '2026-06-02T07:00Z', 'Leaf curl') RETURNING id`,
    [ids.trialId, ids.plotId],
  );
  ids.photoId = await one(`INSERT INTO photos (observation_id, storage_key, content_type, bytes) VALUES ($1, $2, 'image/png', $3) RETURNING id`, [
    ids.observationId,
    PHOTO_KEY,
    tinyPng.length,
  ]);
  ids.weatherDayId = await one(`INSERT INTO weather_days (garden_id, day, t_min_c, t_max_c) VALUES ($1, '2026-06-01', 14, 31) RETURNING id`, [ids.gardenId]);
}

/** Path parameters and the fixture each stands for (a new one fails the test with its name). */
const paramFixture: Record<string, () => string> = {
  cohortId: () => ids.cohortId!,
  membershipId: () => ids.membershipId!,
  userId: () => ids.otherUser!,
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
    if (!f) throw new Error(`fuzz: add a fixture for path parameter :${name}`);
    return f();
  });
}

/**
 * Every row written in any table by a committed transaction bumps one counter (row triggers
 * installed in this file's own test database; a rolled-back write leaves it as it was). The
 * session table is left out, since every request touches its session, and compared by row count.
 */
async function installWriteCounter() {
  const tables = (
    (await t.ds.query(`SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY 1`)) as {
      table_name: string;
    }[]
  )
    .map((r) => r.table_name)
    .filter((name) => name !== 'session');
  await t.ds.query(`CREATE TABLE fuzz_writes (n bigint NOT NULL)`);
  await t.ds.query(`INSERT INTO fuzz_writes VALUES (0)`);
  await t.ds.query(`CREATE FUNCTION fuzz_count() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN UPDATE fuzz_writes SET n = n + 1; RETURN NULL; END $$`);
  for (const name of tables)
    await t.ds.query(`CREATE TRIGGER fuzz_count AFTER INSERT OR UPDATE OR DELETE ON "${name}" FOR EACH ROW EXECUTE FUNCTION fuzz_count()`);
  return tables.length;
}

/** Rows written so far (all tables but the session table) and the number of sessions. */
async function snapshot(): Promise<{ writes: string; sessions: string }> {
  const [row] = (await t.ds.query(`SELECT (SELECT n::text FROM fuzz_writes) AS writes, (SELECT count(*)::text FROM session) AS sessions`)) as {
    writes: string;
    sessions: string;
  }[];
  return row!;
}

/**
 * The one error shape: { error: { code, message, reason?, params?, details? } } and nothing else
 * (server/lib/app-error.ts; `reason` names the exact case in snake_case for the client to word in
 * the reader's language, `params` fills its placeholders).
 */
function expectErrorShape(body: unknown, where: string) {
  const b = body as { error?: { code?: unknown; message?: unknown; reason?: unknown; params?: unknown } };
  expect(Object.keys(b ?? {}), where).toEqual(['error']);
  expect(
    Object.keys(b.error!).filter((k) => !['code', 'message', 'reason', 'params', 'details'].includes(k)),
    where,
  ).toEqual([]);
  expect(errorCodes as readonly unknown[], where).toContain(b.error!.code);
  expect(typeof b.error!.message, where).toBe('string');
  if (b.error!.reason !== undefined) expect(b.error!.reason, where).toMatch(/^[a-z][a-z0-9_]*$/);
  if (b.error!.params !== undefined) expect(typeof b.error!.params, where).toBe('object');
}

type Body = { raw: string } | { json: unknown };

/** Sends a body (raw text or a value to serialise) as JSON; "@@name" strings become fixture ids. */
async function send(spec: RouteSpec, url: string, body: Body) {
  const agent = spec.access.kind === 'public' ? anonymous : me;
  let text = 'raw' in body ? body.raw : (JSON.stringify(body.json) ?? 'null');
  text = text.replace(/"@@([A-Za-z]+)"/g, (_m, name: string) => JSON.stringify(ids[name] ?? name));
  return agent.agent[spec.method](url).set('X-CSRF-Token', agent.csrf).set('Content-Type', 'application/json').send(text);
}

/** After a success: rebuild what it changed, and the sessions when it was an account route. */
async function recover(spec: RouteSpec | null, changed: boolean) {
  if (changed) await resetFixtures();
  if (spec && !/^\/(auth|account|admin|invitations)\b/.test(spec.path)) return;
  await anonymous.refreshCsrf();
  const session = await me.refreshCsrf();
  if (session.user?.id !== ids.meUser) {
    const res = await me.signIn(meEmail, PASSWORD);
    if (res.status !== 200) throw new Error(`fuzz: could not sign the caller back in (${res.status})`);
  }
}

/** Sends a body under another content type than JSON (no body parser takes it: req.body stays undefined). */
async function sendAs(spec: RouteSpec, url: string, contentType: string, text: string) {
  const agent = spec.access.kind === 'public' ? anonymous : me;
  return agent.agent[spec.method](url).set('X-CSRF-Token', agent.csrf).set('Content-Type', contentType).send(text);
}

/** One request: never 5xx; refused → one error shape and not one row changed; no prototype pollution. */
async function check(spec: RouteSpec, body: Body, expectStatus?: number) {
  const url = `/api${fillPath(spec.path)}`;
  const where = `${spec.method.toUpperCase()} ${spec.path} ${('raw' in body ? body.raw : (JSON.stringify(body.json) ?? '')).slice(0, 120)}`;
  const before = await snapshot();
  const res = await send(spec, url, body);
  expect(res.status, `${where} → ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`).toBeLessThan(500);
  if (expectStatus) expect(res.status, where).toBe(expectStatus);
  expect(({} as Record<string, unknown>).polluted, where).toBeUndefined();
  expect(({} as Record<string, unknown>).role, where).toBeUndefined();
  if (res.status >= 400) {
    expectErrorShape(res.body, where);
    expect(await snapshot(), `${where}: a refused request changed the database`).toEqual(before);
  } else {
    const after = await snapshot();
    await recover(spec, after.writes !== before.writes);
  }
  return res;
}

// Field names used by the API's input schemas: objects built from them reach past "unknown key" and into the type checks.
const knownKeys = [
  'name',
  'notes',
  'latitudeDeg',
  'longitudeDeg',
  'elevationM',
  'soilTexture',
  'title',
  'crop',
  'cropName',
  'variety',
  'plantingDate',
  'endDate',
  'design',
  'treatments',
  'question',
  'protocolNotes',
  'kcOverrides',
  'stressThresholds',
  'status',
  'seed',
  'cohortId',
  'trialId',
  'label',
  'treatment',
  'blockKey',
  'areaM2',
  'setting',
  'mulch',
  'lid',
  'plantCount',
  'plotId',
  'potId',
  'occurredAt',
  'kind',
  'volumeL',
  'source',
  'fertiliser',
  'idempotencyKey',
  'takenAt',
  'method',
  'depthCm',
  'value',
  'harvestedOn',
  'freshKg',
  'count',
  'marketableKg',
  'observedAt',
  'text',
  'entries',
  'type',
  'entry',
  'day',
  'tMinC',
  'tMaxC',
  'rainMm',
  'email',
  'password',
  'displayName',
  'role',
  'currentPassword',
  'newPassword',
  'token',
  'code',
  'description',
  'capacity',
  'licence',
  'closed',
  'disabled',
  'unitSystem',
  'language',
  'rows',
  'fileName',
  'capacityL',
  'widestDiameterCm',
  'shape',
  'make',
  'testedOn',
  'litresLost',
  'hours',
  'reason',
  'refillReminders',
  'refillThresholdPct',
  'frostWarnings',
  'weeklyDigest',
  '__proto__',
  'constructor',
  'prototype',
];
const nastyStrings = [
  '',
  ' ',
  '\u0000',
  '\uFFFF',
  '\uD800',
  '../../etc/passwd',
  "'; DROP TABLE users; --",
  '=1+1',
  '<script>alert(1)</script>',
  'NaN',
  '1e309',
  '-0',
  '2026-02-30',
  '2026-06-01T07:00:00Z',
  '9999-12-31',
  '0000-01-01T00:00:00Z',
  '00000000-0000-0000-0000-000000000000',
  'olla',
  'surface',
  'admin',
  'closed',
  'active',
];
const idPlaceholders = Object.keys(paramFixture)
  .filter((k) => k !== 'table')
  .map((k) => `@@${k}`);
const leaf = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.constantFrom(...nastyStrings, ...idPlaceholders),
  fc.double(),
  fc.integer(),
  fc.boolean(),
  fc.constant(null),
  fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
);
const value = fc.oneof(
  { depthSize: 'small' },
  leaf,
  fc.array(leaf, { maxLength: 4 }),
  fc.dictionary(fc.constantFrom(...knownKeys), leaf, { maxKeys: 3 }),
  fc.jsonValue({ maxDepth: 3 }),
);
/** Anything, turned into JSON text (BigInts as strings, everything else as JSON.stringify has it). */
const anythingAsJson = fc
  .anything({
    maxDepth: 3,
    withBigInt: true,
    withDate: true,
    withMap: true,
    withSet: true,
    withTypedArray: true,
    withSparseArray: true,
    withNullPrototype: true,
    withBoxedValues: true,
  })
  .map((v) => JSON.stringify(v, (_k, x) => (typeof x === 'bigint' ? x.toString() : x)) ?? 'null');
const bodies: fc.Arbitrary<Body> = fc.oneof(
  fc.jsonValue({ maxDepth: 4 }).map((json) => ({ json })),
  anythingAsJson.map((raw) => ({ raw })),
  fc.dictionary(fc.constantFrom(...knownKeys), value, { minKeys: 1, maxKeys: 8 }).map((json) => ({ json })),
  fc.string({ maxLength: 60 }).map((raw) => ({ raw })),
);

/** Runs per route (fast-check); FUZZ_SEED=<n> explores other inputs than the fixed default seed. */
const NUM_RUNS = 15;
const BODY_LIMIT = 1024 * 1024;
const isImport = (s: RouteSpec) => /\/import$/.test(s.path);

beforeAll(async () => {
  t = await startTestApp({ authLimits: { signInPerWindow: 100_000, resetPerWindow: 100_000, windowMs: 60_000 } });
  storage = createObjectStorage({ endpoint: t.s3.endpoint, bucket: 'test-photos', region: 'us-east-1', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' });
  me = new ApiAgent(t.app);
  meEmail = uniqueEmail('fuzzer');
  ids.meUser = (await me.signUp({ email: meEmail, password: PASSWORD, role: 'educator' })).id;
  ids.otherUser = (await new ApiAgent(t.app).signUp({ email: uniqueEmail('other') })).id;
  anonymous = new ApiAgent(t.app);
  await anonymous.refreshCsrf();
  expect(await installWriteCounter()).toBeGreaterThan(15);
  await storage.put(PHOTO_KEY, tinyPng, 'image/png');
  await recover(null, true);
});

afterAll(async () => {
  await t?.close();
});

const stateChanging = () => (t.app.locals.routeSpecs as RouteSpec[]).filter((s) => s.method !== 'get');

describe('fuzzing every state-changing route', () => {
  it('finds a non-trivial set of state-changing routes in the route table', () => {
    // Guards against the fuzz loops below silently testing nothing.
    expect(stateChanging().length).toBeGreaterThan(30);
  });

  it('notices a write: the counter the refusal checks rely on moves when rows change', async () => {
    const before = await snapshot();
    await resetFixtures();
    expect((await snapshot()).writes).not.toBe(before.writes);
  });

  it('answers arbitrary JSON, wrong types and garbage with < 500, the one error shape, and no change when refused', async () => {
    for (const spec of stateChanging()) {
      await fc.assert(
        fc.asyncProperty(bodies, async (body) => {
          await check(spec, body);
        }),
        { numRuns: NUM_RUNS, seed: Number(process.env.FUZZ_SEED ?? 20261202), endOnFailure: true },
      );
    }
  }, 300_000);

  it('survives almost 1 MB of text in the fields a route reads, and refuses a body over the limit with 413', async () => {
    // Nine text fields of 110 kB each: just under the 1 MB body limit, far over every field's maximum.
    const bigFields = Object.fromEntries(
      ['name', 'notes', 'title', 'question', 'protocolNotes', 'text', 'label', 'description', 'displayName'].map((k) => [k, 'ẋ'.repeat(36_000)]),
    );
    expect(JSON.stringify(bigFields).length * 3).toBeLessThan(BODY_LIMIT);
    for (const spec of stateChanging()) {
      await check(spec, { json: bigFields });
      // The import route has its own 80 MB limit (a parsed file); it refuses this body by validation instead.
      const over = await check(spec, { json: { notes: 'x'.repeat(BODY_LIMIT + 10) } }, isImport(spec) ? 400 : 413);
      expect(over.body.error.code).toBe(isImport(spec) ? 'validation_failed' : 'payload_too_large');
    }
  }, 180_000);

  it('answers bodies that are not JSON at all (text, form, XML, none) with < 500 and the one error shape, changing nothing', async () => {
    const variants: [string, string][] = [
      ['text/plain', 'hello'],
      ['application/x-www-form-urlencoded', 'name=x&__proto__[polluted]=1&constructor[prototype][polluted]=1'],
      ['application/xml', '<?xml version="1.0"?><!DOCTYPE x [<!ENTITY e SYSTEM "file:///etc/passwd">]><x>&e;</x>'],
      ['application/json; charset=utf-16', '{}'],
      ['application/json', ''],
    ];
    for (const spec of stateChanging()) {
      for (const [type, text] of variants) {
        const before = await snapshot();
        const res = await sendAs(spec, `/api${fillPath(spec.path)}`, type, text);
        const where = `${spec.method.toUpperCase()} ${spec.path} as ${type}`;
        expect(res.status, `${where} → ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`).toBeLessThan(500);
        expect(({} as Record<string, unknown>).polluted, where).toBeUndefined();
        if (res.status >= 400) {
          expectErrorShape(res.body, where);
          expect(await snapshot(), where).toEqual(before);
        } else await recover(spec, (await snapshot()).writes !== before.writes);
      }
    }
  }, 180_000);

  it('survives 10,000 levels of nesting in objects and arrays', async () => {
    const deepObject = '{"a":'.repeat(10_000) + '1' + '}'.repeat(10_000);
    const deepArray = '['.repeat(10_000) + ']'.repeat(10_000);
    const deepInField = `{"name":${deepArray},"notes":${deepObject},"rows":${deepArray},"entries":${deepArray},"text":${deepObject}}`;
    for (const spec of stateChanging()) {
      for (const raw of [deepObject, deepInField]) await check(spec, { raw });
    }
    // A top-level array goes through the same parser for every route; once is enough.
    await check(stateChanging()[0]!, { raw: deepArray });
  }, 180_000);

  it('ignores prototype-pollution keys: no polluted prototype, no role or ownership taken over', async () => {
    const payloads = [
      '{"__proto__":{"polluted":"yes","role":"admin","isAdmin":true}}',
      '{"constructor":{"prototype":{"polluted":"yes"}},"prototype":{"polluted":"yes"},"name":"P","title":"P","text":"P"}',
      `{"__proto__":{"ownerId":"@@otherUser","userId":"@@otherUser"},"name":"Proto garden","latitudeDeg":35,"longitudeDeg":-106,"elevationM":10,"soilTexture":"loam"}`,
      '{"kind":"water-events","rows":[{"__proto__":{"plotLabel":"A1"},"constructor":{"prototype":{"polluted":1}}}],"entries":[{"type":"water","entry":{"__proto__":{"polluted":1}}}]}',
    ];
    for (const spec of stateChanging()) {
      for (const raw of payloads) await check(spec, { raw });
    }
    const [meRow] = (await t.ds.query('SELECT role FROM users WHERE id = $1', [ids.meUser])) as { role: string }[];
    expect(meRow!.role).toBe('admin');
    const stolen = (await t.ds.query('SELECT count(*)::int AS n FROM gardens WHERE owner_id = $1', [ids.otherUser])) as { n: number }[];
    expect(stolen[0]!.n).toBe(0);
  }, 180_000);
});
