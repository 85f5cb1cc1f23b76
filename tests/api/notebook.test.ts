import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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

async function grower() {
  const a = new ApiAgent(t.app);
  await a.signUp({ email: uniqueEmail() });
  return a;
}
const count = async (table: string) => ((await t.ds.query(`SELECT count(*)::int AS n FROM ${table}`)) as { n: number }[])[0]!.n;

describe('gardens', () => {
  it('stores the location coarsened to 0.1° and hides the garden from other growers', async () => {
    const a = await grower();
    const res = await a.post('/api/gardens', { name: 'Mesa plot', latitudeDeg: 35.08449, longitudeDeg: -106.65041, elevationM: 1510, soilTexture: 'clay_loam', notes: 'By the wall' });
    expect(res.status).toBe(201);
    expect(res.body.data).toMatchObject({ latitudeDeg: 35.1, longitudeDeg: -106.7, soilTexture: 'clay_loam' });
    const [row] = await t.ds.query('SELECT latitude_deg, longitude_deg FROM gardens WHERE id = $1', [res.body.data.id]);
    expect(row).toEqual({ latitude_deg: 35.1, longitude_deg: -106.7 });
    const b = await grower();
    expect((await b.get(`/api/gardens/${res.body.data.id}`)).status).toBe(404);
    expect((await b.get('/api/gardens')).body.data).toEqual([]);
  });

  it.each([
    [{ latitudeDeg: 95 }, 'latitudeDeg'],
    [{ soilTexture: 'peat' }, 'soilTexture'],
    [{ elevationM: 9000 }, 'elevationM'],
    [{ name: '' }, 'name'],
  ])('refuses %j with a message on %s', async (override, field) => {
    const a = await grower();
    const before = await count('gardens');
    const res = await a.post('/api/gardens', { name: 'G', latitudeDeg: 30, longitudeDeg: 10, elevationM: 100, soilTexture: 'loam', ...override });
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(field);
    expect(await count('gardens')).toBe(before);
  });

  it('keeps one weather record per day: a second entry for the day replaces the first', async () => {
    const a = await grower();
    const { garden } = await makePairedTrial(a);
    await a.put(`/api/gardens/${garden.id}/weather`, { day: '2026-06-01', tMinC: 14, tMaxC: 31 });
    const again = await a.put(`/api/gardens/${garden.id}/weather`, { day: '2026-06-01', tMinC: 15, tMaxC: 33, rhMinPct: 20, rhMaxPct: 60, windSpeedMs: 2.5, sunshineHours: 12 });
    expect(again.status).toBe(200);
    const list = await a.get(`/api/gardens/${garden.id}/weather?from=2026-06-01&to=2026-06-30`);
    expect(list.body.data).toHaveLength(1);
    expect(list.body.data[0]).toMatchObject({ tMinC: 15, tMaxC: 33, sunshineHours: 12 });
    const bad = await a.put(`/api/gardens/${garden.id}/weather`, { day: '2026-06-02', tMinC: 30, tMaxC: 20 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('tMinC');
  });
});

describe('label order', () => {
  it('lists pots and plots in counting order (B2 before B10), as people number them', async () => {
    // ICU numeric collation (CLDR "kn", Unicode Technical Standard #35); migration NaturalLabelOrder.
    const a = await grower();
    for (const label of ['B10', 'B2', 'B1', 'b3']) {
      expect((await a.post('/api/pots', { label, capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'coil_built' })).status).toBe(201);
    }
    const pots = (await a.get('/api/pots')).body.data as { label: string }[];
    expect(pots.map((p) => p.label)).toEqual(['B1', 'B2', 'b3', 'B10']);

    const { trial } = await makePairedTrial(a);
    await a.post(`/api/trials/${trial.id}/status`, { status: 'draft' });
    for (const [label, blockKey] of [['Z10', 'C10'], ['Z9', 'C9']]) {
      expect((await a.post(`/api/trials/${trial.id}/plots`, { label, blockKey, areaM2: 2 })).status).toBe(201);
    }
    const plots = (await a.get(`/api/trials/${trial.id}/plots`)).body.data as { label: string; blockKey: string }[];
    const blocks = plots.map((p) => p.blockKey);
    expect(blocks.indexOf('C9')).toBeLessThan(blocks.indexOf('C10'));
  });
});

describe('trials and plots', () => {
  it('refuses an end date before planting and a paired design without olla and surface', async () => {
    const a = await grower();
    const { garden } = await makePairedTrial(a);
    const r1 = await a.post(`/api/gardens/${garden.id}/trials`, { title: 'X', crop: 'tomato', plantingDate: '2026-05-01', endDate: '2026-04-01' });
    expect(r1.status).toBe(400);
    expect(r1.body.error.details[0].path).toBe('endDate');
    const r2 = await a.post(`/api/gardens/${garden.id}/trials`, { title: 'X', crop: 'tomato', plantingDate: '2026-05-01', treatments: ['olla', 'drip'] });
    expect(r2.status).toBe(400);
    const r3 = await a.post(`/api/gardens/${garden.id}/trials`, { title: 'X', crop: 'other', plantingDate: '2026-05-01' });
    expect(r3.body.error.details[0].path).toBe('cropName');
  });

  it('randomises within each pair reproducibly from the recorded seed', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    expect(plots.every((p) => ['olla', 'surface'].includes(p.treatment))).toBe(true);
    for (const block of ['A', 'B']) {
      const inBlock = plots.filter((p) => p.blockKey === block).map((p) => p.treatment).sort();
      expect(inBlock).toEqual(['olla', 'surface']);
    }
    const got = (await a.get(`/api/trials/${trial.id}`)).body.data;
    expect(got.randomisationSeed).toBe('fixture-seed');
    // Same seed, same assignment (the trial must be writable again).
    await a.post(`/api/trials/${trial.id}/status`, { status: 'draft' });
    const again = (await a.post(`/api/trials/${trial.id}/randomise`, { seed: 'fixture-seed' })).body.data.plots;
    expect(again.map((p: { treatment: string }) => p.treatment)).toEqual(plots.map((p) => p.treatment));
  });

  it('refuses to randomise a pair with the wrong number of plots and changes nothing', async () => {
    const a = await grower();
    const { trial } = await makePairedTrial(a);
    await a.post(`/api/trials/${trial.id}/status`, { status: 'draft' });
    await a.post(`/api/trials/${trial.id}/plots`, { label: 'C1', blockKey: 'C', areaM2: 2 });
    const before = await t.ds.query('SELECT id, treatment FROM plots WHERE trial_id = $1 ORDER BY id', [trial.id]);
    const res = await a.post(`/api/trials/${trial.id}/randomise`, { seed: 'other' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/"C" has 1 plot; it needs exactly 2/);
    expect(await t.ds.query('SELECT id, treatment FROM plots WHERE trial_id = $1 ORDER BY id', [trial.id])).toEqual(before);
  });

  it('refuses a duplicate plot label and an unknown treatment', async () => {
    const a = await grower();
    const { trial } = await makePairedTrial(a);
    const dup = await a.post(`/api/trials/${trial.id}/plots`, { label: 'A1', blockKey: 'Z', areaM2: 1 });
    expect(dup.status).toBe(400);
    expect(dup.body.error.details[0].path).toBe('label');
    const bad = await a.post(`/api/trials/${trial.id}/plots`, { label: 'Q1', blockKey: 'Z', areaM2: 1, treatment: 'drip' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('treatment');
  });

  it('makes a closed trial read-only until reopened, and audits the status changes', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'closed' })).status).toBe(200);
    const water = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 5 });
    expect(water.status).toBe(409);
    expect(water.body.error.message).toMatch(/closed and read-only/);
    expect((await a.patch(`/api/trials/${trial.id}`, { title: 'Renamed' })).status).toBe(409);
    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'draft' })).status).toBe(409);
    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'active' })).status).toBe(200);
    const audit = (await a.get(`/api/trials/${trial.id}/audit`)).body.data;
    expect(audit.map((e: { action: string; changes: { status: string[] } }) => e.changes.status)).toEqual([
      ['closed', 'active'],
      ['active', 'closed'],
      ['draft', 'active'],
    ]);
  });
});

