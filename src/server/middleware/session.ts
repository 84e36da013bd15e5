/**
 * Puts the signed-in user and their session on Astro.locals (both null when signed out), from
 * better-auth's session cookie: in one query for a current session (session-lookup.ts), else by
 * better-auth's getSession. Skipped for /api/auth/ (better-auth's own routes) and /_astro/
 * (built assets), where both stay null. On /api/households/{id}/… the household gate reads the
 * session in its own query (authz.ts: one round trip for both), so this step leaves it to the
 * gate (`sessionWithGate`): every route there is made by householdRoute (the route matrix test).
 */
import { defineMiddleware } from 'astro:middleware';
import { putSession, requestSession } from '@/server/session-lookup';

/** Routes whose session the household gate reads. */
const HOUSEHOLD_API = /^\/api\/households\/[^/]+(\/|$)/;

export const session = defineMiddleware(async (ctx, next) => {
  putSession(ctx.locals, null);
  const { pathname } = ctx.url;
  if (HOUSEHOLD_API.test(pathname)) ctx.locals.sessionWithGate = true;
  else if (!pathname.startsWith('/api/auth/') && !pathname.startsWith('/_astro/')) putSession(ctx.locals, await requestSession(ctx.request.headers));
  return next();
});
