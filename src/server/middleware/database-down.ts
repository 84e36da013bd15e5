/**
 * While the database cannot be reached, every request that needs it gets a 503 with Retry-After,
 * never a 500 or a hang: /api/ a JSON `database_unavailable` error, a page the plain "back in a
 * moment" page (src/lib/unavailable-page.ts). Routes answer for themselves through handle()
 * (src/server/http.ts); this step catches what is thrown before a route runs (the session look-up
 * of step 4, the household list) or inside a page, and the 500 better-auth writes for its own
 * routes when the database is gone (checked with one probe, src/server/db-state.ts). Nothing is
 * kept between requests: the pool opens fresh connections, so the app recovers by itself once
 * the database is back.
 */
import { defineMiddleware } from 'astro:middleware';
import { unavailablePageHtml } from '@/lib/unavailable-page';
import { DATABASE_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from '@/server/db-errors';
import { databaseState } from '@/server/db-state';
import { databaseUnavailableResponse } from '@/server/http';

function unavailable(pathname: string): Response {
  if (pathname.startsWith('/api/')) return databaseUnavailableResponse();
  return new Response(unavailablePageHtml(DATABASE_RETRY_AFTER_SECONDS), {
    status: 503,
    headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store', 'retry-after': String(DATABASE_RETRY_AFTER_SECONDS) },
  });
}

export const databaseDown = defineMiddleware(async (ctx, next) => {
  const { pathname } = ctx.url;
  let response: Response;
  try {
    response = await next();
  } catch (e) {
    if (isDatabaseUnavailable(e)) return unavailable(pathname);
    throw e;
  }
  if (response.status === 500 && pathname.startsWith('/api/auth/') && (await databaseState()) === 'down') return unavailable(pathname);
  return response;
});