describe('logs', () => {
  it('creates, lists with filters and paging, updates and deletes a water event', async () => {
    const a = await grower();
    const { trial, plots, pots } = await makePairedTrial(a);
    const olla = plots.find((p) => p.treatment === 'olla')!;
    const pot = pots.find((p: { plotId: string }) => p.plotId === olla.id);
    for (let d = 1; d <= 5; d++) {
      const res = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: olla.id, occurredAt: `2026-06-0${d}T07:00:00Z`, kind: 'olla_refill', volumeL: 4 + d, potId: pot.id });
      expect(res.status).toBe(201);
    }
    const page = await a.get(`/api/trials/${trial.id}/water-events?pageSize=2&page=2&sort=asc&from=2026-06-01&to=2026-06-05`);
    expect(page.body.meta).toEqual({ total: 5, page: 2, pageSize: 2 });
    expect(page.body.data.map((r: { volumeL: number }) => r.volumeL)).toEqual([7, 8]);
    expect(page.body.data[0].plotLabel).toBe(olla.label);
    const id = page.body.data[0].id;
    const upd = await a.patch(`/api/water-events/${id}`, { volumeL: 7.5 });
    expect(upd.status).toBe(200);
    expect(upd.body.data.volumeL).toBe(7.5);
    const badUpd = await a.patch(`/api/water-events/${id}`, { volumeL: -1 });
    expect(badUpd.status).toBe(400);
    expect((await t.ds.query('SELECT volume_l FROM water_events WHERE id = $1', [id]))[0].volume_l).toBe(7.5);
    expect((await a.delete(`/api/water-events/${id}`)).status).toBe(204);
    expect((await a.get(`/api/trials/${trial.id}/water-events`)).body.meta.total).toBe(4);
  });

  it('keeps an old refill editable after its pot has moved, and still checks a changed pot', async () => {
    const a = await grower();
    const { trial, plots, pots } = await makePairedTrial(a);
    const olla = plots.find((p) => p.treatment === 'olla')!;
    const pot = pots.find((p: { plotId: string }) => p.plotId === olla.id);
    const refill = (await a.post(`/api/trials/${trial.id}/water-events`, { plotId: olla.id, occurredAt: '2026-06-03T07:00:00Z', kind: 'olla_refill', volumeL: 6, potId: pot.id })).body.data;
    // The pot goes back on the shelf (no plot) later in the season.
    expect((await a.patch(`/api/pots/${pot.id}`, { plotId: null })).status).toBe(200);
    const fixed = await a.patch(`/api/water-events/${refill.id}`, { volumeL: 6.5 });
    expect(fixed.status).toBe(200);
    expect(fixed.body.data).toMatchObject({ volumeL: 6.5, potId: pot.id });
    // Naming a pot that is not in the plot is still refused, and nothing changes.
    const other = (await a.post('/api/pots', { label: 'Loose', capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'coil_built' })).body.data;
    const wrong = await a.patch(`/api/water-events/${refill.id}`, { potId: other.id });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details.map((d: { path: string }) => d.path)).toContain('potId');
    expect((await t.ds.query('SELECT pot_id, volume_l FROM water_events WHERE id = $1', [refill.id]))[0]).toEqual({ pot_id: pot.id, volume_l: 6.5 });
  });

  it.each([
    ['a negative volume', { volumeL: -2 }, 'volumeL'],
    ['an absurd refill', { volumeL: 900 }, 'volumeL'],
    ['a date before planting', { occurredAt: '2026-04-01T07:00:00Z' }, 'occurredAt'],
    ['a date in the future', { occurredAt: '2027-06-01T07:00:00Z' }, 'occurredAt'],
    ['an unknown source', { source: 'river' }, 'source'],
  ])('refuses %s with a field message and writes nothing', async (_name, override, field) => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const before = await count('water_events');
    const res = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: '2026-06-01T07:00:00Z', kind: 'olla_refill', volumeL: 5, ...override });
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(field);
    expect(await count('water_events')).toBe(before);
  });

  it("refuses a plot from someone else's trial", async () => {
    const a = await grower();
    const mine = await makePairedTrial(a);
    const b = await grower();
    const theirs = await makePairedTrial(b);
    const res = await a.post(`/api/trials/${mine.trial.id}/water-events`, { plotId: theirs.plots[0]!.id, occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 5 });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('plotId');
  });

  it.each([
    ['vwc', 140],
    ['tensiometer', -5],
    ['probe_index', 0],
    ['probe_index', 11],
  ])('refuses a %s reading of %d (outside the method’s own scale)', async (method, value) => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const res = await a.post(`/api/trials/${trial.id}/moisture-readings`, { plotId: plots[0]!.id, takenAt: '2026-06-01T07:00:00Z', method, depthCm: 15, value });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('value');
  });

  it('records moisture, harvests and observations', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const m = await a.post(`/api/trials/${trial.id}/moisture-readings`, { plotId: plots[0]!.id, takenAt: '2026-06-01T07:00:00Z', method: 'tensiometer', depthCm: 20, value: 35 });
    expect(m.status).toBe(201);
    const h = await a.post(`/api/trials/${trial.id}/harvests`, { plotId: plots[0]!.id, harvestedOn: '2026-07-21', freshKg: 2.4, count: 11, marketableKg: 2.1 });
    expect(h.status).toBe(201);
    expect(h.body.data).toMatchObject({ harvestedOn: '2026-07-21', freshKg: 2.4, count: 11 });
    const badH = await a.post(`/api/trials/${trial.id}/harvests`, { plotId: plots[0]!.id, harvestedOn: '2026-07-21', freshKg: 1, marketableKg: 2 });
    expect(badH.body.error.details[0].path).toBe('marketableKg');
    const o = await a.post(`/api/trials/${trial.id}/observations`, { observedAt: '2026-06-03T18:00:00Z', text: 'Hornworm on A2' });
    expect(o.status).toBe(201);
  });

  it('never duplicates a record sent twice with the same idempotency key', async () => {
    const a = await grower();
    const { trial, plots } = await makePairedTrial(a);
    const body = { plotId: plots[0]!.id, occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 6, idempotencyKey: 'offline-key-0001' };
    const first = await a.post(`/api/trials/${trial.id}/water-events`, body);
    const second = await a.post(`/api/trials/${trial.id}/water-events`, body);
    expect(first.status).toBe(201);
    expect(second.status).toBe(200);
    expect(second.body.data.id).toBe(first.body.data.id);
    expect(second.body.meta.created).toBe(false);
    expect((await t.ds.query('SELECT count(*)::int AS n FROM water_events WHERE trial_id = $1', [trial.id]))[0].n).toBe(1);
  });
});

