/**
 * Runs once when the built app server starts (`node dist/server/entry.mjs`, and so `npm start`):
 * astro.config.mjs adds an import of this module to the server entry, because the middleware and
 * the pages are only loaded on the first request. Starts the monthly letter's scheduler, and gives
 * every answer the base security headers before anything else handles it — static files (served by
 * @astrojs/node before Astro's middleware) included; the middleware's own values win on the rest.
 */
import { subscribe } from 'node:diagnostics_channel';
import type { ServerResponse } from 'node:http';
import { BASE_SECURITY_HEADERS } from '@/lib/security-policy';
import { startLetterScheduler } from './letter-scheduler';

// Node publishes every incoming request here before the server's handler runs (Node ≥ 18.7).
subscribe('http.server.request.start', (message) => {
  const { response } = message as { response: ServerResponse };
  for (const [name, value] of Object.entries(BASE_SECURITY_HEADERS)) response.setHeader(name, value);
});

startLetterScheduler();
