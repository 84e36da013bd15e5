/**
 * Runs once when the built app server starts (`node dist/server/entry.mjs`, and so `npm start`):
 * astro.config.mjs adds an import of this module to the server entry, because the middleware and
 * the pages are only loaded on the first request. Starts the monthly letter's scheduler, fails the
 * dataset jobs a stopped server left running (dataset-jobs.ts), and gives every answer the base
 * security headers before anything else handles it — static files (served by @astrojs/node before
 * Astro's middleware) included; the middleware's own values win on the rest.
 */
import { subscribe } from 'node:diagnostics_channel';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { BASE_SECURITY_HEADERS } from '@/lib/security-policy';
import { sweepAtStart } from './dataset-jobs';
import { startLetterScheduler } from './letter-scheduler';

// Node publishes every incoming request here before the server's handler runs (Node ≥ 18.7).
subscribe('http.server.request.start', (message) => {
  const { request, response } = message as { request: IncomingMessage; response: ServerResponse };
  for (const [name, value] of Object.entries(BASE_SECURITY_HEADERS)) response.setHeader(name, value);
  if (request.url?.startsWith('/api/') && !decodes(request.url)) answerBadAddressAsJson(response);
});

function decodes(url: string): boolean {
  try {
    decodeURI(url);
    return true;
  } catch {
    return false;
  }
}

/**
 * @astrojs/node answers an address that is not valid percent-encoded UTF-8 with a plain-text 400
 * before Astro (and our api-errors middleware) sees it; an /api/ caller gets the documented JSON
 * shape instead, with the same status.
 */
function answerBadAddressAsJson(response: ServerResponse): void {
  const body = JSON.stringify({ error: { code: 'bad_address', message: 'The address is not valid: its percent-encoding is not UTF-8.' } });
  response.setHeader('content-type', 'application/json; charset=utf-8');
  response.setHeader('cache-control', 'no-store');
  const end = response.end.bind(response);
  response.end = ((..._args: unknown[]) => end(body)) as typeof response.end;
}

startLetterScheduler();
// Not awaited: the server must start even while the database is still coming up.
sweepAtStart().catch((e: unknown) => console.error('dataset jobs: the check at start failed', e));
