/**
 * Hostile input at the edges: CSRF on every state-changing route (read from the route table),
 * photo uploads that lie about what they are or where they go, formula cells in cohort exports,
 * HTML in e-mails, and brute force against sign-in and password reset.
 *
 * Already covered elsewhere and not repeated here: the old session cookie is worthless after
 * sign-out ("makes the old session cookie worthless after sign-out") and after a password change
 * ("changing the password keeps this session and ends the others") in tests/api/auth.test.ts;
 * formula neutralisation in trial exports in tests/api/export.test.ts; a sign-out on one app
 * instance ending the session on the other in tests/resilience/two-instances.test.ts.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { crc32, deflateSync } from 'node:zlib';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RouteSpec } from '../../server/http/route';
import { makePairedTrial } from '../helpers/notebook-fixtures';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
const ids = {} as Record<string, string>;
let me: ApiAgent;
let anonymous: ApiAgent;

beforeAll(async () => {
  t = await startTestApp({ authLimits: { signInPerWindow: 5, resetPerWindow: 3, windowMs: 60_000 } });
  me = new ApiAgent(t.app);
  ids.meUser = (await me.signUp({ email: uniqueEmail('csrf'), role: 'educator' })).id;
  await t.ds.query(`UPDATE users SET role = 'admin' WHERE id = $1`, [ids.meUser]);
  ids.otherUser = (await new ApiAgent(t.app).signUp({ email: uniqueEmail('other') })).id;
  anonymous = new ApiAgent(t.app);
  await anonymous.refreshCsrf();
});

afterAll(async () => {
  await t?.close();
});

/** Every table's row count and a checksum of its rows (the session table by count: reads touch it). */
async function snapshot(): Promise<Record<string, string>> {
  const tables = (
    (await t.ds.query(`SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE'`)) as {
      table_name: string;
    }[]
  ).map((r) => r.table_name);
  const parts = tables.map((tb) =>
    tb === 'session'
      ? `SELECT '${tb}' AS t, count(*)::text AS v FROM "${tb}"`
      : `SELECT '${tb}' AS t, count(*)::text || ':' || coalesce(md5(string_agg(x::text, '|' ORDER BY x::text)), '') AS v FROM "${tb}" x`,
  );
  const rows = (await t.ds.query(parts.join(' UNION ALL '))) as { t: string; v: string }[];
  return Object.fromEntries(rows.map((r) => [r.t, r.v]));
}

/** The caller (admin, cohort lead) owns a garden, an active shared trial, a plot, a pot and one log of each kind. */
async function fixtures() {
  const one = async (sql: string, params: unknown[]) => ((await t.ds.query(sql, params)) as { id: string }[])[0]!.id;
  ids.cohortId = await one(`INSERT INTO cohorts (name, lead_id, join_code) VALUES ('CSRF', $1, 'CSRFC2D3') RETURNING id`, [ids.meUser]);
  ids.membershipId = await one(
    `INSERT INTO cohort_memberships (cohort_id, user_id, role, pseudonym) VALUES ($1, $2, 'contributor', 'Grower C1') RETURNING id`,
    [ids.cohortId, ids.otherUser],
  );
  ids.gardenId = await one(
    `INSERT INTO gardens (owner_id, name, latitude_deg, longitude_deg, elevation_m, soil_texture) VALUES ($1, 'Back yard', 35.1, -106.6, 1500, 'sandy_loam') RETURNING id`,
    [ids.meUser],
  );
  ids.trialId = await one(
    `INSERT INTO trials (garden_id, owner_id, title, crop, planting_date, status) VALUES ($1, $2, 'CSRF tomatoes', 'tomato', '2026-05-01', 'active') RETURNING id`,
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
    `INSERT INTO water_events (trial_id, plot_id, occurred_at, kind, volume_l) VALUES ($1, $2, '2026-06-01T07:00Z', 'surface', 6) RETURNING id`,
    [ids.trialId, ids.plotId],
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
  ids.photoId = await one(
    `INSERT INTO photos (observation_id, storage_key, content_type, bytes) VALUES ($1, 'observations/csrf/none.png', 'image/png', 10) RETURNING id`,
    [ids.observationId],
  );
  ids.weatherDayId = await one(`INSERT INTO weather_days (garden_id, day, t_min_c, t_max_c) VALUES ($1, '2026-06-01', 14, 31) RETURNING id`, [ids.gardenId]);
}

const fillPath = (p: string) =>
  p.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    if (name === 'table') return 'water-events';
    if (name === 'userId') return ids.otherUser!;
    const id = ids[name];
    if (!id) throw new Error(`security test: add a fixture for path parameter :${name}`);
    return id;
  });

