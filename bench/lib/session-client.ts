/**
 * A signed-in HTTP client for the benchmark: keeps the session cookie and the CSRF token the way
 * the browser client does (src/lib/api-client.ts). Loopback only.
 */
export class SessionClient {
  cookie = '';
  csrf = '';
  constructor(readonly baseUrl: string) {
    if (!/^http:\/\/127\.0\.0\.1:\d+$/.test(baseUrl)) throw new Error(`The benchmark only talks to 127.0.0.1, not ${baseUrl}`);
  }

  private absorb(res: Response) {
    for (const c of res.headers.getSetCookie()) {
      const pair = c.split(';')[0] ?? '';
      if (pair.startsWith('seepwise.sid=')) this.cookie = pair;
    }
  }

  headers(extra: Record<string, string> = {}): Record<string, string> {
    return { cookie: this.cookie, 'x-csrf-token': this.csrf, accept: 'application/json', ...extra };
  }

  async get(path: string): Promise<Response> {
    const res = await fetch(this.baseUrl + path, { headers: this.headers() });
    this.absorb(res);
    return res;
  }

  async post(path: string, body: unknown): Promise<Response> {
    const res = await fetch(this.baseUrl + path, { method: 'POST', headers: this.headers({ 'content-type': 'application/json' }), body: typeof body === 'string' ? body : JSON.stringify(body) });
    this.absorb(res);
    return res;
  }

  /** The real flow: GET /api/auth/session for an anonymous session and its token, then sign in (which regenerates both). */
  async signIn(email: string, password: string): Promise<{ id: string; role: string }> {
    const s = await this.get('/api/auth/session');
    this.csrf = ((await s.json()) as { data: { csrfToken: string } }).data.csrfToken;
    const res = await this.post('/api/auth/sign-in', { email, password });
    const body = (await res.json()) as { data?: { csrfToken: string; user: { id: string; role: string } }; error?: unknown };
    if (res.status !== 200 || !body.data) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(body)}`);
    this.csrf = body.data.csrfToken;
    return body.data.user;
  }
}