describe('the Round (quick entry)', () => {
  it('gives every pot with its last refill, and saves a batch all-or-nothing', async () => {
    const a = await grower();
    const { trial, plots, pots } = await makePairedTrial(a);
    const entries = pots.map((p: { id: string; plotId: string }, i: number) => ({
      type: 'water',
      entry: { plotId: p.plotId, potId: p.id, occurredAt: '2026-06-10T07:00:00Z', kind: 'olla_refill', volumeL: 6 + i, idempotencyKey: `round-key-${i}-abcdef` },
    }));
    const surface = plots.find((p) => p.treatment === 'surface')!;
    entries.push({ type: 'water', entry: { plotId: surface.id, occurredAt: '2026-06-10T07:05:00Z', kind: 'surface', volumeL: 12, idempotencyKey: 'round-key-surface-1' } } as never);
    const saved = await a.post(`/api/trials/${trial.id}/round`, { entries });
    expect(saved.status).toBe(201);
    expect(saved.body.data).toHaveLength(3);
    const round = (await a.get(`/api/trials/${trial.id}/round`)).body.data;
    expect(round.pots.map((p: { lastRefillL: number }) => p.lastRefillL).sort()).toEqual([6, 7]);
    expect(round.plots.find((p: { id: string }) => p.id === surface.id).lastSurfaceL).toBe(12);

    // A batch with one bad entry writes nothing at all.
    const before = await count('water_events');
    const bad = await a.post(`/api/trials/${trial.id}/round`, {
      entries: [
        { type: 'water', entry: { plotId: surface.id, occurredAt: '2026-06-11T07:00:00Z', kind: 'surface', volumeL: 10 } },
        { type: 'water', entry: { plotId: surface.id, occurredAt: '2025-06-11T07:00:00Z', kind: 'surface', volumeL: 10 } },
      ],
    });
    expect(bad.status).toBe(400);
    expect(await count('water_events')).toBe(before);
    // Sending the first batch again (a retry after a lost connection) creates nothing new.
    const retry = await a.post(`/api/trials/${trial.id}/round`, { entries });
    expect(retry.body.data.every((r: { created: boolean }) => !r.created)).toBe(true);
    expect(await count('water_events')).toBe(before);
  });
});

