/**
 * THE ROUTE MATRIX: every household API route × {owner, grower, viewer, outsider, signed out}.
 *
 * HOW A NEW ROUTE JOINS (one line): add a row to ROUTES below —
 *     ['POST', 'harvests/index', write(400)],
 *   1. the method,
 *   2. the route file under src/pages/api/households/[id]/ without ".ts" ("index" is the household itself),
 *   3. the status each member role gets for the row's request: read(s) = every member gets s;
 *      write(s) = owner and grower get s, viewer 403; own(s) = owner gets s, grower and viewer 403;
 *      or spell it out: { owner: 200, grower: 200, viewer: 403 }.
 *   4. optionally { body, query, params, fresh }.
 * The request is deliberately minimal: non-GET/DELETE methods send the JSON body {} (so writes are
 * usually refused as bad input — 400 — AFTER the gate has let the role through, and nothing is
 * written); route parameters other than the household are 999999999 unless `params` says
 * otherwise ([userId] is a spare member, [invitationId] a pending invitation). Rows that change
 * the fixture (deleting the household, removing a member) set fresh: true and get a household of
 * their own. Roles run least privileged first, so the owner's DELETE comes last.
 *
 * Fixed for every row, not settable: a signed-in non-member gets 404, a signed-out caller 401, and
 * the owner gets 404 for a household id that does not exist. The test also fails when a route file
 * or method has no row, when a row names a route that is gone, and when an exported handler is not
 * made by householdRoute() from src/server/authz.ts (it imports each route module and looks for
 * the GUARDED mark householdRoute puts on its handlers).
 */
import { readdirSync } from 'node:fs';
import { join, relative } from 'node:path';
import { pathToFileURL } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { GUARDED, householdRoute } from '@/server/authz';
import { handle } from '@/server/http';
import { addMember, apiAs, createHousehold, householdWithRoles, newVerifiedUser, type RoleFixture, type TestUser } from '../support/users';

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
interface MemberStatuses {
  owner: number;
  grower: number;
  viewer: number;
}
interface RowOptions {
  /** JSON body for non-GET requests (default {}); null sends no body. */
  body?: unknown;
  /** Query string without "?". */
  query?: string;
  /** Values for route parameters, e.g. { file: 'harvests.csv' }. */
  params?: Record<string, string>;
  /** Give this row a household of its own (for rows that delete or remove). */
  fresh?: boolean;
}
type Row = [Method, string, MemberStatuses, RowOptions?];

const read = (s: number): MemberStatuses => ({ owner: s, grower: s, viewer: s });
const write = (s: number): MemberStatuses => ({ owner: s, grower: s, viewer: 403 });
const own = (s: number): MemberStatuses => ({ owner: s, grower: 403, viewer: 403 });

