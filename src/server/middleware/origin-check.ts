/**
 * The app's one origin check: a state-changing request (anything but GET, HEAD, OPTIONS) sent from
 * another site is refused with 403 before any other step reads or writes. Browsers name the page
 * that sent a request (Origin, Sec-Fetch-Site); it must be PUBLIC_ORIGIN. better-auth checks
 * /api/auth/ itself. Astro's own check is off (see astro.config.mjs).
 */
import { defineMiddleware } from 'astro:middleware';
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
  const origin = request.headers.get('origin');
  const site = request.headers.get('sec-fetch-site');
  if ((origin && origin !== publicOrigin()) || site === 'cross-site') {
    return url.pathname.startsWith('/api/')
      ? errorResponse(403, 'bad_origin', 'This request came from another site and was refused.')
      : new Response('Cross-site form submissions are refused.', { status: 403, headers: { 'content-type': 'text/plain; charset=utf-8' } });
  }
  return next();
});
