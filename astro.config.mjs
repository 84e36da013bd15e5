// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import AstroPWA from '@vite-pwa/astro';
import { fileURLToPath } from 'node:url';
import { OFFLINE_FALLBACK, offlineRoutes, RUNTIME_CACHES } from './src/lib/app-cache.ts';
import { PALETTE } from './src/lib/palette.ts';
import { randomUUID } from 'node:crypto';

/**
 * Adds `import 'src/server/boot.ts'` to the built server's entry (dist/server/entry.mjs), so that
 * work meant to run from start-up (the monthly letter's scheduler) starts with the server: Astro
 * loads the middleware and the pages lazily, on the first request. Build only; `astro dev` runs
 * no scheduler.
 */
/** @returns {import('vite').Plugin} */
function bootOnServerStart() {
  const boot = fileURLToPath(new URL('./src/server/boot.ts', import.meta.url));
  return {
    name: 'selfsown:boot-on-server-start',
    apply: 'build',
    transform(code, id) {
      if (id === '\0@astrojs-ssr-virtual-entry') return { code: `import ${JSON.stringify(boot)};\n${code}`, map: null };
    },
  };
}

/** What @astrojs/node's standalone server does with each request: static files first, then the app. */
const STATIC_FIRST = 'staticHandler(req, res, () => appHandler(req, res));';

/**
 * Sends /api/ requests straight to the app in the built server. @astrojs/node's standalone handler
 * looks for a static file of every request's path first (a synchronous lstat, then `send`'s stat on
 * libuv's thread pool) and only falls back to the app when none is there; no static file lives
 * under /api/, and that detour cost every API answer about half a millisecond (npm run bench). A
 * change in the adapter that drops the line this rewrites fails the build instead of going unnoticed.
 */
/** @returns {import('vite').Plugin} */
function apiSkipsStaticFiles() {
  return {
    name: 'selfsown:api-skips-static-files',
    apply: 'build',
    transform(code, id) {
      if (!id.replaceAll('\\', '/').endsWith('/@astrojs/node/dist/standalone.js')) return;
      if (!code.includes(STATIC_FIRST)) this.error(`@astrojs/node's standalone handler changed: "${STATIC_FIRST}" is gone; see apiSkipsStaticFiles in astro.config.mjs`);
      const apiFirst = "if (req.url.startsWith('/api/')) appHandler(req, res); else " + STATIC_FIRST;
      return { code: code.replace(STATIC_FIRST, apiFirst), map: null };
    },
  };
}

const THIRTY_DAYS = 30 * 24 * 60 * 60;
const routes = offlineRoutes();

/**
 * A Workbox plugin: keep no redirect (a signed-out visit lands on sign-in), and only answers the
 * server marked for offline use (the X-Selfsown-Offline header, src/lib/app-cache.ts). Household
 * answers are `no-store` for every HTTP cache (src/server/middleware/security-headers.ts); this
 * worker's copy lives in the app's own offline store, is used only when the network fails, and is
 * emptied at sign-in and sign-out. Written into the worker as text: self-contained.
 */
/** @type {import('workbox-core').WorkboxPlugin} */
const keepMarkedForOffline = {
  cacheWillUpdate: async ({ response }) =>
    response && !response.redirected && response.headers.get('x-selfsown-offline') === 'keep' ? response : null,
};

/**
 * The installable app (@vite-pwa/astro, Workbox generateSW): a web app manifest with our own icons
 * (public/icons, `npm run gen:app-files`) and a service worker that precaches the built client
 * files (scripts, styles, fonts, icons, the offline page — no household data) and keeps, after
 * one visit, the household pages and API lists a grower needs offline (src/lib/app-cache.ts):
 * network first, the last copy when there is no network. Any other page with no network gets the
 * offline page. Entries made offline are not the worker's business: the page's own queue keeps
 * and sends them (src/components/entries/outbox.ts).
 */