// prettier-ignore
const ROUTES: Row[] = [
  // the household itself
  ['GET',    'index',                        read(200)],
  ['PATCH',  'index',                        own(400)],
  // the order of datasets food search follows
  ['GET',    'datasets',                     read(200)],
  ['PUT',    'datasets',                     own(400)],
  ['DELETE', 'index',                        own(204), { fresh: true }],
  // members and invitations
  ['GET',    'members/index',                read(200)],
  // each member's own monthly letter switch
  ['PATCH',  'letter',                       read(400)],
  ['PATCH',  'members/[userId]',             own(400)],
  ['DELETE', 'members/[userId]',             own(204), { fresh: true }],
  ['GET',    'invitations/index',            own(200)],
  ['POST',   'invitations/index',            own(400)],
  ['DELETE', 'invitations/[invitationId]',   own(204)],
  // harvest log
  ['GET',    'harvests/index',               read(200)],
  ['POST',   'harvests/index',               write(400)],
  ['GET',    'harvests/[harvestId]',         read(404)],
  ['PATCH',  'harvests/[harvestId]',         write(400)],
  ['DELETE', 'harvests/[harvestId]',         write(404)],
  // bought food
  ['GET',    'purchases/index',              read(200)],
  ['POST',   'purchases/index',              write(400)],
  ['GET',    'purchases/[purchaseId]',       read(404)],
  ['PATCH',  'purchases/[purchaseId]',       write(400)],
  ['DELETE', 'purchases/[purchaseId]',       write(404)],
  // staples
  ['GET',    'staples/index',                read(200)],
  ['POST',   'staples/index',                write(400)],
  ['GET',    'staples/[stapleId]/index',     read(404)],
  ['DELETE', 'staples/[stapleId]/index',     write(404)],
  ['POST',   'staples/[stapleId]/log',       write(404)],
  // crops
  ['GET',    'crops/index',                  read(200)],
  ['POST',   'crops/index',                  write(400)],
  ['GET',    'crops/[cropId]',               read(404)],
  ['PATCH',  'crops/[cropId]',               write(400)],
  ['DELETE', 'crops/[cropId]',               write(404)],
  ['PUT',    'crops/pins',                   write(400)],
  // people (who eats)
  ['GET',    'people/index',                 read(200)],
  ['POST',   'people/index',                 own(400)],
  ['GET',    'people/[personId]',            read(404)],
  ['PATCH',  'people/[personId]',            own(400)],
  ['DELETE', 'people/[personId]',            own(404)],
  // beds, plantings, growing season
  ['GET',    'beds/index',                   read(200)],
  ['POST',   'beds/index',                   write(400)],
  ['GET',    'beds/[bedId]',                 read(404)],
  ['PATCH',  'beds/[bedId]',                 write(400)],
  ['DELETE', 'beds/[bedId]',                 write(404)],
  ['GET',    'plantings/index',              read(200)],
  ['POST',   'plantings/index',              write(400)],
  ['GET',    'plantings/[plantingId]',       read(404)],
  ['PATCH',  'plantings/[plantingId]',       write(400)],
  ['DELETE', 'plantings/[plantingId]',       write(404)],
  ['POST',   'plantings/from-plan',          write(400)],
  ['GET',    'season',                       read(200)],
  ['PUT',    'season',                       write(400)],
  // share, import, export
  ['GET',    'share',                        read(200)],
  ['GET',    'gaps',                         read(200)],
  ['GET',    'larder/index',                 read(200)],
  ['GET',    'larder/outcomes/index',        read(400)],
  ['POST',   'larder/outcomes/index',        write(400)],
  ['DELETE', 'larder/outcomes/[outcomeId]',  write(404)],
  // the planting plan (reads only)
  ['POST',   'plan',                         read(400)],
  ['POST',   'imports/index',                write(415)],
  ['GET',    'exports/[file]',               read(200), { params: { file: 'harvests.csv' } }],
];

// ── discovery of the route files ──────────────────────────────────────────────────────────────
const ROUTE_DIR = join(process.cwd(), 'src/pages/api/households/[id]');
const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'ALL', 'HEAD', 'OPTIONS'];

function walk(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? walk(join(dir, e.name)) : /\.(ts|js|mts)$/.test(e.name) ? [join(dir, e.name)] : []));
}

interface Discovered {
  key: string;
  method: string;
  route: string;
  /** Made by householdRoute() (it marks its handlers with GUARDED). */
  guarded: boolean;
}

/** Every exported method of every route file, read from the modules themselves. */
async function discover(): Promise<Discovered[]> {
  const out: Discovered[] = [];
  for (const file of walk(ROUTE_DIR)) {
    const route = relative(ROUTE_DIR, file).replace(/\\/g, '/').replace(/\.(ts|js|mts)$/, '');
    const mod = (await import(pathToFileURL(file).href)) as Record<string, unknown>;
    for (const method of Object.keys(mod).filter((k) => METHODS.includes(k))) {
      const handler = mod[method];
      out.push({ key: `${method} ${route}`, method, route, guarded: typeof handler === 'function' && GUARDED in handler });
    }
  }
  return out.sort((a, b) => a.key.localeCompare(b.key));
}

function urlFor(householdId: number | string, route: string, params: Record<string, string>, query?: string): string {
  const path = route
    .split('/')
    .filter((seg, i, all) => !(seg === 'index' && i === all.length - 1))
    .map((seg) => seg.replace(/^\[(\w+)\]$/, (_m, name: string) => encodeURIComponent(params[name] ?? '999999999')))
    .join('/');
  return `/api/households/${householdId}${path ? `/${path}` : ''}${query ? `?${query}` : ''}`;
}

// ── the fixture ───────────────────────────────────────────────────────────────────────────────
interface Fixture extends RoleFixture {
  spare: TestUser;
  params: Record<string, string>;
}

