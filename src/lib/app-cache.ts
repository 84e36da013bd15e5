/**
 * What the service worker keeps for use with no signal, in one place: the household pages a grower
 * needs in the garden and the API lists they read (kept after one visit; astro.config.mjs builds
 * the worker's routes from these), the names of the runtime caches that hold them (emptied at
 * sign-in and sign-out, so one person's household pages never open for the next person on the
 * same phone) and the offline page.
 */

/** The caches the worker fills at run time (not the precache of built files, which holds no household data). */
export const RUNTIME_CACHES = {
  /** Household pages: the Log page, Bought food, the harvest log. */
  pages: 'selfsown-pages',
  /** The household API lists those pages read: crops, staples, harvests, bought food, plantings. */
  api: 'selfsown-api',
} as const;

/** Household pages kept for offline use, by the last part of their path. */
export const OFFLINE_PAGES = ['log', 'bought', 'harvests'] as const;

/** Household API lists kept for offline use (GET only), by the last part of their path. */
export const OFFLINE_LISTS = ['crops', 'staples', 'harvests', 'purchases', 'plantings'] as const;

/**
 * The header the server sets on an answer the worker may keep for offline use (the offline pages and
 * lists, for a signed-in person). Those answers are `Cache-Control: no-store` like every household
 * answer — kept out of every HTTP cache — so the worker keeps only what carries this mark.
 */
export const OFFLINE_KEEP_HEADER = 'X-Selfsown-Offline';

/** The page the worker shows for a page never opened with a signal (public/offline.html). */
export const OFFLINE_FALLBACK = '/offline.html';

/**
 * The worker's route patterns, matched against a request's whole URL (Workbox tests a RegExp route
 * against `url.href`; anchored at the origin so that /api/households/7/harvests is not the page
 * /households/7/harvests). Query strings are allowed: the harvest log asks for pages and sorts.
 * Example: `offlineRoutes().pages.test('https://x.example/households/7/log')` → true
 */
export function offlineRoutes(): { pages: RegExp; lists: RegExp } {
  const origin = '^[a-z]+://[^/]+';
  return {
    pages: new RegExp(`${origin}/households/\\d+/(${OFFLINE_PAGES.join('|')})/?(\\?.*)?$`),
    lists: new RegExp(`${origin}/api/households/\\d+/(${OFFLINE_LISTS.join('|')})(\\?.*)?$`),
  };
}
