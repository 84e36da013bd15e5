/**
 * The one authorisation gate for household routes: signed in (401), member of the household in the
 * URL (404 — its existence is not revealed), role allowing the action (403).
 */
import type { APIContext, APIRoute } from 'astro';
import { and, eq, sql, type SQL } from 'drizzle-orm';
import { preparedOnce } from '@/db/client';
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

/**
 * Columns a route reads in the gate's own query (householdRouteWith): subqueries that may use the
 * placeholders `householdId` and those the route gives values for.
 */
export type GateColumns = Record<string, SQL>;
/** The values of such columns as the query answers them. */
export type GateValues<X extends GateColumns> = { [K in keyof X]: X[K] extends SQL<infer T> ? T : never };

/** A household id from the URL: a positive whole number written plainly, else 404. */
function householdIdOf(param: string | undefined): number {
  const id = Number(param);
  if (!Number.isInteger(id) || id <= 0 || String(id) !== param) throw new HttpError(404, 'not_found', 'No such household.');
  return id;
}

/** The gate's one query (the membership with its household, and any extra columns), prepared once. */
function gateQuery<X extends GateColumns>(columns: X) {
  return preparedOnce((db) =>
    db
      .select({ household: households, role: memberships.role, ...columns })
      .from(memberships)
      .innerJoin(households, eq(households.id, memberships.householdId))
      .where(and(eq(memberships.householdId, sql.placeholder('householdId')), eq(memberships.userId, sql.placeholder('userId'))))
      .limit(1)
      .prepare(),
  );
}

/** Runs a gate query for a user and household and checks the membership and role. */
async function gate<X extends GateColumns>(
  query: ReturnType<typeof gateQuery<X>>,
  userId: string,
  id: number,
  access: Access,
  values: Record<string, unknown> = {},
): Promise<{ access: HouseholdAccess; values: GateValues<X> }> {
  const rows = await query().execute({ ...values, householdId: id, userId });
  const row = rows[0] as ({ household: Household; role: Role } & GateValues<X>) | undefined;
  if (!row) throw new HttpError(404, 'not_found', 'No such household.');
  if (!roleAllows(row.role, access)) {
    throw new HttpError(403, 'forbidden', `Your role (${row.role}) cannot do this in this household.`);
  }
  const { household, role, ...rest } = row;
  return { access: { userId, household, role }, values: rest as unknown as GateValues<X> };
}

const plainGate = gateQuery({});

/** Resolves the household from its id and checks the caller's membership and role. */
export async function householdAccess(userId: string, householdIdParam: string | undefined, access: Access): Promise<HouseholdAccess> {
  return (await gate(plainGate, userId, householdIdOf(householdIdParam), access)).access;
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
  return guarded(access, param, async (ctx, user, id) => fn(ctx, (await gate(plainGate, user.id, id, access)).access));
}

/**
 * householdRoute for a handler that reads a little more about the household before anything else
 * (the share endpoint's stored answer): `extra.columns` (subqueries on the placeholder
 * `householdId` and on those `extra.values` gives per request) are read in the gate's own query,
 * so they cost no round trip of their own. For anyone the gate refuses, no row comes back and
 * nothing of them is read.
 */
export function householdRouteWith<X extends GateColumns>(
  access: Access,
  extra: { columns: X; values: (ctx: APIContext) => Record<string, unknown> },
  fn: (ctx: APIContext, a: HouseholdAccess, values: GateValues<X>) => Promise<Response> | Response,
  param = 'id',
): APIRoute {
  const query = gateQuery(extra.columns);
  return guarded(access, param, async (ctx, user, id) => {
    const passed = await gate(query, user.id, id, access, extra.values(ctx));
    return fn(ctx, passed.access, passed.values);
  });
}

/** A route that answers 401 signed out and 404 for an id that cannot be a household's, marked as gated. */
function guarded(access: Access, param: string, fn: (ctx: APIContext, user: { id: string }, householdId: number) => Promise<Response>): APIRoute {
  const route = handle(async (ctx: APIContext) => {
    const user = requireUser(ctx);
    return fn(ctx, user, householdIdOf(ctx.params[param]));
  });
  Object.defineProperty(route, GUARDED, { value: access });
  return route;
}