async function withExtras(base: RoleFixture): Promise<Fixture> {
  const spare = await newVerifiedUser({ name: 'Sam Spare' });
  await addMember(base.owner, base.household.id, spare, 'grower');
  const inv = await apiAs(base.owner.cookie, 'POST', `/api/households/${base.household.id}/invitations`, { email: `pending-${base.household.id}@test.selfsown.invalid`, role: 'viewer' });
  if (inv.status !== 201) throw new Error(`fixture invitation answered ${inv.status}`);
  return { ...base, spare, params: { userId: spare.id, invitationId: String(inv.body.invitation.id) } };
}

async function freshFixture(f: Fixture): Promise<Fixture> {
  // Same people, a household of its own.
  const household = await createHousehold(f.owner.cookie, { name: 'Matrix fresh plot' });
  await addMember(f.owner, household.id, f.grower, 'grower');
  await addMember(f.owner, household.id, f.viewer, 'viewer');
  return withExtras({ ...f, household });
}

const ROLE_ORDER = ['signedOut', 'outsider', 'viewer', 'grower', 'owner'] as const;
type Caller = (typeof ROLE_ORDER)[number];

function cookieOf(f: Fixture, who: Caller): string {
  return who === 'signedOut' ? '' : f[who].cookie;
}

async function call(cookie: string, method: Method, url: string, opts: RowOptions) {
  const sendsBody = method !== 'GET' && method !== 'DELETE' && opts.body !== null;
  return apiAs(cookie, method, url, sendsBody ? (opts.body ?? {}) : undefined);
}

describe('household route matrix', () => {
  let discovered: Discovered[] = [];
  let shared: Fixture;

  beforeAll(async () => {
    discovered = await discover();
    shared = await withExtras(await householdWithRoles({ name: 'Matrix plot' }));
  });

  it('has a row for every route file and method, and no row for a route that is gone', () => {
    const rows = new Set(ROUTES.map(([m, r]) => `${m} ${r}`));
    const missing = discovered.filter((d) => !rows.has(d.key)).map((d) => d.key);
    const stale = [...rows].filter((k) => !discovered.some((d) => d.key === k));
    expect(missing, `add rows to ROUTES in tests/integration/route-matrix.test.ts for: ${missing.join('; ')}`).toEqual([]);
    expect(stale, `rows name routes that no longer exist: ${stale.join('; ')}`).toEqual([]);
    expect(ROUTES.length).toBe(new Set(ROUTES.map(([m, r]) => `${m} ${r}`)).size);
  });

  it('finds every exported handler made by householdRoute()', () => {
    const unguarded = discovered.filter((d) => !d.guarded).map((d) => d.key);
    expect(unguarded, `wrap these handlers in householdRoute() from src/server/authz.ts: ${unguarded.join('; ')}`).toEqual([]);
    expect(discovered.length).toBe(ROUTES.length);
  });

  it('tells a householdRoute() handler from one that skips the gate', () => {
    expect(GUARDED in householdRoute('read', () => new Response(null))).toBe(true);
    expect(GUARDED in handle(async () => new Response(null))).toBe(false);
  });

  it.each(ROUTES.map((r) => [`${r[0]} ${r[1]}`, r] as const))('%s answers each role as the table says', async (_label, [method, route, members, opts = {}]) => {
    const f = opts.fresh ? await freshFixture(shared) : shared;
    const url = urlFor(f.household.id, route, { ...f.params, ...opts.params }, opts.query);
    const expected = { signedOut: 401, outsider: 404, ...members };
    const actual: Record<string, number> = {};
    for (const who of ROLE_ORDER) {
      const r = await call(cookieOf(f, who), method, url, opts);
      actual[who] = r.status;
    }
    expect(actual, `${method} ${url}`).toEqual(expected);
    // A household that does not exist is not found, even for an owner of others.
    const ghost = await call(f.owner.cookie, method, urlFor(999999999, route, { ...f.params, ...opts.params }, opts.query), opts);
    expect(ghost.status, `${method} on a household that does not exist`).toBe(404);
    const notAnId = await call(f.owner.cookie, method, urlFor('1e3', route, { ...f.params, ...opts.params }, opts.query), opts);
    expect(notAnId.status, `${method} with a household id that is not a number`).toBe(404);
  });
});
