/**
 * The site administrator's gate and record. Every /admin page and /api/admin route goes through
 * `adminRoute` / `adminPage`: anyone who is not a site administrator (signed out included) gets
 * 404, so the pages' existence is not revealed. Every change an administrator makes is written to
 * admin_actions (who, what, when) in the same transaction as the change where there is one.
 */
import type { APIContext, APIRoute } from 'astro';
import { desc, eq } from 'drizzle-orm';
import { getDb, type Db } from '@/db/client';
import { adminActions, siteAdmins } from '@/db/schema';
import { HttpError, handle } from './http';

export interface Admin {
  id: string;
  email: string;
}

/** Marks handlers made by adminRoute, so the admin route matrix can tell them apart. */
export const ADMIN_GUARDED = Symbol.for('selfsown.adminRoute');

export async function isSiteAdmin(userId: string): Promise<boolean> {
  const [r] = await getDb().select({ userId: siteAdmins.userId }).from(siteAdmins).where(eq(siteAdmins.userId, userId)).limit(1);
  return !!r;
}

/** The signed-in site administrator, or a 404 for anyone else. */
export async function requireAdmin(locals: App.Locals): Promise<Admin> {
  const u = locals.user;
  if (!u || !(await isSiteAdmin(u.id))) throw new HttpError(404, 'not_found', 'No such page.');
  return { id: u.id, email: u.email };
}

/** Wraps a handler of /api/admin/…: the administrator check first, every error answered as JSON. */
export function adminRoute(fn: (ctx: APIContext, admin: Admin) => Promise<Response> | Response): APIRoute {
  const route = handle(async (ctx: APIContext) => fn(ctx, await requireAdmin(ctx.locals)));
  Object.defineProperty(route, ADMIN_GUARDED, { value: true });
  return route;
}

/** For .astro pages under /admin: the administrator, or null (the page answers 404). */
export async function adminPage(locals: App.Locals): Promise<Admin | null> {
  try {
    return await requireAdmin(locals);
  } catch (e) {
    if (e instanceof HttpError) return null;
    throw e;
  }
}

/** Records one administrator action; pass the transaction's client to make it part of the change. */
export async function recordAction(admin: Admin, action: string, subject: string, detail = '', db: Db = getDb()): Promise<void> {
  await db.insert(adminActions).values({ userId: admin.id, userEmail: admin.email, action, subject: subject.slice(0, 255), detail: detail.slice(0, 1000) });
}

/** The latest administrator actions, newest first. */
export async function listActions(limit = 100) {
  return getDb()
    .select({ id: adminActions.id, userEmail: adminActions.userEmail, action: adminActions.action, subject: adminActions.subject, detail: adminActions.detail, createdAt: adminActions.createdAt })
    .from(adminActions)
    .orderBy(desc(adminActions.id))
    .limit(limit);
}
