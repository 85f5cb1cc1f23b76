/**
 * How responses travel: gzip for text when the client accepts it (RFC 9110 §8.4 content codings,
 * decoded here by Node's own zlib as the outside check), streamed CSV exports still streamed
 * (chunked, no Content-Length: nothing buffered whole), and the built client's caching rules
 * (RFC 9111 Cache-Control; `immutable` is RFC 8246): hashed /assets for a year, the page shell, the
 * service worker and the web manifest revalidated on every load.
 */
import { CookieAccessInfo } from 'cookiejar';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { gunzipSync } from 'node:zlib';
import request from 'supertest';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { serveBuiltClient } from '../../server/http/built-client';
import { makePairedTrial } from '../helpers/notebook-fixtures';
import { ApiAgent, listen, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
let server: Awaited<ReturnType<typeof listen>>;
let dist: string;
// A made-up build: what `vite build` + vite-plugin-pwa put in dist/ (names as they produce them).
const script = `export const rows = [${Array.from({ length: 400 }, (_, i) => `{ id: ${i}, label: "plot ${i}" }`).join(', ')}];\n`;
const files: Record<string, string> = {
  'index.html': '<!doctype html><html><head><script type="module" src="/assets/index-B4xk2Q9a.js"></script></head><body><div id="root"></div></body></html>',
  'assets/index-B4xk2Q9a.js': script,
  'assets/index-Cq1n8ZpE.css': 'body{margin:0}',
  'sw.js': 'self.addEventListener("install",()=>{});',
  'workbox-5e4f1c2d.js': 'self.workbox={};',
  'manifest.webmanifest': '{"name":"Seepwise","start_url":"/"}',
  'icon-192.png': 'not really a png',
};

beforeAll(async () => {
  dist = fs.mkdtempSync(path.join(os.tmpdir(), 'seepwise-dist-'));
  for (const [name, body] of Object.entries(files)) {
    fs.mkdirSync(path.dirname(path.join(dist, name)), { recursive: true });
    fs.writeFileSync(path.join(dist, name), body);
  }
  t = await startTestApp({ client: serveBuiltClient(dist) });
  server = await listen(t.app);
  t.clock.now = new Date('2026-09-30T12:00:00Z');
});
afterAll(async () => {
  await server?.close();
  await t?.close();
  if (dist) fs.rmSync(dist, { recursive: true, force: true });
});

/** A GET over a real socket, the body exactly as sent (supertest would decode it), with the agent's cookies when given. */
function raw(pathname: string, acceptEncoding: string, as?: ApiAgent): Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }> {
  const cookie = as ? as.agent.jar.getCookies(CookieAccessInfo.All).toValueString() : '';
  return new Promise((resolve, reject) => {
    http
      .get(server.url + pathname, { headers: { 'Accept-Encoding': acceptEncoding, ...(cookie ? { Cookie: cookie } : {}) } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
        res.on('error', reject);
      })
      .on('error', reject);
  });
}

describe('compression', () => {
  it('gzips a script for a client that accepts gzip, and sends it as is to one that does not', async () => {
    const gz = await raw('/assets/index-B4xk2Q9a.js', 'gzip');
    expect(gz.status).toBe(200);
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.headers['vary']).toMatch(/accept-encoding/i);
    const body = gz.body;
    expect(body.length).toBeLessThan(script.length / 4);
    expect(gunzipSync(body).toString('utf8')).toBe(script);

    const plain = await raw('/assets/index-B4xk2Q9a.js', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString('utf8')).toBe(script);
  });

  it('leaves a non-text file and a tiny body uncompressed', async () => {
    const png = await request(t.app).get('/icon-192.png').set('Accept-Encoding', 'gzip');
    expect(png.headers['content-encoding']).toBeUndefined();
    const css = await request(t.app).get('/assets/index-Cq1n8ZpE.css').set('Accept-Encoding', 'gzip');
    expect(css.headers['content-encoding']).toBeUndefined(); // under the 1 kB threshold
  });

  it('streams a CSV export gzipped (chunked, no Content-Length), and it decodes to the same rows as the plain one', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const { trial, plots } = await makePairedTrial(a);
    for (let i = 0; i < 40; i++) {
      const r = await a.post(`/api/trials/${trial.id}/water-events`, { plotId: plots[i % plots.length]!.id, occurredAt: `2026-06-${String((i % 28) + 1).padStart(2, '0')}T07:30:00Z`, kind: 'surface', volumeL: 4 + (i % 5) });
      expect(r.status).toBe(201);
    }
    const url = `/api/trials/${trial.id}/export/water-events.csv`;
    const gz = await raw(url, 'gzip', a);
    expect(gz.status).toBe(200);
    expect(gz.headers['content-type']).toMatch(/^text\/csv/);
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.headers['transfer-encoding']).toBe('chunked');
    expect(gz.headers['content-length']).toBeUndefined();
    const plain = await raw(url, 'identity', a);
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    const decoded = gunzipSync(gz.body).toString('utf8');
    expect(decoded).toBe(plain.body.toString('utf8'));
    const rows = Papa.parse<Record<string, string>>(decoded.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true }).data;
    expect(rows).toHaveLength(40);
  });

  it('gzips a JSON API response over 1 kB', async () => {
    const a = new ApiAgent(t.app);
    await a.signUp({ email: uniqueEmail() });
    const { trial } = await makePairedTrial(a);
    const res = await a.agent.get(`/api/trials/${trial.id}/plots`).set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(JSON.stringify(res.body).length).toBeGreaterThan(1024);
    expect(res.headers['content-encoding']).toBe('gzip');
    const small = await a.agent.get('/api/auth/session').set('Accept-Encoding', 'gzip');
    expect(JSON.stringify(small.body).length).toBeLessThan(1024);
    expect(small.headers['content-encoding']).toBeUndefined();
  });
});

describe('the built client', () => {
  it('caches hashed assets for a year, immutable', async () => {
    for (const file of ['/assets/index-B4xk2Q9a.js', '/assets/index-Cq1n8ZpE.css']) {
      const res = await request(t.app).get(file);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    }
  });

  it('revalidates the service worker, its runtime, the web manifest and the page shell on every load', async () => {
    for (const file of ['/sw.js', '/workbox-5e4f1c2d.js', '/manifest.webmanifest', '/index.html']) {
      const res = await request(t.app).get(file);
      expect(res.status, file).toBe(200);
      expect(res.headers['cache-control'], file).toBe('no-cache');
    }
    const page = await request(t.app).get('/trials/abc/round');
    expect(page.status).toBe(200);
    expect(page.headers['content-type']).toMatch(/text\/html/);
    expect(page.headers['cache-control']).toBe('no-cache');
    expect(page.text).toContain('<div id="root">');
  });

  it('answers 404 for a hashed file that is not in this build, not the page shell', async () => {
    const res = await request(t.app).get('/assets/trial-OldBuild1.js');
    expect(res.status).toBe(404);
    expect(res.text).not.toContain('<div id="root">');
  });

  it('still answers unknown API paths with the API 404, not the page shell', async () => {
    const res = await request(t.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/application\/json/);
  });
});
