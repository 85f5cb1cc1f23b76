/**
 * Refusals the client words in the reader's language (shared/api-error.ts): a known case carries a
 * stable `reason` (and `params` for its placeholders) beside the category `code`; a schema check
 * sends zod's issue facts with each field, so the client can say "at least 10 characters" in
 * Spanish without reading the English message. The English message stays as the fallback.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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
});
