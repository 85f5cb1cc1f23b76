import express, { type RequestHandler, type Response } from 'express';
import path from 'node:path';

/** A year: files under /assets carry a content hash in their names, so one name never changes content. */
const IMMUTABLE = 'public, max-age=31536000, immutable';
/** Always revalidated (a cheap 304 when unchanged): the entry points that name the hashed files. */
const REVALIDATE = 'no-cache';

/**
 * Files that must be checked on every load: the page shell names the current build's hashed files,
 * and the service worker and the web manifest decide what an installed app runs (browsers cap a
 * service worker's HTTP caching at a day, but a release should reach phones on their next visit).
 */
const ALWAYS_REVALIDATED = new Set(['/index.html', '/sw.js', '/registerSW.js', '/manifest.webmanifest']);

function setCacheHeaders(res: Response, file: string, dist: string) {
  const rel = '/' + path.relative(dist, file).split(path.sep).join('/');
  if (rel.startsWith('/assets/')) res.setHeader('Cache-Control', IMMUTABLE);
  else if (ALWAYS_REVALIDATED.has(rel) || rel.startsWith('/workbox-')) res.setHeader('Cache-Control', REVALIDATE);
  else res.setHeader('Cache-Control', 'public, max-age=3600');
}

/**
 * The production build (`vite build` → dist/) behind the API: static files with their caching rules,
 * then index.html for every other GET (the client's router takes the path). Used by `npm start` in
 * production, the browser tests and the benchmark, so all three serve it the same way.
 * Compression is the app's (server/http/compression.ts), in front of this.
 */
export function serveBuiltClient(dist: string): RequestHandler[] {
  const indexHtml = path.join(dist, 'index.html');
  return [
    express.static(dist, { index: false, setHeaders: (res, file) => setCacheHeaders(res, file, dist) }),
    (req, res, next) => {
      if (req.method !== 'GET' && req.method !== 'HEAD') return next();
      // A missing hashed file is a 404, not the page shell (a stale tab asking for an old build's chunk).
      if (req.path.startsWith('/assets/')) return next();
      res.setHeader('Cache-Control', REVALIDATE);
      res.sendFile(indexHtml, { cacheControl: false });
    },
  ];
}
