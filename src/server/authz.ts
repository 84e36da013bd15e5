/**
 * The one authorisation gate for household routes: signed in (401), member of the household in the
 * URL (404 — its existence is not revealed), role allowing the action (403).
 */
import type { APIContext, APIRoute } from 'astro';
import { and, eq, getTableColumns, sql, type SQL } from 'drizzle-orm';
import { getDb, getPool } from '@/db/client';
import { households, memberships, session, user, type Household, type Role } from '@/db/schema';
import { roleAllows, type Access } from '@/lib/household-schemas';
import { parseRouteId } from '@/lib/route-id';
import { HttpError, handle } from './http';
import { rawQuery, readFields, selectList } from './raw-query';
import { currentSession, putSession, requestSession, sessionColumns, sessionCookieToken, type SessionRow } from './session-lookup';

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

/** A household id from the URL (digits only, see parseRouteId), else 404. */
function householdIdOf(param: string | undefined): number {
  const id = parseRouteId(param);
  if (id === null) throw new HttpError(404, 'not_found', 'No such household.');
  return id;
}

const householdFields = getTableColumns(households);

/** A gate row's household (null when no membership joined it) and role. */
type GateRow = { role: Role | null; household: Household | null } & Record<string, unknown>;

/** The household and role of a raw gate row read with `household.`-prefixed household columns. */
function gateRow(raw: Record<string, unknown>, extraNames: string[]): GateRow {
  const row: GateRow = { role: (raw.role as Role | null) ?? null, household: raw['household.id'] === null ? null : (readFields(householdFields, raw, 'household.') as Household) };
  for (const name of extraNames) row[name] = raw[name] ?? null;
  return row;
}

/**
 * The extra columns, each under its own name, after a leading comma (nothing when there are none);
 * `forMembers` reads them only where a membership joined.
 */
function extraList(columns: GateColumns, forMembers: boolean): SQL {
  const entries = Object.entries(columns);
  // Their names share the row with the gate's own columns.
  const taken = entries.find(([name]) => name in sessionColumns || name === 'role' || name.startsWith('household.'));
  if (taken) throw new Error(`a gate column cannot be called "${taken[0]}": the gate reads a column of that name itself`);
  if (entries.length === 0) return sql``;
  return sql`, ${selectList(Object.fromEntries(entries.map(([name, column]) => [name, forMembers ? sql`IF(${memberships.role} IS NULL, NULL, ${column})` : column])))}`;
}

/**
 * The gate's one query (the membership with its household, and any extra columns), written once.
 * Every household route starts with it (or its session form below), so it runs as a prepared
 * statement over the binary protocol (raw-query.ts): nothing to escape and no SQL text for the
 * database to parse again on each request.
 */
function gateQuery<X extends GateColumns>(columns: X) {
  const names = Object.keys(columns);
  const query = rawQuery<Record<string, unknown>>(sql`
    SELECT ${memberships.role} AS role, ${selectList(householdFields, 'household.')}${extraList(columns, false)}
      FROM ${memberships}
      JOIN ${households} ON ${eq(households.id, memberships.householdId)}
     WHERE ${and(eq(memberships.householdId, sql.placeholder('householdId')), eq(memberships.userId, sql.placeholder('userId')))}
     LIMIT 1`);
  return async (values: Record<string, unknown>): Promise<GateRow | undefined> => {
    const [raw] = await query.run(getPool(), values);
    return raw ? gateRow(raw, names) : undefined;
  };
}

