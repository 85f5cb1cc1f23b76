/**
 * Shared pieces of the resilience tests: databases in the shared cluster, and a tiny HTTP client
 * that keeps the session cookie and sends the CSRF token as the web client does. App instances:
 * app-instance.ts; clusters: cluster.ts.
 */
import pg from 'pg';
import { inject } from 'vitest';

declare module 'vitest' {
  export interface ProvidedContext {
    resiliencePgPort: number;
    resilienceTemplate: string;
  }
}

export { nullMailer, serveApp, SESSION_SECRET, type ServedApp } from './app-instance';

/** A new database in the shared cluster: a copy of the migrated template, or empty. */
export async function sharedDatabase(name: string, opts: { empty?: boolean } = {}): Promise<string> {
  const port = inject('resiliencePgPort');
  const admin = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${port}/postgres` });
  await admin.connect();
  try {
    await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await admin.query(opts.empty ? `CREATE DATABASE ${name}` : `CREATE DATABASE ${name} TEMPLATE ${inject('resilienceTemplate')}`);
  } finally {
    await admin.end();
  }
  return `postgres://app@127.0.0.1:${port}/${name}`;
}

/** Runs one query on its own short-lived connection (never the app's pools). */
export async function sql<T = Record<string, unknown>>(url: string, text: string, params: unknown[] = []): Promise<T[]> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    return (await c.query(text, params)).rows as T[];
  } finally {
    await c.end();
  }
}

export interface HttpResult {
  status: number;
  headers: Headers;
  body: { data?: unknown; error?: { code: string; message: string; details?: unknown } } & Record<string, unknown>;
}

/** A cookie-keeping HTTP client for one person; sends the session's CSRF token on writes. */
export class HttpClient {
  cookie = '';
  csrf = '';
  constructor(public baseUrl: string) {}

  async request(method: string, url: string, body?: unknown, opts: { timeoutMs?: number; rawBody?: string } = {}): Promise<HttpResult> {
    const headers: Record<string, string> = {};
    if (this.cookie) headers.cookie = this.cookie;
    if (method !== 'GET') headers['x-csrf-token'] = this.csrf;
    let payload: string | undefined;
    if (opts.rawBody !== undefined) payload = opts.rawBody;
    else if (body !== undefined) payload = JSON.stringify(body);
    if (payload !== undefined) headers['content-type'] = 'application/json';
    const res = await fetch(`${this.baseUrl}${url}`, { method, headers, body: payload, signal: AbortSignal.timeout(opts.timeoutMs ?? 15_000) });
    const set = res.headers.getSetCookie().find((c) => c.startsWith('seepwise.sid='));
    if (set) this.cookie = set.split(';')[0]!;
    const text = await res.text();
    let parsed: HttpResult['body'] = {};
    try {
      parsed = text ? JSON.parse(text) : {};
    } catch {
      parsed = { raw: text };
    }
    return { status: res.status, headers: res.headers, body: parsed };
  }
  get(url: string) {
    return this.request('GET', url);
  }
  post(url: string, body: unknown = {}, opts: { timeoutMs?: number; rawBody?: string } = {}) {
    return this.request('POST', url, body, opts);
  }

  async refreshCsrf() {
    const res = await this.get('/api/auth/session');
    this.csrf = (res.body.data as { csrfToken: string }).csrfToken;
  }
  async signUp(email: string, password = 'tomato-basin-clay-42') {
    await this.refreshCsrf();
    const res = await this.post('/api/auth/sign-up', { email, password, displayName: email.split('@')[0], role: 'grower' });
    if (res.status !== 201) throw new Error(`sign-up: ${res.status} ${JSON.stringify(res.body)}`);
    this.csrf = (res.body.data as { csrfToken: string }).csrfToken;
  }
  async signIn(email: string, password = 'tomato-basin-clay-42') {
    await this.refreshCsrf();
    const res = await this.post('/api/auth/sign-in', { email, password });
    if (res.status !== 200) throw new Error(`sign-in: ${res.status} ${JSON.stringify(res.body)}`);
    this.csrf = (res.body.data as { csrfToken: string }).csrfToken;
  }
}

/** A garden, an active paired trial planted `plantingDate` and plots A1, A2, B1, B2, through the API. */
export async function makeTrial(c: HttpClient, plantingDate: string): Promise<{ trialId: string; plots: { id: string; label: string }[] }> {
  const garden = await c.post('/api/gardens', {
    name: 'Resilience bed',
    latitudeDeg: 35.08,
    longitudeDeg: -106.65,
    elevationM: 1500,
    soilTexture: 'sandy_loam',
  });
  if (garden.status !== 201) throw new Error(`garden: ${garden.status} ${JSON.stringify(garden.body)}`);
  const gardenId = (garden.body.data as { id: string }).id;
  const trial = await c.post(`/api/gardens/${gardenId}/trials`, { title: 'Resilience tomatoes', crop: 'tomato', plantingDate, design: 'paired' });
  if (trial.status !== 201) throw new Error(`trial: ${trial.status} ${JSON.stringify(trial.body)}`);
  const trialId = (trial.body.data as { id: string }).id;
  const plots: { id: string; label: string }[] = [];
  for (const [label, blockKey] of [
    ['A1', 'A'],
    ['A2', 'A'],
    ['B1', 'B'],
    ['B2', 'B'],
  ]) {
    const p = await c.post(`/api/trials/${trialId}/plots`, { label, blockKey, areaM2: 2 });
    if (p.status !== 201) throw new Error(`plot: ${p.status} ${JSON.stringify(p.body)}`);
    plots.push(p.body.data as { id: string; label: string });
  }
  await c.post(`/api/trials/${trialId}/randomise`, { seed: 'resilience' });
  const active = await c.post(`/api/trials/${trialId}/status`, { status: 'active' });
  if (active.status !== 200) throw new Error(`status: ${active.status} ${JSON.stringify(active.body)}`);
  return { trialId, plots };
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