describe('pots and seep tests', () => {
  it('keeps seep tests per pot with their litres per day', async () => {
    const a = await grower();
    const pot = (await a.post('/api/pots', { label: 'Red globe', capacityL: 8, widestDiameterCm: 26, neckDiameterCm: 6, shape: 'globe', make: 'coil_built', firingCone: '04' })).body
      .data;
    await a.post(`/api/pots/${pot.id}/seep-tests`, { testedOn: '2026-04-01', setting: 'air', litresLost: 0.9, hours: 24 });
    await a.post(`/api/pots/${pot.id}/seep-tests`, { testedOn: '2027-04-01', setting: 'air', litresLost: 0.3, hours: 12 });
    const got = (await a.get(`/api/pots/${pot.id}`)).body.data;
    expect(got.seepTests.map((s: { litresPerDay: number }) => s.litresPerDay)).toEqual([0.9, 0.6]);
    expect(got.latestSeepLitresPerDay).toBe(0.6);
  });

  it.each([
    [{ neckDiameterCm: 40 }, 'neckDiameterCm'],
    [{ capacityL: 0 }, 'capacityL'],
    [{ firingCone: '15' }, 'firingCone'],
    [{ shape: 'cube' }, 'shape'],
  ])('refuses %j', async (override, field) => {
    const a = await grower();
    const res = await a.post('/api/pots', { label: 'P', capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'coil_built', ...override });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe(field);
  });

  it("refuses to place a pot in another grower's plot", async () => {
    const b = await grower();
    const theirs = await makePairedTrial(b);
    const a = await grower();
    const res = await a.post('/api/pots', { label: 'P', capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'coil_built', plotId: theirs.plots[0]!.id });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('plotId');
  });
});

