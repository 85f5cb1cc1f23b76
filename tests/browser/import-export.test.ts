/**
 * Import through the browser: a Latin-1 CSV with day-first dates that could be read two ways,
 * parsed in a worker with a progress bar, mapped, previewed, imported in one go; importing it
 * again adds nothing. Then the export link downloads the same rows.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  env = await startBrowserEnv();
});
afterAll(async () => {
  await env?.close();
});

/** Latin-1 bytes, as an older spreadsheet writes them. */
function latin1(text: string): Buffer {
  return Buffer.from(text, 'latin1');
}

describe('CSV import and export in the browser', () => {
  it('parses with progress, asks about ambiguous dates, imports all rows once, and exports them', async () => {
    const { page, baseUrl, t } = env;
    await page.goto(`${baseUrl}/sign-up`);
    await page.getByLabel('Name to show').fill('Tomás');
    await page.getByLabel('E-mail').fill(`tomas.${Date.now()}@example.test`);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('heading', { name: 'Hello, Tomás' }).waitFor();

    const csrf = (await (await page.request.get(`${baseUrl}/api/auth/session`)).json()).data.csrfToken as string;
    const post = async (url: string, data: object) => (await page.request.post(`${baseUrl}${url}`, { headers: { 'X-CSRF-Token': csrf }, data })).json();
    const garden = (await post('/api/gardens', { name: 'Huerta', latitudeDeg: 35, longitudeDeg: -106, elevationM: 1500, soilTexture: 'loam' })).data;
    const trial = (await post(`/api/gardens/${garden.id}/trials`, { title: 'Calabazas', crop: 'squash-zucchini', plantingDate: '2026-04-01' })).data;
    for (const [label, blockKey, treatment] of [
      ['A1', 'A', 'olla'],
      ['A2', 'A', 'surface'],
    ]) {
      await post(`/api/trials/${trial.id}/plots`, { label, blockKey, areaM2: 2, treatment });
    }
    await post(`/api/trials/${trial.id}/status`, { status: 'active' });

    // 12,000 rows: day-first dates with days ≤ 12 (so 03/04/2026 could be 3 April or 4 March), an accented note.
    const lines = ['Fecha;Parcela;Tipo;Volumen (gal);Notas'];
    for (let i = 0; i < 12_000; i++) {
      const day = (i % 12) + 1;
      const month = 4 + (i % 3);
      lines.push(`${String(day).padStart(2, '0')}/${String(month).padStart(2, '0')}/2026 0${i % 10}:${String(i % 60).padStart(2, '0')};${i % 2 ? 'A1' : 'A2'};${i % 2 ? 'olla' : 'superficie'};${(1 + (i % 7) / 4).toFixed(2).replace('.', ',')};riego nº ${i}`);
    }
    const file = { name: 'riego.csv', mimeType: 'text/csv', buffer: latin1(lines.join('\r\n')) };

    await page.goto(`${baseUrl}/trials/${trial.id}`);
    await page.getByRole('tab', { name: 'Import' }).click();
    await page.getByLabel('CSV file (up to 50 MB)').setInputFiles(file);
    await page.getByText(/12,000 rows, 5 columns — read as Latin-1/).waitFor();
    await expect(page.getByLabel('Date format').inputValue()).resolves.toBe('');
    await page.getByText(/could be day-first or month-first/).waitFor();
    await page.getByLabel('Date format').selectOption('dmy');
    await page.getByText('All 12,000 rows are ready to import.').waitFor();
    await expect(page.getByLabel('Unit of volume').inputValue()).resolves.toBe('us');
    await env.screenshot('import-preview-1280');

    const sawSending = page.getByRole('progressbar', { name: 'Sending' }).waitFor({ timeout: 20_000 }).then(() => true);
    await page.getByRole('button', { name: 'Import 12,000 rows' }).click();
    expect(await sawSending).toBe(true);
    await page.getByText('Imported 12,000 records.').waitFor({ timeout: 30_000 });
    const [{ n, gallons }] = await t.ds.query(
      `SELECT count(*)::int AS n, min(volume_l) AS gallons FROM water_events WHERE trial_id = $1`,
      [trial.id],
    );
    expect(n).toBe(12_000);
    // 1 US gallon = 3.785411784 L (NIST Handbook 44, Appendix C).
    expect(gallons).toBeCloseTo(3.785411784, 9);
    const [note] = await t.ds.query(`SELECT notes, occurred_at FROM water_events WHERE trial_id = $1 AND notes = 'riego nº 3'`, [trial.id]);
    expect(note.notes).toBe('riego nº 3');

    // The same file again: nothing new.
    await page.getByLabel('CSV file (up to 50 MB)').setInputFiles(file);
    await page.getByLabel('Date format').selectOption('dmy');
    await page.getByRole('button', { name: 'Import 12,000 rows' }).click();
    await page.getByText('Nothing new to import: all 12,000 rows were already imported.').waitFor({ timeout: 30_000 });

    // A bad file: nothing written, the problem listed with its line.
    await page.getByLabel('CSV file (up to 50 MB)').setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('date,plot,kind,volume\n2026-05-01 07:00,A1,surface,lots\n') });
    await page.getByText('"lots" is not a number.').waitFor();
    await expect(page.getByRole('button', { name: /Import/ }).isDisabled()).resolves.toBe(true);

    const download = page.waitForEvent('download');
    await page.getByRole('tab', { name: 'Records' }).click();
    await page.getByRole('link', { name: 'water-events.csv' }).click();
    const d = await download;
    const text = (await (await import('node:fs')).promises.readFile((await d.path())!, 'utf8')).replace(/^\uFEFF/, '');
    expect(text.split('\n').filter(Boolean)).toHaveLength(12_001);
    expect(env.pageErrors).toEqual([]);
  });
});
