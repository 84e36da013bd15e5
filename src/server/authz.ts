/**
 * The one authorisation gate for household routes: signed in (401), member of the household in the
 * URL (404 — its existence is not revealed), role allowing the action (403).
 */
import type { APIContext, APIRoute } from 'astro';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { households, memberships, type Household, type Role } from '@/db/schema';
import { roleAllows, type Access } from '@/lib/household-schemas';
import { parseRouteId } from '@/lib/route-id';
import { HttpError, handle } from './http';

export interface HouseholdAccess {
  userId: string;
  household: Household;
  role: Role;
}

/** Marks handlers made by householdRoute, so the route matrix test can tell them apart. */
export const GUARDED = Symbol.for('selfsown.householdRoute');

export function requireUser(ctx: Pick<APIContext, 'locals'>): { id: string; email: string } {
  const u = ctx.locals.user;
  if (!u) throw new HttpError(401, 'unauthenticated', 'Sign in first.');
  return u;
}

/** Resolves the household from its id and checks the caller's membership and role. */
export async function householdAccess(userId: string, householdIdParam: string | undefined, access: Access): Promise<HouseholdAccess> {
  const id = parseRouteId(householdIdParam);
  if (id === null) throw new HttpError(404, 'not_found', 'No such household.');
  const rows = await getDb()
    .select({ household: households, role: memberships.role })
    .from(memberships)
    .innerJoin(households, eq(households.id, memberships.householdId))
    .where(and(eq(memberships.householdId, id), eq(memberships.userId, userId)))
    .limit(1);
  const row = rows[0];
  if (!row) throw new HttpError(404, 'not_found', 'No such household.');
  if (!roleAllows(row.role, access)) {
    throw new HttpError(403, 'forbidden', `Your role (${row.role}) cannot do this in this household.`);
  }
  return { userId, household: row.household, role: row.role };
}

/**
 * The same gate for .astro pages under /households/{id}/…: the caller's access, or the status the
 * page should answer with (401 signed out, 404 not a member, 403 role too low).
 * @example const a = await householdPage(Astro.locals, Astro.params.id, 'read'); if ('status' in a) …
 */
export async function householdPage(
  locals: App.Locals,
  householdIdParam: string | undefined,
  access: Access = 'read',
): Promise<HouseholdAccess | { status: 401 | 403 | 404; message: string }> {
  if (!locals.user) return { status: 401, message: 'Sign in first.' };
  try {
    return await householdAccess(locals.user.id, householdIdParam, access);
  } catch (e) {
    if (e instanceof HttpError && (e.status === 403 || e.status === 404)) return { status: e.status, message: e.message };
    throw e;
  }
}

/** What an island needs to know about the household it shows. */
export function islandHousehold(a: HouseholdAccess) {
  const h = a.household;
  return { id: h.id, name: h.name, units: h.units, timezone: h.timezone, currency: h.currency, role: a.role, userId: a.userId };
}

/**
 * Wraps a handler of /api/households/{id}/…: authorisation first, then the handler, every error
 * answered as JSON. `param` names the route parameter holding the household id.
 */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

async function householdExists(id: number): Promise<boolean> {
  const rows = await getDb().select({ id: households.id }).from(households).where(eq(households.id, id)).limit(1);
  return rows.length > 0;
}

export function householdRoute(access: Access, fn: (ctx: APIContext, a: HouseholdAccess) => Promise<Response> | Response, param = 'id'): APIRoute {
  const route = handle(async (ctx: APIContext) => {
    const user = requireUser(ctx);
    const a = await householdAccess(user.id, ctx.params[param], access);
    // A write refused because the household was deleted meanwhile (its crop "does not exist", a
    // foreign key failed…) is answered for what happened: the household is gone.
    const gone = async () => !SAFE_METHODS.has(ctx.request.method) && !(await householdExists(a.household.id));
    let response: Response;
    try {
      response = await fn(ctx, a);
    } catch (e) {
      if (await gone()) throw new HttpError(404, 'not_found', 'No such household: it was deleted.');
      throw e;
    }
    if (response.status >= 400 && response.status !== 404 && (await gone())) throw new HttpError(404, 'not_found', 'No such household: it was deleted.');
    return response;
  });
  Object.defineProperty(route, GUARDED, { value: access });
  return route;
}