describe('photos through the S3 fake', () => {
  const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

  async function observation(a: ApiAgent) {
    const { trial } = await makePairedTrial(a);
    return (await a.post(`/api/trials/${trial.id}/observations`, { observedAt: '2026-06-03T18:00:00Z', text: 'Cracked pot' })).body.data;
  }
  const objectCount = () => {
    let n = 0;
    const walk = (d: string) => {
      for (const e of fs.readdirSync(d, { withFileTypes: true })) {
        if (e.isDirectory()) walk(`${d}/${e.name}`);
        else if (!e.name.startsWith('.') && e.name.endsWith('._S3rver_object')) n++;
      }
    };
    walk(t.s3.directory);
    return n;
  };

  it('round-trips a PNG: stored in object storage, served back byte for byte', async () => {
    const a = await grower();
    const obs = await observation(a);
    const before = objectCount();
    const up = await a.agent.post(`/api/observations/${obs.id}/photos`).set('X-CSRF-Token', a.csrf).attach('photo', png, { filename: '../../etc/passwd.png', contentType: 'image/png' });
    expect(up.status).toBe(201);
    expect(up.body.data.contentType).toBe('image/png');
    expect(objectCount()).toBe(before + 1);
    const [row] = await t.ds.query('SELECT storage_key FROM photos WHERE id = $1', [up.body.data.id]);
    expect(row.storage_key).not.toContain('..');
    expect(row.storage_key).not.toContain('passwd');
    const got = await a.agent.get(up.body.data.url).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/png');
    expect(Buffer.compare(got.body as Buffer, png)).toBe(0);
    expect((await a.delete(`/api/photos/${up.body.data.id}`)).status).toBe(204);
    expect(objectCount()).toBe(before);
  });

  it('refuses text dressed up as a JPEG, and an oversize file, storing nothing', async () => {
    const a = await grower();
    const obs = await observation(a);
    const before = objectCount();
    const fake = await a.agent
      .post(`/api/observations/${obs.id}/photos`)
      .set('X-CSRF-Token', a.csrf)
      .attach('photo', Buffer.from('<script>alert(1)</script>'), { filename: 'holiday.jpg', contentType: 'image/jpeg' });
    expect(fake.status).toBe(415);
    const big = Buffer.concat([png, Buffer.alloc(9 * 1024 * 1024)]);
    const huge = await a.agent.post(`/api/observations/${obs.id}/photos`).set('X-CSRF-Token', a.csrf).attach('photo', big, { filename: 'big.png', contentType: 'image/png' });
    expect(huge.status).toBe(413);
    expect(objectCount()).toBe(before);
    expect((await t.ds.query('SELECT count(*)::int AS n FROM photos WHERE observation_id = $1', [obs.id]))[0].n).toBe(0);
  });
});

