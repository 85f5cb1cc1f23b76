import unzipper from 'unzipper';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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

describe('GET /api/trials/:trialId/report.zip', () => {
  it('bundles the CSVs, the data dictionary, every chart as SVG and PNG, and a methods-and-results text', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const { trial, plots } = await makePairedTrial(a);
    for (const p of plots) {
      for (let d = 1; d <= 3; d++) {
        await a.post(`/api/trials/${trial.id}/water-events`, { plotId: p.id, occurredAt: `2026-06-0${d}T07:00:00Z`, kind: p.treatment === 'olla' ? 'olla_refill' : 'surface', volumeL: p.treatment === 'olla' ? 3 + d / 2 + (p.label.charCodeAt(0) - 64) * 0.7 : 9 + d });
      }
      await a.post(`/api/trials/${trial.id}/harvests`, { plotId: p.id, harvestedOn: '2026-08-01', freshKg: 2 + p.label.charCodeAt(0) / 100 });
    }
    const res = await a.agent.get(`/api/trials/${trial.id}/report.zip`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/zip');
    const dir = await unzipper.Open.buffer(res.body as Buffer);
    const names = dir.files.map((f) => f.path).sort();
    expect(names).toEqual(
      expect.arrayContaining([
        'methods-and-results.md',
        'data/water-events.csv',
        'data/harvests.csv',
        'data/plots.csv',
        'data/data-dictionary.csv',
        'charts/cumulative-water.svg',
        'charts/cumulative-water.png',
        'charts/paired-differences.svg',
        'charts/paired-differences.png',
        'charts/harvest-vs-water.png',
      ]),
    );
    const read = async (name: string) => (await dir.files.find((f) => f.path === name)!.buffer()).toString('utf8');
    const md = await read('methods-and-results.md');
    expect(md).toMatch(/## Methods/);
    expect(md).toMatch(/Across 2 pairs/);
    expect(md).toMatch(/95% confidence interval/);
    expect(md).toMatch(/seed `fixture-seed`/);
    const water = (await read('data/water-events.csv')).replace(/^\uFEFF/, '').trim().split('\n');
    expect(water).toHaveLength(1 + 12);
    expect(await read('charts/cumulative-water.svg')).toMatch(/^<svg/);
    const png = await dir.files.find((f) => f.path === 'charts/cumulative-water.png')!.buffer();
    // PNG signature (ISO/IEC 15948 §5.2).
    expect(png.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
  });
});

describe('GET /api/cohorts/:cohortId/report.zip', () => {
  it("gives a student the cohort's pseudonymised data, charts and a methods text with the licence", async () => {
    const lead = new ApiAgent(t.app);
    await lead.signUp({ email: uniqueEmail('lead'), role: 'educator' });
    const cohort = (await lead.post('/api/cohorts', { name: 'Dry Wash Class', licence: 'CC-BY-4.0' })).body.data;
    for (const [i, name] of ['Ruth Realname', 'Tomás Realname', 'Inés Realname'].entries()) {
      const g = new ApiAgent(t.app);
      await g.signUp({ email: uniqueEmail(`g${i}`), displayName: name });
      await g.post('/api/cohorts/join', { code: cohort.joinCode });
      const { trial, plots } = await makePairedTrial(g);
      for (const p of plots) {
        const extra = (p.label.charCodeAt(0) - 64) * (i + 1);
        await g.post(`/api/trials/${trial.id}/water-events`, { plotId: p.id, occurredAt: '2026-06-01T07:00:00Z', kind: p.treatment === 'olla' ? 'olla_refill' : 'surface', volumeL: p.treatment === 'olla' ? 10 + extra : 30 + 2 * extra });
        await g.post(`/api/trials/${trial.id}/harvests`, { plotId: p.id, harvestedOn: '2026-08-01', freshKg: 2 + extra / 10 });
      }
      await g.post(`/api/trials/${trial.id}/shares`, { cohortId: cohort.id });
    }
    const student = new ApiAgent(t.app);
    await student.signUp({ email: uniqueEmail('student'), displayName: 'Student Realname' });
    await student.post('/api/cohorts/join', { code: cohort.joinCode, role: 'observer' });

    const res = await student.agent.get(`/api/cohorts/${cohort.id}/report.zip`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    const dir = await unzipper.Open.buffer(res.body as Buffer);
    const names = dir.files.map((f) => f.path);
    expect(names).toEqual(expect.arrayContaining(['methods-and-results.md', 'data/water-events.csv', 'data/trials.csv', 'data/data-dictionary.csv', 'charts/forest-water-saved.svg', 'charts/forest-water-saved.png']));
    const all = (await Promise.all(dir.files.filter((f) => !f.path.endsWith('.png')).map(async (f) => (await f.buffer()).toString('utf8')))).join('\n');
    expect(all).not.toMatch(/Realname/);
    const md = (await dir.files.find((f) => f.path === 'methods-and-results.md')!.buffer()).toString('utf8');
    expect(md).toMatch(/random-effects meta-analysis \(DerSimonian-Laird/);
    expect(md).toMatch(/Water saved/);
    expect(md).toMatch(/k = 3 trials/);
    expect(md).toMatch(/Licence: Creative Commons Attribution 4\.0 International \(CC BY 4\.0\)/);

    // The same bundle for a Spanish reader: the methods text and the charts in Spanish (pseudonyms
    // read "Cultivador K7"), the CSVs byte for byte the same (members stay "Grower K7" there).
    const es = await student.agent.get(`/api/cohorts/${cohort.id}/report.zip?lang=es`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(es.status).toBe(200);
    const esDir = await unzipper.Open.buffer(es.body as Buffer);
    const read = async (d: typeof dir, name: string) => (await d.files.find((f) => f.path === name)!.buffer()).toString('utf8');
    const mdEs = await read(esDir, 'methods-and-results.md');
    expect(mdEs).toMatch(/## Métodos/);
    expect(mdEs).toMatch(/metaanálisis de efectos aleatorios \(τ² estimada por DerSimonian-Laird\)/);
    expect(mdEs).toMatch(/k = 3 ensayos/);
    expect(mdEs).toMatch(/Licencia: Creative Commons Atribución 4\.0 Internacional \(CC BY 4\.0\)/);
    for (const english of ['## Methods', '## Results', '## Caveats', 'Pooled by random effects', 'Growers appear', 'Single-pair trials']) expect(mdEs).not.toContain(english);
    expect(await read(esDir, 'charts/forest-water-saved.svg')).toMatch(/Cultivador [A-Z]\d+/);
    expect(await read(esDir, 'charts/forest-water-saved.svg')).not.toMatch(/Grower [A-Z]\d+/);
    const trialsCsv = await read(esDir, 'data/trials.csv');
    expect(trialsCsv).toBe(await read(dir, 'data/trials.csv'));
    expect(trialsCsv).toMatch(/Grower [A-Z]\d+/);
  });
});