const pwa = AstroPWA({
  registerType: 'autoUpdate',
  // Registered by Base.astro (virtual:pwa-register): Astro's server-rendered pages get no injected tag.
  injectRegister: false,
  includeAssets: [],
  manifest: {
    name: 'Selfsown',
    short_name: 'Selfsown',
    description: 'Log harvests and bought food; see how much of what you eat comes from your own ground.',
    lang: 'en',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    background_color: PALETTE['loam-50'],
    theme_color: PALETTE['sprout-700'],
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      { src: '/icons/icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
    ],
  },
  workbox: {
    globPatterns: ['**/*.{js,css,woff2,svg,png,html}'],
    // A server-rendered app has no index.html to fall back to: unlisted pages go to the network.
    navigateFallback: null,
    // Keep public/offline.html under its own name (the integration would rename *.html to pretty URLs).
    manifestTransforms: [async (entries) => ({ manifest: entries, warnings: [] })],
    cleanupOutdatedCaches: true,
    // A new worker takes over at once, and takes the open pages too: the first visit is kept offline.
    skipWaiting: true,
    clientsClaim: true,
    runtimeCaching: [
      {
        urlPattern: routes.lists,
        handler: 'NetworkFirst',
        options: {
          cacheName: RUNTIME_CACHES.api,
          networkTimeoutSeconds: 5,
          expiration: { maxEntries: 100, maxAgeSeconds: THIRTY_DAYS },
          cacheableResponse: { statuses: [200] },
          plugins: [keepMarkedForOffline],
        },
      },
      {
        urlPattern: routes.pages,
        handler: 'NetworkFirst',
        options: {
          cacheName: RUNTIME_CACHES.pages,
          networkTimeoutSeconds: 5,
          expiration: { maxEntries: 30, maxAgeSeconds: THIRTY_DAYS },
          cacheableResponse: { statuses: [200] },
          plugins: [keepMarkedForOffline],
          precacheFallback: { fallbackURL: OFFLINE_FALLBACK },
        },
      },
      {
        urlPattern: ({ request }) => request.mode === 'navigate',
        handler: 'NetworkOnly',
        options: { precacheFallback: { fallbackURL: OFFLINE_FALLBACK } },
      },
    ],
  },
});

// Server-rendered app on the Node standalone adapter; React only for interactive islands.
export default defineConfig({
  output: 'server',
  // Parallel test runs (one per developer checkout) may build into their own folder. The one read of
  // process.env outside src/server/config.ts: the folder is needed at build time, when this file is
  // loaded by Astro itself; keep the default in step with SELFSOWN_OUT_DIR in config.ts.
  outDir: process.env.SELFSOWN_OUT_DIR || './dist',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), pwa],
  // Origin checks are done in src/middleware.ts against PUBLIC_ORIGIN (read at run time). Astro's own
  // check compares with Astro.url, whose host is "localhost" unless security.allowedDomains is baked
  // into the build, and so refused every same-site DELETE without a body.
  security: { checkOrigin: false },
  // Astro hashes the scripts it inlines (island runtime, client directives, small page scripts) and
  // sends them in a Content-Security-Policy header; src/server/middleware/security-headers.ts keeps
  // those script hashes and writes the app's whole policy around them.
  experimental: { csp: true },
  server: { host: '127.0.0.1', port: 4321 },
  vite: {
    plugins: [tailwindcss(), bootOnServerStart(), apiSkipsStaticFiles()],
    // One id per build: stored share answers (src/server/share-cache.ts) never outlive the code that wrote them.
    define: { __SELFSOWN_BUILD__: JSON.stringify(`${new Date().toISOString()}-${randomUUID().slice(0, 8)}`) },
    // mysql2 and friends stay as Node modules in the server bundle.
    ssr: { external: ['mysql2', 'nodemailer', 'smtp-server', 'mailparser', 'highs'] },
  },
});
