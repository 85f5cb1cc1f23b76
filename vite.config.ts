import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';
import { defineConfig, type Plugin } from 'vite';
import { VitePWA } from 'vite-plugin-pwa';

const r = (p: string) => fileURLToPath(new URL(p, import.meta.url));

/**
 * In development (Vite inside Express, same origin as a production run) /sw.js is a worker that
 * removes itself and its caches and reloads its pages: a phone or browser that ran the built app
 * on this address would otherwise keep serving the built shell instead of the dev server.
 */
const devServiceWorkerReset: Plugin = {
  name: 'seepwise:dev-service-worker-reset',
  apply: 'serve',
  configureServer(server) {
    server.middlewares.use('/sw.js', (_req, res) => {
      res.setHeader('Content-Type', 'text/javascript');
      res.setHeader('Cache-Control', 'no-store');
      res.end(
        `self.addEventListener('install', () => self.skipWaiting());
self.addEventListener('activate', (event) => event.waitUntil((async () => {
  await self.registration.unregister();
  await Promise.all((await caches.keys()).map((k) => caches.delete(k)));
  for (const c of await self.clients.matchAll({ type: 'window' })) c.navigate(c.url);
})()));`,
      );
    });
  },
};

export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    devServiceWorkerReset,
    // Installable app and offline shell. Registered by src/features/offline/service-worker.ts in
    // production builds only. Never caches /api: what the Round needs offline is kept by the query
    // client (features/offline/persist.ts), per signed-in session, not in a shared cache.
    VitePWA({
      injectRegister: false,
      registerType: 'autoUpdate',
      filename: 'sw.js',
      includeAssets: ['seepwise.svg', 'apple-touch-icon.png'],
      manifest: {
        id: '/',
        name: 'Seepwise',
        short_name: 'Seepwise',
        description: 'Side-by-side trials of buried clay pots against surface watering, with honest statistics.',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'any',
        theme_color: '#b5562f',
        background_color: '#fdfaf5',
        icons: [
          { src: '/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: '/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          { src: '/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
          { src: '/seepwise.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
        ],
      },
      workbox: {
        // The shell: entry JS and CSS, the import worker, index.html, icons, and the Latin fonts
        // (other scripts' fonts and the lazy chart are cached the first time they are used).
        globPatterns: ['**/*.{js,css,html,svg,png,webmanifest}', 'assets/ibm-plex-sans-latin-*.woff2'],
        globIgnores: ['**/vega-chart-*.js'],
        navigateFallback: 'index.html',
        navigateFallbackDenylist: [/^\/api\//],
        runtimeCaching: [
          {
            // Hashed build files never change under one name.
            urlPattern: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith('/assets/'),
            handler: 'CacheFirst',
            options: { cacheName: 'seepwise-assets', expiration: { maxEntries: 80, maxAgeSeconds: 90 * 24 * 3600 } },
          },
        ],
        cleanupOutdatedCaches: true,
        clientsClaim: true,
        skipWaiting: true,
        sourcemap: false,
      },
    }),
  ],
  resolve: {
    alias: { '@': r('./src'), '@shared': r('./shared') },
    // The persist packages pin an older @tanstack/query-core than react-query's; one copy in the bundle.
    dedupe: ['@tanstack/query-core'],
  },
  build: {
    outDir: 'dist',
    sourcemap: true,
    chunkSizeWarningLimit: 1500,
  },
});
