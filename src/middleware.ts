/**
 * Every request: refuse cross-site state changes, put the signed-in user and session on
 * Astro.locals, and send signed-out visitors of private pages to /sign-in?next=….
 * For signed-in page views it also puts the user's households and the current one on locals: the
 * household in the URL (/households/{id}/…) when the user belongs to it, else the one remembered in
 * the `household` cookie, else the only one.
 */
import { defineMiddleware } from 'astro:middleware';
import { getAuth } from './server/auth';
import { publicOrigin } from './server/config';
import { listHouseholds } from './server/households';
import { errorResponse } from './server/http';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);
/** Pages anyone may see; everything else needs sign-in. */
const PUBLIC_PAGES = [/^\/$/, /^\/sign-(in|up)\/?$/, /^\/forgot-password\/?$/, /^\/reset-password\/?$/, /^\/verify\/?$/, /^\/invite\//, /^\/foods(\/|$)/, /^\/dev\/mail(\/|$)/, /^\/_astro\//, /^\/favicon/];
/** The cookie that remembers the household a person last opened. */
const HOUSEHOLD_COOKIE = 'household';
const HOUSEHOLD_PATH = /^\/households\/(\d+)(\/|$)/;

export const onRequest = defineMiddleware(async (ctx, next) => {
  const { request, url } = ctx;
  const isApi = url.pathname.startsWith('/api/');

  if (!SAFE.has(request.method) && !url.pathname.startsWith('/api/auth/')) {
    // Browsers name the page that sent a request; one from another site may not change anything.
    // This is the app's only origin check (pages and API alike); better-auth checks /api/auth/ itself.
    const origin = request.headers.get('origin');
    const site = request.headers.get('sec-fetch-site');
    if ((origin && origin !== publicOrigin()) || site === 'cross-site') {
      return isApi
        ? errorResponse(403, 'bad_origin', 'This request came from another site and was refused.')
        : new Response('Cross-site form submissions are refused.', { status: 403, headers: { 'content-type': 'text/plain; charset=utf-8' } });
    }
  }

  ctx.locals.user = null;
  ctx.locals.session = null;
  ctx.locals.households = [];
  ctx.locals.household = null;
  if (!url.pathname.startsWith('/api/auth/') && !url.pathname.startsWith('/_astro/')) {
    const s = await getAuth().api.getSession({ headers: request.headers });
    if (s) {
      // The site-admin flag is looked up by the admin pages that need it, not on every request.
      ctx.locals.user = { id: s.user.id, email: s.user.email, name: s.user.name, emailVerified: s.user.emailVerified };
      ctx.locals.session = { id: s.session.id, userId: s.session.userId, expiresAt: s.session.expiresAt };
    }
  }

  if (!isApi && ctx.locals.user) {
    const list = (await listHouseholds(ctx.locals.user.id)).map((r) => ({ id: r.household.id, name: r.household.name, role: r.role }));
    ctx.locals.households = list;
    const inUrl = HOUSEHOLD_PATH.exec(url.pathname)?.[1];
    const remembered = ctx.cookies.get(HOUSEHOLD_COOKIE)?.value;
    const current =
      list.find((h) => String(h.id) === inUrl) ?? list.find((h) => String(h.id) === remembered) ?? (list.length === 1 ? list[0] : undefined);
    ctx.locals.household = current ?? null;
    if (current && String(current.id) === inUrl && remembered !== inUrl) {
      ctx.cookies.set(HOUSEHOLD_COOKIE, inUrl, { path: '/', httpOnly: true, sameSite: 'lax', maxAge: 60 * 60 * 24 * 365, secure: url.protocol === 'https:' });
    }
  }

  if (!isApi && !ctx.locals.user && !PUBLIC_PAGES.some((re) => re.test(url.pathname))) {
    return ctx.redirect(`/sign-in?next=${encodeURIComponent(url.pathname + url.search)}`, 303);
  }
  const response = await next();
  return withSecurityHeaders(response);
});

/** Headers every answer carries: no MIME sniffing, not framed by other sites, no full referrers out. */
function withSecurityHeaders(response: Response): Response {
  const set = (name: string, value: string) => {
    if (!response.headers.has(name)) response.headers.set(name, value);
  };
  try {
    set('X-Content-Type-Options', 'nosniff');
    set('X-Frame-Options', 'SAMEORIGIN');
    set('Content-Security-Policy', "frame-ancestors 'self'");
    set('Referrer-Policy', 'strict-origin-when-cross-origin');
  } catch {
    // Some responses (e.g. a fetched Response passed through) have immutable headers: leave them.
  }
  return response;
}
