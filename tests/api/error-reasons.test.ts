/**
 * Refusals the client words in the reader's language (shared/api-error.ts): a known case carries a
 * stable `reason` (and `params` for its placeholders) beside the category `code`; a schema check
 * sends zod's issue facts with each field, so the client can say "at least 10 characters" in
 * Spanish without reading the English message. The English message stays as the fallback.
 */
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import enCommon from '@/locales/en/common.json';
import esCommon from '@/locales/es/common.json';
import { makePairedTrial } from '../helpers/notebook-fixtures';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('error reasons', () => {
  it('a schema check names the issue and its limit on the field', async () => {
    const a = new ApiAgent(t.app);
    await a.refreshCsrf();
    const res = await a.post('/api/auth/sign-up', { email: uniqueEmail(), password: 'short', displayName: 'X' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', reason: 'invalid_fields', message: 'Some fields need attention.' });
    const password = (res.body.error.details as { path: string; issue?: Record<string, unknown> }[]).find((d) => d.path === 'password');
    // MIN_PASSWORD_LENGTH = 10 in shared/schemas/auth.ts; zod 4 reports min-length as too_small with origin "string".
    expect(password?.issue).toEqual({ code: 'too_small', origin: 'string', minimum: 10, inclusive: true });
  });

  it('a taken e-mail says so as email_taken, on the field too', async () => {
    const email = uniqueEmail();
    await new ApiAgent(t.app).signUp({ email });
    const b = new ApiAgent(t.app);
    await b.refreshCsrf();
    const res = await b.post('/api/auth/sign-up', { email, password: 'another-long-pass-77', displayName: 'Twin' });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'conflict', reason: 'email_taken' });
    expect(res.body.error.details).toEqual([{ path: 'email', message: 'An account with this e-mail already exists.', reason: 'email_taken' }]);
  });

  it('a wrong password is bad_credentials, and no reason is sent where there is none', async () => {
    const email = uniqueEmail();
    await new ApiAgent(t.app).signUp({ email });
    const b = new ApiAgent(t.app);
    await b.refreshCsrf();
    const res = await b.post('/api/auth/sign-in', { email, password: 'not-the-password-1' });
    expect(res.status).toBe(401);
    expect(res.body.error).toMatchObject({ code: 'unauthenticated', reason: 'bad_credentials' });
    const unknownRoute = await b.get('/api/no-such-route');
    expect(unknownRoute.body.error.reason).toBeUndefined();
  });

  it('refuses a photo that is not an image as photo_type, and a request without one as photo_missing', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const { trial } = await makePairedTrial(a);
    const obs = (await a.post(`/api/trials/${trial.id}/observations`, { observedAt: '2026-06-03T18:00:00Z', text: 'Leaves curling' })).body.data;
    const up = (buffer: Buffer, filename: string) => a.agent.post(`/api/observations/${obs.id}/photos`).set('X-CSRF-Token', a.csrf).attach('photo', buffer, { filename, contentType: 'image/jpeg' });
    const fake = await up(Buffer.from('not a picture at all'), 'pic.jpg');
    expect(fake.status).toBe(415);
    expect(fake.body.error).toMatchObject({ code: 'unsupported_media_type', reason: 'photo_type' });
    const none = await a.agent.post(`/api/observations/${obs.id}/photos`).set('X-CSRF-Token', a.csrf).field('note', 'no file');
    expect(none.status).toBe(400);
    expect(none.body.error.reason).toBe('photo_missing');
  });

  it('names the case of a trial refusal: duplicate plot label (on the field too), a status it cannot take, a log outside the season', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const { trial, plots } = await makePairedTrial(a);
    const dup = await a.post(`/api/trials/${trial.id}/plots`, { label: 'A1', blockKey: 'C', areaM2: 2 });
    expect(dup.status).toBe(400);
    expect(dup.body.error).toMatchObject({ code: 'validation_failed', reason: 'plot_label_taken' });
    expect(dup.body.error.details).toEqual([expect.objectContaining({ path: 'label', reason: 'plot_label_taken' })]);
    const early = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: '2026-01-02T07:00:00Z', kind: 'surface', volumeL: 3 });
    expect(early.status).toBe(400);
    expect(early.body.error).toMatchObject({ reason: 'date_outside_trial' });
    expect(early.body.error.details[0]).toMatchObject({ path: 'occurredAt', reason: 'date_outside_trial' });
    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'closed' })).status).toBe(200);
    // Closed → draft is not a transition the product allows (server/services/trials.service.ts allowedTransitions).
    const back = await a.post(`/api/trials/${trial.id}/status`, { status: 'draft' });
    expect(back.status).toBe(409);
    // The refusal names the case (closed → draft) so the page can say why and what to do, in both languages.
    expect(back.body.error).toMatchObject({ code: 'conflict', reason: 'status_closed_to_draft', params: { from: 'closed', to: 'draft' } });
    expect(enCommon.apiErrors.reasons.status_closed_to_draft).toMatch(/closed trial cannot go straight back to draft\. Reopen it first/);
    expect(esCommon.apiErrors.reasons.status_closed_to_draft).toMatch(/ensayo cerrado no puede volver directamente a borrador\. Primero reábrelo/);
    // …and the advice holds: reopened (active), the trial may go back to draft, then on again.
    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'active' })).status).toBe(200);
    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'draft' })).body.data.status).toBe('draft');
    expect((await a.post(`/api/trials/${trial.id}/status`, { status: 'closed' })).status).toBe(200);
    const closed = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[0]!.id, occurredAt: '2026-06-02T07:00:00Z', kind: 'surface', volumeL: 3 });
    expect(closed.status).toBe(409);
    expect(closed.body.error.reason).toBe('trial_closed');
  });

  it('tells a cohort observer who tries to share a trial: observer_cannot_share', async () => {
    const lead = new ApiAgent(t.app);
    await lead.signUp({ email: uniqueEmail('lead'), role: 'educator' });
    const cohort = (await lead.post('/api/cohorts', { name: 'Reasons class', licence: 'CC-BY-4.0' })).body.data;
    const watcher = new ApiAgent(t.app);
    await watcher.signUp({ email: uniqueEmail() });
    await watcher.post('/api/cohorts/join', { code: cohort.joinCode, role: 'observer' });
    const { trial } = await makePairedTrial(watcher);
    const res = await watcher.post(`/api/trials/${trial.id}/shares`, { cohortId: cohort.id });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatchObject({ code: 'forbidden', reason: 'observer_cannot_share' });
  });

  it('every reason the server can send has client words in English and Spanish', () => {
    // Read the reasons from the source: `.because('x')` on AppErrors and `reason: 'x'` on field details.
    const files: string[] = [];
    const walk = (dir: string) => {
      for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
        if (e.isDirectory()) walk(path.join(dir, e.name));
        else if (e.name.endsWith('.ts')) files.push(path.join(dir, e.name));
      }
    };
    walk(path.resolve(__dirname, '../../server'));
    const reasons = new Set<string>();
    const fieldReasons = new Set<string>();
    for (const f of files) {
      const src = fs.readFileSync(f, 'utf8');
      for (const m of src.matchAll(/\.because\(\s*'([a-z_]+)'/g)) reasons.add(m[1]!);
      for (const m of src.matchAll(/path: '[A-Za-z]+', message: [^\n]*?reason: '([a-z_]+)'/g)) fieldReasons.add(m[1]!);
    }
    expect(reasons.size).toBeGreaterThan(40);
    expect([...reasons].filter((r) => !(r in enCommon.apiErrors.reasons))).toEqual([]);
    expect([...reasons].filter((r) => !(r in esCommon.apiErrors.reasons))).toEqual([]);
    expect(fieldReasons.size).toBeGreaterThan(5);
    expect([...fieldReasons].filter((r) => !(r in enCommon.apiErrors.fields))).toEqual([]);
    expect([...fieldReasons].filter((r) => !(r in esCommon.apiErrors.fields))).toEqual([]);
  });
});
