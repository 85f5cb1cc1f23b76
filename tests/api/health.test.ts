import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('GET /api/health', () => {
  it('reports the database as up', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body.data.status).toBe('ok');
    expect(res.body.data.database.status).toBe('up');
    expect(typeof res.body.data.database.latencyMs).toBe('number');
  });
});

describe('unknown API routes and bad bodies', () => {
  it('answers an unknown route with the one error shape', async () => {
    const res = await request(t.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'not_found', message: expect.any(String) } });
  });

  it('refuses malformed JSON with validation_failed, not a 500', async () => {
    const agent = request.agent(t.app);
    const s = await agent.get('/api/auth/session');
    const res = await agent
      .post('/api/auth/sign-in')
      .set('X-CSRF-Token', s.body.data.csrfToken)
      .set('Content-Type', 'application/json')
      .send('{"email": "a@b.c", ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
  });

  it('sets security headers with a content security policy that allows only our own assets', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