/** A body each route would accept (so only the missing token stands between it and a change). */
function plausibleBody(spec: RouteSpec): object {
  const byPath: Record<string, object> = {
    '/gardens': { name: 'G', latitudeDeg: 35, longitudeDeg: -106, elevationM: 10, soilTexture: 'loam' },
    '/cohorts': { name: 'New cohort' },
    '/trials/:trialId/water-events': { plotId: ids.plotId, occurredAt: '2026-06-05T07:00:00Z', kind: 'surface', volumeL: 3 },
    '/trials/:trialId/observations': { observedAt: '2026-06-05T07:00:00Z', text: 'Seen' },
    '/trials/:trialId/plots': { label: 'Z9', blockKey: 'Z', areaM2: 1 },
    '/pots': { label: 'P2', capacityL: 8, widestDiameterCm: 25, shape: 'globe', make: 'wheel_thrown' },
    '/gardens/:gardenId': { name: 'Renamed' },
    '/account': { displayName: 'Renamed' },
  };
  return byPath[spec.path] ?? {};
}

describe('CSRF on every state-changing route', () => {
  it('refuses each one without the token, and with a token from another session, with 403 csrf_invalid and no change', async () => {
    await fixtures();
    const other = new ApiAgent(t.app);
    await other.refreshCsrf();
    const specs = (t.app.locals.routeSpecs as RouteSpec[]).filter((s) => s.method !== 'get');
    expect(specs.length).toBeGreaterThan(30);
    const slipped: string[] = [];
    for (const spec of specs) {
      const agent = spec.access.kind === 'public' ? anonymous : me;
      const url = `/api${fillPath(spec.path)}`;
      const before = await snapshot();
      const missing = await agent.agent[spec.method](url).send(plausibleBody(spec));
      const foreign = await agent.agent[spec.method](url).set('X-CSRF-Token', other.csrf).send(plausibleBody(spec));
      for (const [how, res] of [
        ['no token', missing],
        ['foreign token', foreign],
      ] as const) {
        if (res.status !== 403 || res.body?.error?.code !== 'csrf_invalid') slipped.push(`${spec.method.toUpperCase()} ${spec.path} (${how}): ${res.status}`);
      }
      expect(await snapshot(), `${spec.method.toUpperCase()} ${spec.path} changed the database without a token`).toEqual(before);
    }
    expect(slipped).toEqual([]);
    // The caller is still signed in: a refused sign-out did not end the session.
    expect((await me.get('/api/account')).status).toBe(200);
    // And the same requests do go through with the token (the refusals above were the token's doing).
    expect((await me.patch(`/api/gardens/${ids.gardenId}`, { name: 'Renamed' })).status).toBe(200);
  });

  it('refuses a photo upload without the token and stores nothing', async () => {
    const before = await snapshot();
    const res = await me.agent
      .post(`/api/observations/${ids.observationId}/photos`)
      .attach('photo', pngOf(1, 1), { filename: 'a.png', contentType: 'image/png' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
    expect(await snapshot()).toEqual(before);
  });
});

// ---------------------------------------------------------------------------------------------
// Uploads

/** A PNG chunk with its length and a valid CRC. */
function chunk(type: string, data: Buffer) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const typed = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed) >>> 0);
  return Buffer.concat([len, typed, crc]);
}

/**
 * A PNG declaring width × height RGB pixels. The IDAT holds only the first row: for a huge
 * declared size that is a decompression bomb (a few hundred bytes on the wire, 7.5 GB decoded).
 */
function pngOf(width: number, height: number) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.writeUInt8(8, 8); // bit depth
  ihdr.writeUInt8(2, 9); // colour type: RGB
  const firstRow = Buffer.alloc(1 + Math.min(width, 4096) * 3);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(firstRow)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

