/**
 * The one authorisation gate for household routes: signed in (401), member of the household in the
 * URL (404 — its existence is not revealed), role allowing the action (403).
 */
import type { APIContext, APIRoute } from 'astro';
import { and, eq, type SQL } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { households, memberships, type Household, type Role } from '@/db/schema';
import { roleAllows, type Access } from '@/lib/household-schemas';
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

/** Columns a route reads in the gate's own query (householdRouteWith): subqueries on the household id. */
export type GateColumns = Record<string, SQL>;
/** The values of such columns as the query answers them. */
export type GateValues<X extends GateColumns> = { [K in keyof X]: X[K] extends SQL<infer T> ? T : never };

/** A household id from the URL: a positive whole number written plainly, else 404. */
function householdIdOf(param: string | undefined): number {
  const id = Number(param);
  if (!Number.isInteger(id) || id <= 0 || String(id) !== param) throw new HttpError(404, 'not_found', 'No such household.');
  return id;
}

/** The gate's one query: the membership with its household (and any extra columns), checked. */
async function gate<X extends GateColumns>(userId: string, id: number, access: Access, columns: X): Promise<{ access: HouseholdAccess; values: GateValues<X> }> {
  const rows = await getDb()
    .select({ household: households, role: memberships.role, ...columns })
    .from(memberships)
    .innerJoin(households, eq(households.id, memberships.householdId))
    .where(and(eq(memberships.householdId, id), eq(memberships.userId, userId)))
    .limit(1);
  const row = rows[0] as ({ household: Household; role: Role } & GateValues<X>) | undefined;
  if (!row) throw new HttpError(404, 'not_found', 'No such household.');
  if (!roleAllows(row.role, access)) {
    throw new HttpError(403, 'forbidden', `Your role (${row.role}) cannot do this in this household.`);
  }
  const { household, role, ...values } = row;
  return { access: { userId, household, role }, values: values as unknown as GateValues<X> };
}

/** Resolves the household from its id and checks the caller's membership and role. */
export async function householdAccess(userId: string, householdIdParam: string | undefined, access: Access): Promise<HouseholdAccess> {
  return (await gate(userId, householdIdOf(householdIdParam), access, {})).access;
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
export function householdRoute(access: Access, fn: (ctx: APIContext, a: HouseholdAccess) => Promise<Response> | Response, param = 'id'): APIRoute {
  return householdRouteWith(access, () => ({}), (ctx, a) => fn(ctx, a), param);
}

/**
 * householdRoute for a handler that reads a little more about the household before anything else
 * (the share endpoint's stored answer): `columns` (subqueries on the household id, from the URL)
 * are read in the gate's own query, so it costs no round trip of its own. For anyone the gate
 * refuses, no row comes back and nothing of them is read.
 */
export function householdRouteWith<X extends GateColumns>(
  access: Access,
  columns: (ctx: APIContext, householdId: number) => X,
  fn: (ctx: APIContext, a: HouseholdAccess, values: GateValues<X>) => Promise<Response> | Response,
  param = 'id',
): APIRoute {
  const route = handle(async (ctx: APIContext) => {
    const user = requireUser(ctx);
    const id = householdIdOf(ctx.params[param]);
    const passed = await gate(user.id, id, access, columns(ctx, id));
    return fn(ctx, passed.access, passed.values);
  });
  Object.defineProperty(route, GUARDED, { value: access });
  return route;
}
