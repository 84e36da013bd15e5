/**
 * Sends a signed-out visitor of a private page to /sign-in?next=… (303), so they come back after
 * signing in. API routes answer 401 themselves instead; the public pages are listed here.
 */
import { defineMiddleware } from 'astro:middleware';

/** Pages anyone may see; everything else needs sign-in. /admin answers 404 itself to all but site administrators. */
const PUBLIC_PAGES = [/^\/admin(\/|$)/, /^\/404\/?$/, /^\/$/, /^\/sign-(in|up)\/?$/, /^\/forgot-password\/?$/, /^\/reset-password\/?$/, /^\/verify\/?$/, /^\/invite\//, /^\/letters\/unsubscribe\/?$/, /^\/foods(\/|$)/, /^\/dev\/mail(\/|$)/, /^\/_astro\//, /^\/favicon/];

export const signInRedirect = defineMiddleware((ctx, next) => {
  const { url } = ctx;
  if (!url.pathname.startsWith('/api/') && !ctx.locals.user && !PUBLIC_PAGES.some((re) => re.test(url.pathname))) {
    return ctx.redirect(`/sign-in?next=${encodeURIComponent(url.pathname + url.search)}`, 303);
  }
  return next();
});
