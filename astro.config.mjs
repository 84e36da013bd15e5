// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import { fileURLToPath } from 'node:url';

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

// Server-rendered app on the Node standalone adapter; React only for interactive islands.
export default defineConfig({
  output: 'server',
  // Parallel test runs (one per developer checkout) may build into their own folder. The one read of
  // process.env outside src/server/config.ts: the folder is needed at build time, when this file is
  // loaded by Astro itself; keep the default in step with SELFSOWN_OUT_DIR in config.ts.
  outDir: process.env.SELFSOWN_OUT_DIR || './dist',
  adapter: node({ mode: 'standalone' }),
  integrations: [react()],
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
    plugins: [tailwindcss(), bootOnServerStart()],
    // mysql2 and friends stay as Node modules in the server bundle.
    ssr: { external: ['mysql2', 'nodemailer', 'smtp-server', 'mailparser', 'highs'] },
  },
});
