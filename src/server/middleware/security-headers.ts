/**
 * The headers every answer carries: no MIME sniffing, not framed by other sites, no full referrers
 * sent out. The outermost step, so that the answers of the other steps (a refused cross-site
 * request, the redirect to sign-in) carry them too.
 *
 * Caching of household data, decided here once. JSON answers say `no-store` (src/server/http.ts):
 * never kept anywhere, and the service worker honours it. Two exceptions say `private, no-cache`
 * instead — no shared cache, and the browser asks the server each time, but the service worker
 * may keep the last copy for use with no signal (astro.config.mjs; emptied at sign-in and
 * sign-out): the pages of a signed-in person (which set no rule of their own) and the few API
 * lists the offline pages read (src/lib/app-cache.ts: crops, staples, harvests, bought food,
 * plantings). Exports, members, people and the rest stay `no-store`.
 */
import { defineMiddleware } from 'astro:middleware';
import { offlineRoutes } from '@/lib/app-cache';

/** The caching rule of what a grower may open with no signal: kept on the device only. */
export const KEPT_OFFLINE_CACHE_CONTROL = 'private, no-cache';

const offlineLists = offlineRoutes().lists;

export const securityHeaders = defineMiddleware(async (ctx, next) => {
  const response = await next();
  const keptList = ctx.request.method === 'GET' && response.status === 200 && offlineLists.test(ctx.url.href);
  if (keptList) trySet(response, 'Cache-Control', KEPT_OFFLINE_CACHE_CONTROL);
  return withSecurityHeaders(response, ctx.locals.user ? KEPT_OFFLINE_CACHE_CONTROL : undefined);
});

function trySet(response: Response, name: string, value: string): void {
  try {
    response.headers.set(name, value);
  } catch {
    // Immutable headers (a fetched Response passed through): leave them.
  }
}

/** Adds each header the response does not set itself (and the cache rule, when given). */
export function withSecurityHeaders(response: Response, cacheControl?: string): Response {
  const set = (name: string, value: string) => {
    if (!response.headers.has(name)) response.headers.set(name, value);
  };
  try {
    set('X-Content-Type-Options', 'nosniff');
    set('X-Frame-Options', 'SAMEORIGIN');
    set('Content-Security-Policy', "frame-ancestors 'self'");
    set('Referrer-Policy', 'strict-origin-when-cross-origin');
    if (cacheControl) set('Cache-Control', cacheControl);
  } catch {
    // Some responses (e.g. a fetched Response passed through) have immutable headers: leave them.
  }
  return response;
}
