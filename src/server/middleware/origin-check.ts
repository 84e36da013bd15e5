/**
 * The app's one origin check: a state-changing request (anything but GET, HEAD, OPTIONS) that could
 * act for someone is refused with 403 unless the browser says it came from our own pages, before any
 * other step reads or writes. The rule itself is `sameSiteRequest` (src/lib/origin-rule.ts).
 * better-auth checks /api/auth/ itself (Origin, else Referer, against PUBLIC_ORIGIN). Astro's own
 * check is off (see astro.config.mjs).
 */
import { defineMiddleware } from 'astro:middleware';
import { sameSiteRequest } from '@/lib/origin-rule';
import { publicOrigin } from '@/server/config';
import { errorResponse } from '@/server/http';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);
/**
 * The monthly letter's one-click unsubscribe (RFC 8058) is POSTed by mail programs, which may send
 * their own Origin. It reads no cookie — the signed token in the URL is its only authority — so a
 * request from another site can do nothing that the link's holder could not do anyway.
 */
const TOKEN_ONLY = '/api/letters/unsubscribe';

export const originCheck = defineMiddleware((ctx, next) => {
  const { request, url } = ctx;
  if (SAFE.has(request.method) || url.pathname.startsWith('/api/auth/') || url.pathname === TOKEN_ONLY) return next();
  const h = request.headers;
  const ok = sameSiteRequest({ origin: h.get('origin'), fetchSite: h.get('sec-fetch-site'), hasCookie: h.has('cookie') }, publicOrigin());
  if (!ok) {
    return url.pathname.startsWith('/api/')
      ? errorResponse(403, 'bad_origin', 'This request did not come from Selfsown\'s own pages and was refused. Send it from the app (with its Origin header).')
      : new Response('Cross-site form submissions are refused.', { status: 403, headers: { 'content-type': 'text/plain; charset=utf-8' } });
  }
  return next();
});