describe('photo uploads', () => {
  let obsId: string;
  let owner: ApiAgent;
  /** Every object file the S3 fake holds, relative to its directory. */
  const objects = () => {
    const out: string[] = [];
    const walk = (d: string) => {
      for (const e of fs.readdirSync(d, { withFileTypes: true })) {
        if (e.isDirectory()) walk(path.join(d, e.name));
        else if (e.name.endsWith('._S3rver_object')) out.push(path.relative(t.s3.directory, path.join(d, e.name)));
      }
    };
    walk(t.s3.directory);
    return out.sort();
  };
  const photoRows = async () => ((await t.ds.query('SELECT count(*)::int AS n FROM photos WHERE observation_id = $1', [obsId])) as { n: number }[])[0]!.n;
  const upload = (file: Buffer, filename: string, contentType: string, field = 'photo') =>
    owner.agent.post(`/api/observations/${obsId}/photos`).set('X-CSRF-Token', owner.csrf).attach(field, file, { filename, contentType });

  beforeAll(async () => {
    owner = new ApiAgent(t.app);
    await owner.signUp({ email: uniqueEmail('uploader') });
    const { trial } = await makePairedTrial(owner);
    obsId = (await owner.post(`/api/trials/${trial.id}/observations`, { observedAt: '2026-06-03T18:00:00Z', text: 'Photo please' })).body.data.id;
  });

  it('refuses content that is not a JPEG, PNG or WebP whatever its name and declared type, storing nothing', async () => {
    const before = objects();
    const gif = Buffer.from('R0lGODlhAQABAIAAAAAAAP///yH5BAEAAAAALAAAAAABAAEAAAIBRAA7', 'base64');
    const cases: [Buffer, string, string][] = [
      [Buffer.from('<html><script>alert(1)</script></html>'), 'holiday.png', 'image/png'],
      [Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>'), 'vector.png', 'image/svg+xml'],
      [gif, 'animated.jpg', 'image/jpeg'],
      [Buffer.from('%PDF-1.4\n%âãÏÓ\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF'), 'scan.webp', 'image/webp'],
      [Buffer.from('MZ\x90\x00\x03\x00\x00\x00', 'latin1'), 'setup.jpeg', 'image/jpeg'],
      [Buffer.alloc(0), 'empty.png', 'image/png'],
    ];
    for (const [file, name, type] of cases) {
      const res = await upload(file, name, type);
      expect(res.status, name).toBeGreaterThanOrEqual(400);
      expect(res.status, name).toBeLessThan(500);
      expect(Object.keys(res.body), name).toEqual(['error']);
    }
    expect(objects()).toEqual(before);
    expect(await photoRows()).toBe(0);
  });

  it('refuses an oversize file with 413 and a decompression bomb (50,000 × 50,000 px in a few hundred bytes) with 413', async () => {
    const before = objects();
    const big = await upload(Buffer.concat([pngOf(1, 1), Buffer.alloc(9 * 1024 * 1024)]), 'big.png', 'image/png');
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('payload_too_large');
    const bomb = pngOf(50_000, 50_000);
    expect(bomb.length).toBeLessThan(20_000);
    const res = await upload(bomb, 'bomb.png', 'image/png');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(objects()).toEqual(before);
    expect(await photoRows()).toBe(0);
  });

  it('stores a valid image under its own key whatever tricks the file name plays (.., absolute paths), and refuses a NUL byte', async () => {
    const marker = `seepwise-escape-${Date.now()}`;
    const names = [
      `../../${marker}.png`,
      `/tmp/${marker}.png`,
      `..\\..\\${marker}.png`,
      `C:\\Windows\\${marker}.png`,
      `%2e%2e%2f${marker}.png`,
      `${marker}\u202Egnp.exe`,
    ];
    const before = objects();
    // A NUL byte in the part header is not a file name at all: refused as a malformed upload.
    const nul = await upload(pngOf(2, 2), `${marker}.png\u0000.exe`, 'image/png');
    expect(nul.status).toBe(400);
    expect(nul.body.error.code).toBe('validation_failed');
    for (const name of names) {
      const res = await upload(pngOf(2, 2), name, 'image/png');
      expect(res.status, name).toBe(201);
      const [row] = (await t.ds.query('SELECT storage_key FROM photos WHERE id = $1', [res.body.data.id])) as { storage_key: string }[];
      expect(row!.storage_key).toMatch(new RegExp(`^observations/${obsId}/[0-9a-f-]{36}\\.png$`));
    }
    const added = objects().filter((o) => !before.includes(o));
    expect(added).toHaveLength(names.length);
    expect(added.every((o) => o.startsWith(path.join('test-photos', 'observations', obsId)))).toBe(true);
    // Nothing named after the upload anywhere near the store, nor in the temp directory.
    for (const dir of [t.s3.directory, path.dirname(t.s3.directory), os.tmpdir(), '/tmp']) {
      expect(
        fs.readdirSync(dir).filter((f) => f.includes(marker)),
        dir,
      ).toEqual([]);
    }
    expect(await photoRows()).toBe(names.length);
  });

  it('answers a malformed upload (wrong field, two files, broken multipart) with a 4xx in the one error shape, storing nothing', async () => {
    const before = objects();
    const rows = await photoRows();
    const wrongField = await upload(pngOf(1, 1), 'a.png', 'image/png', 'file');
    const twoFiles = await owner.agent
      .post(`/api/observations/${obsId}/photos`)
      .set('X-CSRF-Token', owner.csrf)
      .attach('photo', pngOf(1, 1), { filename: 'a.png', contentType: 'image/png' })
      .attach('photo', pngOf(1, 1), { filename: 'b.png', contentType: 'image/png' });
    const noBoundary = await owner.agent
      .post(`/api/observations/${obsId}/photos`)
      .set('X-CSRF-Token', owner.csrf)
      .set('Content-Type', 'multipart/form-data')
      .send('garbage');
    const truncated = await owner.agent
      .post(`/api/observations/${obsId}/photos`)
      .set('X-CSRF-Token', owner.csrf)
      .set('Content-Type', 'multipart/form-data; boundary=XYZ')
      .send('--XYZ\r\nContent-Disposition: form-data; name="photo"; filename="a.png"\r\nContent-Type: image/png\r\n\r\n\x89PNG');
    const manyFields = owner.agent.post(`/api/observations/${obsId}/photos`).set('X-CSRF-Token', owner.csrf);
    for (let i = 0; i < 8; i++) manyFields.field(`f${i}`, 'x');
    const tooManyFields = await manyFields.attach('photo', pngOf(1, 1), { filename: 'a.png', contentType: 'image/png' });
    for (const [name, res] of Object.entries({ wrongField, twoFiles, noBoundary, truncated, tooManyFields })) {
      expect(res.status, `${name}: ${res.status} ${JSON.stringify(res.body)}`).toBeGreaterThanOrEqual(400);
      expect(res.status, `${name}: ${res.status} ${JSON.stringify(res.body)}`).toBeLessThan(500);
      expect(Object.keys(res.body), name).toEqual(['error']);
      expect(typeof res.body.error.message, name).toBe('string');
    }
    expect(objects()).toEqual(before);
    expect(await photoRows()).toBe(rows);
  });
});

// ---------------------------------------------------------------------------------------------
// Exports and e-mails

describe('cohort exports and e-mails', () => {
  it('neutralises formula-like plot labels, pairs and crop names in cohort exports', async () => {
    const lead = new ApiAgent(t.app);
    await lead.signUp({ email: uniqueEmail('lead'), role: 'educator' });
    const cohort = (await lead.post('/api/cohorts', { name: 'Formula class' })).body.data;
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail('grower') });
    await a.post('/api/cohorts/join', { code: cohort.joinCode });
    const garden = (await a.post('/api/gardens', { name: 'G', latitudeDeg: 35, longitudeDeg: -106, elevationM: 10, soilTexture: 'loam' })).body.data;
    const trial = (
      await a.post(`/api/gardens/${garden.id}/trials`, { title: 'T', crop: 'other', cropName: '@SUM(1+1)', plantingDate: '2026-05-01', design: 'paired' })
    ).body.data;
    const labels: [string, string][] = [
      ['=HYPERLINK("http://x.invalid")', '+1+1'],
      ['-2+3', '+1+1'],
      ['@A1', '=B'],
      ['plain', '=B'],
    ];
    for (const [label, blockKey] of labels) expect((await a.post(`/api/trials/${trial.id}/plots`, { label, blockKey, areaM2: 1 })).status).toBe(201);
    expect((await a.post(`/api/trials/${trial.id}/randomise`, {})).status).toBe(200);
    await a.post(`/api/trials/${trial.id}/status`, { status: 'active' });
    const plotIds = ((await a.get(`/api/trials/${trial.id}/plots`)).body.data as { id: string }[]).map((p) => p.id);
    await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plotIds[0], occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 4 });
    expect((await a.post(`/api/trials/${trial.id}/shares`, { cohortId: cohort.id })).status).toBe(201);

    for (const table of ['plots', 'water-events']) {
      const res = await lead.get(`/api/cohorts/${cohort.id}/export/${table}.csv`);
      expect(res.status).toBe(200);
      const parsed = Papa.parse<Record<string, string>>(res.text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
      expect(parsed.data.length).toBeGreaterThan(0);
      for (const row of parsed.data) {
        for (const col of ['plot', 'pair', 'crop', 'member', 'treatment'].filter((c) => c in row)) {
          expect(row[col], `${table}.${col}`).not.toMatch(/^[=+\-@\t\r]/);
        }
      }
      const plots = new Set(parsed.data.map((r) => r.plot));
      if (table === 'plots') {
        expect([...plots].sort()).toEqual(["'-2+3", '\'=HYPERLINK("http://x.invalid")', "'@A1", 'plain'].sort());
        expect(parsed.data.every((r) => r.crop === "'@SUM(1+1)")).toBe(true);
        expect(new Set(parsed.data.map((r) => r.pair))).toEqual(new Set(["'+1+1", "'=B"]));
      }
    }
  });

  it('escapes HTML from a cohort name and a display name in the HTML part of an invitation e-mail', async () => {
    const lead = new ApiAgent(t.app);
    await lead.signUp({ email: uniqueEmail('lead'), role: 'educator', displayName: '<b onmouseover=alert(1)>Lead</b>' });
    const cohort = (await lead.post('/api/cohorts', { name: '<img src=x onerror=alert(1)> club' })).body.data;
    const invitee = uniqueEmail('invitee');
    expect((await lead.post(`/api/cohorts/${cohort.id}/invitations`, { email: invitee })).status).toBe(201);
    const mail = await t.sink.waitFor((m) => m.to.includes(invitee));
    expect(mail.html).toBeTruthy();
    expect(mail.html).not.toMatch(/<img src=x/i);
    expect(mail.html).not.toMatch(/<b onmouseover/i);
    expect(mail.html).toContain('&lt;img src=x onerror=alert(1)&gt; club');
  });
});

