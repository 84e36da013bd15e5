/**
 * Puts the signed-in user and their session on Astro.locals (both null when signed out), from
 * better-auth's session cookie: in one query for a current session (session-lookup.ts), else by
 * better-auth's getSession. Skipped for /api/auth/ (better-auth's own routes) and /_astro/
 * (built assets), where both stay null.
 */
import { defineMiddleware } from 'astro:middleware';
import { getAuth } from '@/server/auth';
import { quickSession } from '@/server/session-lookup';

export const session = defineMiddleware(async (ctx, next) => {
  ctx.locals.user = null;
  ctx.locals.session = null;
  const { pathname } = ctx.url;
  if (!pathname.startsWith('/api/auth/') && !pathname.startsWith('/_astro/')) {
    const headers = ctx.request.headers;
    const quick = await quickSession(headers);
    const s = quick === undefined ? await getAuth().api.getSession({ headers }) : quick;
    if (s) {
      // The site-admin flag is looked up by the admin pages that need it, not on every request.
      ctx.locals.user = { id: s.user.id, email: s.user.email, name: s.user.name, emailVerified: s.user.emailVerified };
      ctx.locals.session = { id: s.session.id, userId: s.session.userId, expiresAt: s.session.expiresAt };
    }
  }
  return next();
});
