/**
 * The headers every answer carries (src/lib/security-policy.ts): no MIME sniffing, not framed by
 * other sites, no full referrers sent out, its own browsing context group, powerful features off,
 * and a Content-Security-Policy — for pages the app's whole policy around the script hashes Astro
 * sent (experimental.csp, astro.config.mjs), for anything else one that lets nothing run. Signed-in
 * pages and every API answer are `Cache-Control: no-store`: household records stay out of shared
 * and back-button caches. The outermost step, so that the answers of the other steps (a refused
 * cross-site request, the redirect to sign-in) carry them too. Static files never reach the
 * middleware: src/server/boot.ts gives them the base headers.
 */
import { defineMiddleware } from 'astro:middleware';
import { OFFLINE_KEEP_HEADER, offlineRoutes } from '@/lib/app-cache';
import { BASE_SECURITY_HEADERS, NON_PAGE_POLICY, pagePolicy, scriptHashesOf } from '@/lib/security-policy';

const offline = offlineRoutes();

export const securityHeaders = defineMiddleware(async (ctx, next) => {
  const response = await next();
  const isApi = ctx.url.pathname.startsWith('/api/');
  const noStore = isApi || ctx.locals.user !== null;
  // A page answering a bare 404/500 (`new Response(null, { status: 404 })`) is replaced by Astro's
  // error page, which keeps these headers: it gets the page policy, or its inline styles are blocked.
  const errorPage = !isApi && response.body === null && (response.status === 404 || response.status === 500);
  withSecurityHeaders(response, { noStore, page: errorPage });
  // `no-store` keeps these out of every HTTP cache; our own service worker (astro.config.mjs) keeps
  // a copy in the app's offline store only of what is marked here: the offline pages and lists a
  // grower opens with no signal, emptied at sign-in and sign-out.
  const href = ctx.url.href;
  if (ctx.request.method === 'GET' && response.status === 200 && ctx.locals.user && (offline.lists.test(href) || offline.pages.test(href))) {
    try {
      response.headers.set(OFFLINE_KEEP_HEADER, 'keep');
    } catch {
      // Immutable headers (a fetched Response passed through): not kept offline.
    }
  }
  return response;
});

/** Adds each header the response does not set itself; writes the Content-Security-Policy whole. */
export function withSecurityHeaders(response: Response, opts: { noStore?: boolean; page?: boolean } = {}): Response {
  const h = response.headers;
  const set = (name: string, value: string) => {
    if (!h.has(name)) h.set(name, value);
  };
  try {
    for (const [name, value] of Object.entries(BASE_SECURITY_HEADERS)) set(name, value);
    const isPage = opts.page || (h.get('content-type') ?? '').startsWith('text/html');
    h.set('Content-Security-Policy', isPage ? pagePolicy(scriptHashesOf(h.get('content-security-policy'))) : NON_PAGE_POLICY);
    if (opts.noStore) set('Cache-Control', 'no-store');
  } catch {
    // Some responses (e.g. a fetched Response passed through) have immutable headers: leave them.
  }
  return response;
}