/** Runs a gate query for a user and household and checks the membership and role. */
async function gate<X extends GateColumns>(
  query: ReturnType<typeof gateQuery<X>>,
  userId: string,
  id: number,
  access: Access,
  values: Record<string, unknown> = {},
): Promise<{ access: HouseholdAccess; values: GateValues<X> }> {
  const row = await query({ ...values, householdId: id, userId });
  if (!row?.role || !row.household) throw new HttpError(404, 'not_found', 'No such household.');
  if (!roleAllows(row.role, access)) {
    throw new HttpError(403, 'forbidden', `Your role (${row.role}) cannot do this in this household.`);
  }
  const { household, role, ...rest } = row as GateRow & { role: Role; household: Household };
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
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

async function householdExists(id: number): Promise<boolean> {
  const rows = await getDb().select({ id: households.id }).from(households).where(eq(households.id, id)).limit(1);
  return rows.length > 0;
}

export function householdRoute(access: Access, fn: (ctx: APIContext, a: HouseholdAccess) => Promise<Response> | Response, param = 'id'): APIRoute {
  return householdRouteWith(access, { columns: {}, values: () => ({}) }, (ctx, a) => fn(ctx, a), param);
}

/**
 * householdRoute for a handler that reads a little more about the household before anything else
 * (the share endpoint's stored answer): `extra.columns` (subqueries on the placeholder
 * `householdId` and on those `extra.values` gives per request) are read in the gate's own query,
 * so they cost no round trip of their own. For anyone the gate refuses, nothing of them is read.
 *
 * The gate also reads the session (the middleware leaves it to it on these routes): the session,
 * its user, the membership and the household in one query. A session better-auth must see
 * (expired, due for refresh, unknown), a missing cookie or an id that cannot be a household's go
 * the two-step way: the session as the middleware reads it, then the membership.
 */
export function householdRouteWith<X extends GateColumns>(
  access: Access,
  extra: { columns: X; values: (ctx: APIContext) => Record<string, unknown> },
  fn: (ctx: APIContext, a: HouseholdAccess, values: GateValues<X>) => Promise<Response> | Response,
  param = 'id',
): APIRoute {
  const plain = gateQuery(extra.columns);
  const withSession = sessionGateQuery(extra.columns);
  const names = Object.keys(extra.columns);
  const route = handle(async (ctx: APIContext) => {
    let passed: { access: HouseholdAccess; values: GateValues<X> } | null = null;
    if (ctx.locals.sessionWithGate) {
      const token = await sessionCookieToken(ctx.request.headers);
      const id = token ? parseRouteId(ctx.params[param]) : null;
      if (token && id !== null) {
        const row = await withSession({ ...extra.values(ctx), householdId: id, token });
        const s = await currentSession(row);
        if (s && row) {
          putSession(ctx.locals, s);
          passed = checked(row, s.user.id, access, names);
        }
      }
      if (!passed) putSession(ctx.locals, await requestSession(ctx.request.headers));
    }
    passed ??= await gate(plain, requireUser(ctx).id, householdIdOf(ctx.params[param]), access, extra.values(ctx));
    const { access: a, values } = passed;
    // A write refused because the household was deleted meanwhile (its crop "does not exist", a
    // foreign key failed…) is answered for what happened: the household is gone.
    const gone = async () => !SAFE_METHODS.has(ctx.request.method) && !(await householdExists(a.household.id));
    let response: Response;
    try {
      response = await fn(ctx, a, values);
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

/** The gate with the session: the session and its user, the membership and household if any, and the extra columns (read for members only). */
function sessionGateQuery<X extends GateColumns>(columns: X) {
  const names = Object.keys(columns);
  const query = rawQuery<Record<string, unknown>>(sql`
    SELECT ${selectList(sessionColumns)}, ${memberships.role} AS role, ${selectList(householdFields, 'household.')}${extraList(columns, true)}
      FROM ${session}
      JOIN ${user} ON ${eq(user.id, session.userId)}
      LEFT JOIN ${memberships} ON ${and(eq(memberships.userId, session.userId), eq(memberships.householdId, sql.placeholder('householdId')))}
      LEFT JOIN ${households} ON ${eq(households.id, memberships.householdId)}
     WHERE ${eq(session.token, sql.placeholder('token'))}
     LIMIT 1`);
  return async (values: Record<string, unknown>): Promise<(SessionRow & GateRow) | undefined> => {
    const [raw] = await query.run(getPool(), values);
    return raw ? { ...readFields(sessionColumns, raw), ...gateRow(raw, names) } : undefined;
  };
}

/** The membership and role of a gate row that read the session too: 404 not a member, 403 role too low. */
function checked<X extends GateColumns>(row: GateRow, userId: string, access: Access, names: string[]) {
  if (!row.role || !row.household) throw new HttpError(404, 'not_found', 'No such household.');
  if (!roleAllows(row.role, access)) throw new HttpError(403, 'forbidden', `Your role (${row.role}) cannot do this in this household.`);
  const values = Object.fromEntries(names.map((n) => [n, row[n]])) as GateValues<X>;
  return { access: { userId, household: row.household, role: row.role }, values };
}
