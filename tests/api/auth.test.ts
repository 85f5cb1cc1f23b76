import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessionUserJoin } from '../../server/auth/passport';
import { UserEntity } from '../../server/entities/user.entity';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ authLimits: { signInPerWindow: 5, resetPerWindow: 3, windowMs: 60_000 } });
});
afterAll(async () => {
  await t.close();
});

const linkFrom = (text: string, path: string) => {
  const m = text.match(new RegExp(`http://seepwise\\.test${path}\\?token=([A-Za-z0-9_%-]+)`));
  if (!m) throw new Error(`no ${path} link in: ${text}`);
  return decodeURIComponent(m[1]!);
};

describe('POST /api/auth/sign-up', () => {
  it('creates a grower, signs them in and stores only a hash of the password', async () => {
    const a = new ApiAgent(t.app);
    const email = uniqueEmail();
    const user = await a.signUp({ email, displayName: 'Ruth' });
    expect(user.role).toBe('grower');
    const me = await a.get('/api/account');
    expect(me.status).toBe(200);
    expect(me.body.data.email).toBe(email);
    const [row] = await t.ds.query('SELECT password_hash FROM users WHERE email = $1', [email]);
    expect(row.password_hash).toMatch(/^\$argon2id\$/);
    expect(row.password_hash).not.toContain('tomato');
  });

  it('sends a verification e-mail whose link confirms the address once', async () => {
    const a = new ApiAgent(t.app);
    const email = uniqueEmail();
    await a.signUp({ email });
    const mail = await t.sink.waitFor((m) => m.to.includes(email) && /Confirm/.test(m.subject));
    const token = linkFrom(mail.text, '/verify-email');
    expect((await a.post('/api/auth/verify-email', { token })).status).toBe(200);
    expect((await a.get('/api/account')).body.data.emailVerified).toBe(true);
    const again = await a.post('/api/auth/verify-email', { token });
    expect(again.status).toBe(400);
  });

  it.each([
    [{ password: 'short' }, 'password'],
    [{ password: '1234567890' }, 'password'],
    [{ email: 'not-an-email' }, 'email'],
    [{ displayName: '' }, 'displayName'],
  ])('refuses %j with a field message on %s and writes nothing', async (override, field) => {
    const a = new ApiAgent(t.app);
    await a.refreshCsrf();
    const email = uniqueEmail();
    const body = { email, password: 'tomato-basin-clay-42', displayName: 'X', ...override };
    const before = await t.ds.query('SELECT count(*)::int AS n FROM users');
    const res = await a.post('/api/auth/sign-up', body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(field);
    const after = await t.ds.query('SELECT count(*)::int AS n FROM users');
    expect(after[0].n).toBe(before[0].n);
  });

  it('refuses a duplicate e-mail with 409, whatever its case', async () => {
    const email = uniqueEmail();
    await new ApiAgent(t.app).signUp({ email });
    const b = new ApiAgent(t.app);
    await b.refreshCsrf();
    const res = await b.post('/api/auth/sign-up', { email: email.toUpperCase(), password: 'another-long-pass-77', displayName: 'Twin' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
  });
});

describe('POST /api/auth/sign-in and sign-out', () => {
  it('gives the same answer for an unknown e-mail and a wrong password', async () => {
    const email = uniqueEmail();
    await new ApiAgent(t.app).signUp({ email });
    const wrong = await new ApiAgent(t.app).signIn(email, 'not-the-password-1');
    const unknown = await new ApiAgent(t.app).signIn(uniqueEmail('nobody'), 'not-the-password-1');
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('regenerates the session id at sign-in', async () => {
    const email = uniqueEmail();
    await new ApiAgent(t.app).signUp({ email });
    const a = new ApiAgent(t.app);
    const s = await a.agent.get('/api/auth/session');
    const before = String(s.headers['set-cookie']);
    const res = await a.post('/api/auth/sign-in', { email, password: 'tomato-basin-clay-42' }).set('X-CSRF-Token', s.body.data.csrfToken);
    expect(res.status).toBe(200);
    const after = String(res.headers['set-cookie']);
    expect(after).toContain('seepwise.sid=');
    expect(after).toContain('HttpOnly');
    expect(after).toContain('SameSite=Lax');
    expect(after.split(';')[0]).not.toBe(before.split(';')[0]);
  });

  it('makes the old session cookie worthless after sign-out', async () => {
    const email = uniqueEmail();
    const a = new ApiAgent(t.app);
    await a.signUp({ email });
    const signedIn = await a.signIn(email);
    const cookie = String(signedIn.headers['set-cookie']).split(';')[0]!;
    expect((await request(t.app).get('/api/account').set('Cookie', cookie)).status).toBe(200);
    expect((await a.post('/api/auth/sign-out')).status).toBe(200);
    expect((await request(t.app).get('/api/account').set('Cookie', cookie)).status).toBe(401);
  });

  it('slows brute force: the sixth attempt in the window is refused with 429', async () => {
    const email = uniqueEmail();
    await new ApiAgent(t.app).signUp({ email });
    const a = new ApiAgent(t.app);
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await a.signIn(email, `wrong-password-${i}x`)).status);
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses[5]).toBe(429);
  });
});

describe('CSRF', () => {
  it('refuses a state change without the token, and with a token from another session', async () => {
    const a = new ApiAgent(t.app);
    await a.refreshCsrf();
    const none = await a.agent.post('/api/auth/sign-in').send({ email: 'x@example.test', password: 'whatever-123' });
    expect(none.status).toBe(403);
    expect(none.body.error.code).toBe('csrf_invalid');
    const other = new ApiAgent(t.app);
    await other.refreshCsrf();
    const forged = await a.agent.post('/api/auth/sign-in').set('X-CSRF-Token', other.csrf).send({ email: 'x@example.test', password: 'whatever-123' });
    expect(forged.status).toBe(403);
  });
});

describe('password reset by e-mailed link', () => {
  it('answers the same for known and unknown addresses and mails only the known one', async () => {
    const email = uniqueEmail();
    await new ApiAgent(t.app).signUp({ email });
    const a = new ApiAgent(t.app);
    await a.refreshCsrf();
    const ghost = uniqueEmail('ghost');
    const known = await a.post('/api/auth/password-reset/request', { email });
    const unknown = await a.post('/api/auth/password-reset/request', { email: ghost });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    await t.sink.waitFor((m) => m.to.includes(email) && /Reset/.test(m.subject));
    expect(t.sink.messages.some((m) => m.to.includes(ghost))).toBe(false);
  });

  it('resets once, signs out other sessions, and refuses the link a second time', async () => {
    const email = uniqueEmail();
    const old = new ApiAgent(t.app);
    await old.signUp({ email });
    const a = new ApiAgent(t.app);
    await a.refreshCsrf();
    await a.post('/api/auth/password-reset/request', { email });
    const mail = await t.sink.waitFor((m) => m.to.includes(email) && /Reset/.test(m.subject));
    const token = linkFrom(mail.text, '/reset-password');
    const [stored] = await t.ds.query(`SELECT token_hash FROM user_tokens WHERE purpose = 'password_reset' ORDER BY created_at DESC LIMIT 1`);
    expect(stored.token_hash).not.toBe(token);

    const ok = await a.post('/api/auth/password-reset/confirm', { token, password: 'fresh-melon-path-9' });
    expect(ok.status).toBe(200);
    expect((await old.get('/api/account')).status).toBe(401);
    expect((await new ApiAgent(t.app).signIn(email, 'fresh-melon-path-9')).status).toBe(200);
    const reused = await a.post('/api/auth/password-reset/confirm', { token, password: 'another-melon-10x' });
    expect(reused.status).toBe(400);
    expect(reused.body.error.message).toMatch(/expired or was already used/);
  });

  it('refuses a link older than one hour', async () => {
    const email = uniqueEmail();
    await new ApiAgent(t.app).signUp({ email });
    const a = new ApiAgent(t.app);
    await a.refreshCsrf();
    await a.post('/api/auth/password-reset/request', { email });
    const mail = await t.sink.waitFor((m) => m.to.includes(email) && /Reset/.test(m.subject));
    const token = linkFrom(mail.text, '/reset-password');
    t.clock.now = new Date(Date.now() + 61 * 60 * 1000);
    try {
      const res = await a.post('/api/auth/password-reset/confirm', { token, password: 'late-squash-vine-3' });
      expect(res.status).toBe(400);
    } finally {
      t.clock.now = null;
    }
    expect((await new ApiAgent(t.app).signIn(email)).status).toBe(200);
  });
});

describe('account settings', () => {
  it('updates display name, units and language, and rejects unknown values', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const ok = await a.patch('/api/account', { displayName: 'Inés', unitSystem: 'us', language: 'es' });
    expect(ok.status).toBe(200);
    expect(ok.body.data).toMatchObject({ displayName: 'Inés', unitSystem: 'us', language: 'es' });
    const bad = await a.patch('/api/account', { unitSystem: 'imperial' });
    expect(bad.status).toBe(400);
    expect((await a.get('/api/account')).body.data.unitSystem).toBe('us');
  });

  it('changing the password keeps this session and ends the others', async () => {
    const email = uniqueEmail();
    const a = new ApiAgent(t.app);
    await a.signUp({ email });
    const other = new ApiAgent(t.app);
    expect((await other.signIn(email)).status).toBe(200);
    const wrong = await a.post('/api/account/password', { currentPassword: 'nope-nope-nope', newPassword: 'new-clay-vessel-5' });
    expect(wrong.status).toBe(400);
    const res = await a.post('/api/account/password', { currentPassword: 'tomato-basin-clay-42', newPassword: 'new-clay-vessel-5' });
    expect(res.status).toBe(200);
    a.csrf = res.body.data.csrfToken;
    expect((await a.get('/api/account')).status).toBe(200);
    expect((await other.get('/api/account')).status).toBe(401);
  });
});

describe('admin', () => {
  async function makeAdmin() {
    const a = new ApiAgent(t.app);
    const email = uniqueEmail('admin');
    const u = await a.signUp({ email });
    await t.ds.query(`UPDATE users SET role = 'admin' WHERE id = $1`, [u.id]);
    return a;
  }

  it('disables an account, which signs it out and blocks sign-in', async () => {
    const admin = await makeAdmin();
    const email = uniqueEmail();
    const g = new ApiAgent(t.app);
    const user = await g.signUp({ email });
    const res = await admin.patch(`/api/admin/users/${user.id}`, { disabled: true });
    expect(res.status).toBe(200);
    expect(res.body.data.disabled).toBe(true);
    expect((await g.get('/api/account')).status).toBe(401);
    const again = await new ApiAgent(t.app).signIn(email);
    expect(again.status).toBe(401);
    expect(again.body.error.message).toMatch(/disabled/);
  });

  it('changes a role and lists accounts with a search', async () => {
    const admin = await makeAdmin();
    const email = uniqueEmail('teacher');
    const user = await new ApiAgent(t.app).signUp({ email });
    expect((await admin.patch(`/api/admin/users/${user.id}`, { role: 'educator' })).body.data.role).toBe('educator');
    const list = await admin.get(`/api/admin/users?q=${encodeURIComponent(email)}`);
    expect(list.status).toBe(200);
    expect(list.body.data).toHaveLength(1);
    expect(list.body.meta.total).toBe(1);
  });

  it('a role change takes effect on the account\'s next request, with the session it already has', async () => {
    const admin = await makeAdmin();
    const g = new ApiAgent(t.app);
    const user = await g.signUp({ email: uniqueEmail('teacher') });
    // Creating a cohort is for educators: the role check answers before the body is validated.
    expect((await g.post('/api/cohorts', {})).status).toBe(403);
    expect((await admin.patch(`/api/admin/users/${user.id}`, { role: 'educator' })).status).toBe(200);
    expect((await g.get('/api/account')).body.data.role).toBe('educator');
    expect((await g.post('/api/cohorts', {})).status).toBe(400);
    expect((await admin.patch(`/api/admin/users/${user.id}`, { role: 'grower' })).status).toBe(200);
    expect((await g.post('/api/cohorts', {})).status).toBe(403);
  });

  it('reads the signed-in account with the session as the same entity a lookup by id gives', async () => {
    const g = new ApiAgent(t.app);
    const user = await g.signUp({ email: uniqueEmail() });
    await t.ds.query(`UPDATE users SET email_verified_at = now(), disabled_at = NULL WHERE id = $1`, [user.id]);
    const join = sessionUserJoin(t.ds);
    const [row] = (await t.ds.query(`SELECT ${join.select} FROM ${join.usersTable} u WHERE u.id = $1`, [user.id])) as Record<string, unknown>[];
    const viaJoin = join.hydrate(row!);
    const viaLookup = await t.ds.getRepository(UserEntity).findOneByOrFail({ id: user.id });
    expect(viaJoin).toBeInstanceOf(UserEntity);
    expect(viaJoin).toStrictEqual(viaLookup);
    expect(viaJoin.sessionsValidAfter.getTime()).toBe(viaLookup.sessionsValidAfter.getTime());
  });

  it('shows the development outbox and system health', async () => {
    const admin = await makeAdmin();
    const out = await admin.get('/api/admin/outbox');
    expect(out.status).toBe(200);
    expect(out.body.meta.available).toBe(true);
    expect(out.body.data.length).toBeGreaterThan(0);
    const health = await admin.get('/api/admin/health');
    expect(health.body.data.database.status).toBe('up');
    expect(health.body.data.database.migrationsApplied).toBeGreaterThan(0);
  });
});