// ---------------------------------------------------------------------------------------------
// Brute force (extends tests/api/auth.test.ts, where one agent makes six attempts)

describe('brute force against sign-in and password reset', () => {
  it('keeps counting across fresh cookie jars and e-mail spellings, then refuses even the right password; other accounts stay open', async () => {
    const email = uniqueEmail('target');
    await new ApiAgent(t.app).signUp({ email, password: 'correct-horse-olla-1' });
    const spellings = [email, email.toUpperCase(), `  ${email}  `, email.replace(/^./, (c) => c.toUpperCase()), email];
    for (const spelling of spellings) {
      // A fresh client each time: no cookie to throttle by.
      const res = await new ApiAgent(t.app).signIn(spelling, 'wrong-guess-1234');
      expect(res.status).toBe(401);
    }
    const right = await new ApiAgent(t.app).signIn(email, 'correct-horse-olla-1');
    expect(right.status).toBe(429);
    expect(right.body.error.code).toBe('rate_limited');
    expect(right.headers['ratelimit-policy']).toBeDefined();
    // The limit is per account and address: someone else signing in from the same address is not locked out.
    const bystander = uniqueEmail('bystander');
    await new ApiAgent(t.app).signUp({ email: bystander });
    expect((await new ApiAgent(t.app).signIn(bystander)).status).toBe(200);
  });

  it('limits password-reset requests per address and mails no more once limited', async () => {
    const email = uniqueEmail('reset');
    await new ApiAgent(t.app).signUp({ email });
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) {
      const a = new ApiAgent(t.app);
      await a.refreshCsrf();
      statuses.push((await a.post('/api/auth/password-reset/request', { email })).status);
    }
    expect(statuses).toEqual([202, 202, 202, 429, 429]);
    const [{ n }] = (await t.ds.query(
      `SELECT count(*)::int AS n FROM user_tokens k JOIN users u ON u.id = k.user_id WHERE u.email = $1 AND k.purpose = 'password_reset'`,
      [email],
    )) as [{ n: number }];
    expect(n).toBe(3);
  });

  it('does not trust X-Forwarded-For without TRUST_PROXY: a spoofed address does not reset the count', async () => {
    const email = uniqueEmail('spoof');
    await new ApiAgent(t.app).signUp({ email });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const a = new ApiAgent(t.app);
      await a.refreshCsrf();
      const res = await a.agent
        .post('/api/auth/sign-in')
        .set('X-CSRF-Token', a.csrf)
        .set('X-Forwarded-For', `203.0.113.${i + 1}`)
        .send({ email, password: 'wrong-guess-1234' });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });
});