describe('sharing a trial with a cohort', () => {
  it('lets the lead read it pseudonymously until it is withdrawn, and audits edits while shared', async () => {
    const lead = new ApiAgent(t.app);
    await lead.signUp({ email: uniqueEmail('lead'), role: 'educator' });
    const cohort = (await lead.post('/api/cohorts', { name: 'Valley programme' })).body.data;
    const a = await grower();
    await a.post('/api/cohorts/join', { code: cohort.joinCode });
    const { trial, plots } = await makePairedTrial(a);
    expect((await lead.get(`/api/trials/${trial.id}`)).status).toBe(404);

    const shared = await a.post(`/api/trials/${trial.id}/shares`, { cohortId: cohort.id });
    expect(shared.status).toBe(201);
    const seen = await lead.get(`/api/trials/${trial.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body.data.access).toBe('reader');
    expect(seen.body.data.gardenName).toBe('');
    expect((await lead.patch(`/api/trials/${trial.id}`, { title: 'Mine now' })).status).toBe(404);

    const w = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 5 });
    await a.delete(`/api/water-events/${w.body.data.id}`);
    const audit = (await a.get(`/api/trials/${trial.id}/audit`)).body.data;
    expect(audit.map((e: { action: string; entityType: string }) => `${e.action}:${e.entityType}`)).toEqual(
      expect.arrayContaining(['create:water_event', 'delete:water_event']),
    );
    expect((await a.delete(`/api/trials/${trial.id}`)).status).toBe(409);

    expect((await a.delete(`/api/trials/${trial.id}/shares/${cohort.id}`)).status).toBe(200);
    expect((await lead.get(`/api/trials/${trial.id}`)).status).toBe(404);
  });

  it('refuses to share into a cohort the grower does not belong to', async () => {
    const lead = new ApiAgent(t.app);
    await lead.signUp({ email: uniqueEmail('lead'), role: 'educator' });
    const cohort = (await lead.post('/api/cohorts', { name: 'Closed circle' })).body.data;
    const a = await grower();
    const { trial } = await makePairedTrial(a);
    const res = await a.post(`/api/trials/${trial.id}/shares`, { cohortId: cohort.id });
    expect(res.status).toBe(400);
    expect(await t.ds.query('SELECT * FROM trial_shares WHERE trial_id = $1', [trial.id])).toEqual([]);
  });
});

describe('partial updates (PATCH) change only the fields they name', () => {
  it('keeps every other field of a pot, a plot, a trial and a garden', async () => {
    const a = await grower();
    const { garden, trial, plots, pots } = await makePairedTrial(a);
    const pot = pots[0]!;
    await a.patch(`/api/pots/${pot.id}`, { notes: 'North side', firingCone: '04' });
    const cracked = await a.patch(`/api/pots/${pot.id}`, { condition: 'cracked' });
    expect(cracked.body.data).toMatchObject({ condition: 'cracked', plotId: pot.plotId, notes: 'North side', firingCone: '04' });

    const olla = plots.find((p) => p.treatment === 'olla')!;
    const plot = await a.patch(`/api/plots/${olla.id}`, { lid: false });
    expect(plot.body.data).toMatchObject({ lid: false, treatment: 'olla', blockKey: olla.blockKey });

    await a.patch(`/api/trials/${trial.id}`, { question: 'Do pots save water?', protocolNotes: 'Jug of 2 L' });
    const renamed = await a.patch(`/api/trials/${trial.id}`, { title: 'Renamed' });
    expect(renamed.body.data).toMatchObject({ title: 'Renamed', question: 'Do pots save water?', protocolNotes: 'Jug of 2 L' });

    await a.patch(`/api/gardens/${garden.id}`, { notes: 'Windy', coastal: true });
    const g = await a.patch(`/api/gardens/${garden.id}`, { name: 'Front yard' });
    expect(g.body.data).toMatchObject({ name: 'Front yard', notes: 'Windy', coastal: true });
  });
});

describe("a trial's last log", () => {
  it("is on the garden's calendar: a harvest day starts at the garden's midnight, so it outranks a refill the evening before", async () => {
    const a = await grower();
    // America/Denver is UTC−6 in June (MDT, IANA tz database): midnight on 5 June is 06:00Z.
    const garden = (await a.post('/api/gardens', { name: 'Acequia plot', latitudeDeg: 39.7, longitudeDeg: -105, elevationM: 1600, soilTexture: 'loam', timeZone: 'America/Denver' })).body.data;
    const trial = (await a.post(`/api/gardens/${garden.id}/trials`, { title: 'Beans', crop: 'green-beans', plantingDate: '2026-05-01' })).body.data;
    expect(trial.id).toBeTruthy();
    const plot = (await a.post(`/api/trials/${trial.id}/plots`, { label: 'A1', blockKey: 'A', areaM2: 2, treatment: 'surface' })).body.data;
    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'active' })).status).toBe(200);
    expect((await a.post(`/api/trials/${trial.id}/harvests`, { plotId: plot.id, harvestedOn: '2026-06-05', freshKg: 1.2 })).status).toBe(201);
    expect((await a.get(`/api/trials/${trial.id}`)).body.data.lastLoggedAt).toBe('2026-06-05T06:00:00.000Z');
    // 05:00Z on 5 June is 23:00 on 4 June in Denver: the day before the pick, so the pick stays the last log.
    expect((await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plot.id, occurredAt: '2026-06-05T05:00:00Z', kind: 'surface', volumeL: 10 })).status).toBe(201);
    expect((await a.get(`/api/trials/${trial.id}`)).body.data.lastLoggedAt).toBe('2026-06-05T06:00:00.000Z');
    // A watering later on 5 June (10:00 in Denver) is later than the pick's day start.
    expect((await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plot.id, occurredAt: '2026-06-05T16:00:00Z', kind: 'surface', volumeL: 10 })).status).toBe(201);
    const listed = (await a.get(`/api/trials?gardenId=${garden.id}`)).body.data as { id: string; lastLoggedAt: string }[];
    expect(listed.find((x) => x.id === trial.id)!.lastLoggedAt).toBe('2026-06-05T16:00:00.000Z');
  });
});
