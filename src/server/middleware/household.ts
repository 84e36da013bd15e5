/**
 * For signed-in page views (not /api): the user's households and the current one on Astro.locals.
 * The current household is the one in the URL (/households/{id}/…) when the user belongs to it,
 * else the one remembered in the `household` cookie, else the only one. Opening a household's page
 * remembers it in that cookie.
 */
import { defineMiddleware } from 'astro:middleware';
import { secureCookies } from '@/server/config';
import { listHouseholds } from '@/server/households';

/** The cookie that remembers the household a person last opened. */
const HOUSEHOLD_COOKIE = 'household';
const HOUSEHOLD_PATH = /^\/households\/(\d+)(\/|$)/;
const ONE_YEAR_SECONDS = 60 * 60 * 24 * 365;

export const household = defineMiddleware(async (ctx, next) => {
  ctx.locals.households = [];
  ctx.locals.household = null;
  const { url } = ctx;
  const user = ctx.locals.user;
  if (url.pathname.startsWith('/api/') || !user) return next();

  const list = (await listHouseholds(user.id)).map((r) => ({ id: r.household.id, name: r.household.name, role: r.role }));
  ctx.locals.households = list;
  const inUrl = HOUSEHOLD_PATH.exec(url.pathname)?.[1];
  const remembered = ctx.cookies.get(HOUSEHOLD_COOKIE)?.value;
  const current =
    list.find((h) => String(h.id) === inUrl) ?? list.find((h) => String(h.id) === remembered) ?? (list.length === 1 ? list[0] : undefined);
  ctx.locals.household = current ?? null;
  if (current && String(current.id) === inUrl && remembered !== inUrl) {
    ctx.cookies.set(HOUSEHOLD_COOKIE, inUrl, { path: '/', httpOnly: true, sameSite: 'lax', maxAge: ONE_YEAR_SECONDS, secure: secureCookies() });
  }
  return next();
});
