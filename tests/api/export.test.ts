import Papa from 'papaparse';
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

const parse = (text: string) => Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });

describe('GET /api/trials/:trialId/export/:table.csv', () => {
  it('streams tidy CSV with ISO dates and units in the header, and neutralises formula-like cells', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const { trial, plots } = await makePairedTrial(a);
    // OWASP "CSV injection": cells starting with = + - @ tab or CR are run by spreadsheets.
    const nasty = ['=HYPERLINK("http://x.invalid","click")', '+1+1', '-2+3', '@SUM(A1)', '\tTAB', '\rCR'];
    for (const [i, note] of nasty.entries()) {
      const r = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: `2026-06-0${i + 1}T07:30:00Z`, kind: 'surface', volumeL: 5.5, notes: note });
      expect(r.status).toBe(201);
    }
    // The API trims text, so leading tab and CR cannot arrive that way; put them in directly to test the export.
    await t.ds.query(`UPDATE water_events SET notes = $2 WHERE trial_id = $1 AND notes = 'TAB'`, [trial.id, '\tTAB']);
    await t.ds.query(`UPDATE water_events SET notes = $2 WHERE trial_id = $1 AND notes = 'CR'`, [trial.id, '\rCR']);
    const res = await a.get(`/api/trials/${trial.id}/export/water-events.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="seepwise-trial-.*-water-events\.csv"/);
    const parsed = parse(res.text);
    expect(parsed.meta.fields).toEqual(['trial_id', 'plot', 'pair', 'treatment', 'occurred_at', 'day', 'kind', 'volume_l', 'source', 'fertiliser', 'notes']);
    expect(parsed.data).toHaveLength(6);
    expect(parsed.data[0]!.occurred_at).toBe('2026-06-01T07:30:00Z');
    expect(Number(parsed.data[0]!.volume_l)).toBe(5.5);
    for (const row of parsed.data) expect(row.notes!.startsWith("'")).toBe(true);
    expect(parsed.data.map((r) => r.notes)).toEqual(nasty.map((n) => `'${n}`));
  });

  it('describes every exported column in the data dictionary', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const { trial } = await makePairedTrial(a);
    const dict = parse((await a.get(`/api/trials/${trial.id}/export/data-dictionary.csv`)).text).data;
    for (const table of ['plots', 'water-events', 'moisture-readings', 'harvests', 'weather-days']) {
      const res = await a.get(`/api/trials/${trial.id}/export/${table}.csv`);
      expect(res.status).toBe(200);
      const header = parse(res.text).meta.fields!;
      const described = dict.filter((d) => d.file === `${table}.csv` && d.column).map((d) => d.column);
      expect(described).toEqual(header);
    }
    expect(dict.find((d) => d.column === 'volume_l')).toMatchObject({ unit: 'L', type: 'number' });
  });

  it('refuses an unknown table and other growers', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const { trial } = await makePairedTrial(a);
    expect((await a.get(`/api/trials/${trial.id}/export/users.csv`)).status).toBe(404);
    const b = new ApiAgent(t.app);
    await b.signUp({ email: uniqueEmail() });
    expect((await b.get(`/api/trials/${trial.id}/export/water-events.csv`)).status).toBe(404);
  });
});

describe('GET /api/cohorts/:cohortId/export/:table.csv', () => {
  it('uses stable pseudonymous codes, never names, and drops withdrawn trials', async () => {
    const lead = new ApiAgent(t.app);
    await lead.signUp({ email: uniqueEmail('lead'), role: 'educator' });
    const cohort = (await lead.post('/api/cohorts', { name: 'Export class' })).body.data;
    const a = new ApiAgent(t.app);
    const email = uniqueEmail('ruth');
    await a.signUp({ email, displayName: 'Ruth Realname' });
    await a.post('/api/cohorts/join', { code: cohort.joinCode });
    const { trial, plots } = await makePairedTrial(a);
    await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: '2026-06-01T07:00:00Z', kind: 'surface', volumeL: 4, notes: 'private note' });
    await a.post(`/api/trials/${trial.id}/shares`, { cohortId: cohort.id });

    const first = await lead.get(`/api/cohorts/${cohort.id}/export/water-events.csv`);
    expect(first.status).toBe(200);
    const rows = parse(first.text);
    expect(rows.meta.fields).toEqual(['trial_code', 'member', 'plot', 'pair', 'treatment', 'occurred_at', 'day', 'kind', 'volume_l', 'source', 'fertiliser']);
    expect(rows.data).toHaveLength(1);
    expect(rows.data[0]!.trial_code).toMatch(/^T[0-9A-F]{8}$/);
    expect(rows.data[0]!.member).toMatch(/^Grower /);
    expect(first.text).not.toContain('Realname');
    expect(first.text).not.toContain(email);
    expect(first.text).not.toContain('private note');
    expect(first.text).not.toContain(trial.id);
    const again = parse((await lead.get(`/api/cohorts/${cohort.id}/export/water-events.csv`)).text);
    expect(again.data[0]!.trial_code).toBe(rows.data[0]!.trial_code);

    await a.delete(`/api/trials/${trial.id}/shares/${cohort.id}`);
    expect(parse((await lead.get(`/api/cohorts/${cohort.id}/export/water-events.csv`)).text).data).toHaveLength(0);
  });
});
