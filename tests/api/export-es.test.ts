/**
 * Exports for a Spanish-speaking reader: the data dictionary (and the report bundle's text and
 * charts) in Spanish, while the CSV column names and the numbers stay exactly as in English, so a
 * script written against one export reads every other. Decimal separator: a dot in every language
 * (RFC 4180 leaves it to the producer; R's read.csv and pandas' read_csv expect a dot by default).
 */
import Papa from 'papaparse';
import unzipper from 'unzipper';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import esExport from '@shared/locales/es/export.json';
import enExport from '@shared/locales/en/export.json';
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

const parse = (text: string) => Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });

async function spanishGrower() {
  const a = new ApiAgent(t.app);
  const email = uniqueEmail();
  await a.signUp({ email });
  await t.ds.query(`UPDATE users SET language = 'es' WHERE email = $1`, [email]);
  return a;
}

describe('exports in Spanish', () => {
  it('gives the data dictionary in the account language, with the same column names and dot decimals in the data', async () => {
    const a = await spanishGrower();
    const { trial, plots } = await makePairedTrial(a);
    const r = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: '2026-06-01T07:30:00Z', kind: 'surface', volumeL: 5.25 });
    expect(r.status).toBe(201);

    const es = parse((await a.get(`/api/trials/${trial.id}/export/data-dictionary.csv`)).text);
    const en = parse((await a.get(`/api/trials/${trial.id}/export/data-dictionary.csv?lang=en`)).text);
    // The dictionary's own header and every column name are the same identifiers in both languages.
    expect(es.meta.fields).toEqual(['file', 'column', 'type', 'unit', 'label', 'description']);
    expect(es.meta.fields).toEqual(en.meta.fields);
    expect(es.data.map((d) => [d.file, d.column, d.type])).toEqual(en.data.map((d) => [d.file, d.column, d.type]));
    // Labels and descriptions are the Spanish ones, and differ from the English ones.
    const volume = es.data.find((d) => d.file === 'water-events.csv' && d.column === 'volume_l')!;
    expect(volume).toMatchObject({ unit: 'L', type: 'number', label: esExport.columns.volume_l.label, description: esExport.columns.volume_l.description });
    expect(volume.description).not.toBe(enExport.columns.volume_l.description);
    expect(es.data.find((d) => d.column === 'plant_count')!.unit).toBe('plantas');
    expect(es.data.find((d) => d.file === 'harvests.csv' && !d.column)!.description).toBe(esExport.tables.harvests);
    // The first row says how to read the files: stable names, dot decimals.
    expect(es.data[0]!.description).toMatch(/punto como separador decimal/);
    expect(en.data[0]!.description).toMatch(/dot as the decimal separator/);

    // The data itself is language-free: same header, and 5.25 L stays "5.25" (not "5,25").
    const csv = await a.get(`/api/trials/${trial.id}/export/water-events.csv`);
    expect(csv.status).toBe(200);
    const water = parse(csv.text);
    expect(water.meta.fields).toEqual(es.data.filter((d) => d.file === 'water-events.csv' && d.column).map((d) => d.column));
    expect(water.data[0]!.volume_l).toBe('5.25');
  });

  it('refuses a language it does not have', async () => {
    const a = await spanishGrower();
    const { trial } = await makePairedTrial(a);
    const res = await a.get(`/api/trials/${trial.id}/export/data-dictionary.csv?lang=fr`);
    expect(res.status).toBe(400);
    expect(JSON.parse(res.text).error.code).toBe('validation_failed');
  });

  it('writes the report bundle in Spanish: methods text, chart titles, dictionary; the numbers match the English bundle', async () => {
    const a = await spanishGrower();
    const { trial, plots } = await makePairedTrial(a);
    for (const p of plots) {
      for (let d = 1; d <= 3; d++) {
        await a.post(`/api/trials/${trial.id}/water-events`, {
          plotId: p.id,
          occurredAt: `2026-06-0${d}T07:00:00Z`,
          kind: p.treatment === 'olla' ? 'olla_refill' : 'surface',
          volumeL: p.treatment === 'olla' ? 3 + d / 2 + (p.label.charCodeAt(0) - 64) * 0.7 : 9 + d,
        });
      }
      await a.post(`/api/trials/${trial.id}/harvests`, { plotId: p.id, harvestedOn: '2026-08-01', freshKg: 2 + p.label.charCodeAt(0) / 100 });
    }
    const zip = async (query: string) => {
      const res = await a.agent
        .get(`/api/trials/${trial.id}/report.zip${query}`)
        .buffer(true)
        .parse((r, cb) => {
          const chunks: Buffer[] = [];
          r.on('data', (c: Buffer) => chunks.push(c));
          r.on('end', () => cb(null, Buffer.concat(chunks)));
        });
      expect(res.status).toBe(200);
      const dir = await unzipper.Open.buffer(res.body as Buffer);
      return async (name: string) => (await dir.files.find((f) => f.path === name)!.buffer()).toString('utf8');
    };
    const es = await zip('');
    const en = await zip('?lang=en');
    const mdEs = await es('methods-and-results.md');
    const mdEn = await en('methods-and-results.md');
    expect(mdEs).toMatch(/## Métodos/);
    expect(mdEs).toMatch(/En 2 pares/);
    expect(mdEs).toMatch(/prueba t pareada/);
    expect(mdEs).toMatch(/semilla `fixture-seed`/);
    expect(mdEn).toMatch(/Across 2 pairs/);
    // Same estimates in both: the digits of every number, read with the language's decimal mark.
    const numbers = (md: string, decimal: string) =>
      [...md.matchAll(decimal === ',' ? /−?\d+(?:,\d+)?/g : /−?\d+(?:\.\d+)?/g)].map((m) => Number(m[0].replace('−', '-').replace(',', '.')));
    const resultsOf = (md: string, heading: string) => md.slice(md.indexOf(heading), md.indexOf('##', md.indexOf(heading) + 3));
    expect(numbers(resultsOf(mdEs, '## Resultados'), ',')).toEqual(numbers(resultsOf(mdEn, '## Results'), '.'));
    // Chart text rendered on the server is Spanish.
    expect(await es('charts/cumulative-water.svg')).toMatch(/Agua aplicada hasta la fecha/);
    expect(await en('charts/cumulative-water.svg')).toMatch(/Water applied so far/);
    // CSVs are byte-for-byte the same in both languages.
    expect(await es('data/water-events.csv')).toBe(await en('data/water-events.csv'));
    expect(parse(await es('data/data-dictionary.csv')).data.find((d) => d.column === 'volume_l')!.description).toBe(esExport.columns.volume_l.description);
  });
});
