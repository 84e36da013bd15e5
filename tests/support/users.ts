/**
 * Signed-in test users and households for integration tests, through the built server's real
 * endpoints (sign-up → verification mail at the fake SMTP → verification link, which signs in).
 * No sign-in request is made, so the sign-in rate limiter is never hit.
 *
 *   const owner = await newVerifiedUser();                        // { id, email, password, cookie, … }
 *   const h = await createHousehold(owner.cookie);                // { id, name, timezone, units, … }
 *   const viewer = await newVerifiedUser({ name: 'Vi' });
 *   await addMember(owner, h.id, viewer, 'viewer');               // invitation mail + accept
 *   const r = await apiAs(viewer.cookie, 'POST', `/api/households/${h.id}/harvests`, { … });
 *   expect(r.status).toBe(403);
 *
 *   const t = await householdWithRoles();                         // owner, grower, viewer, outsider + household
 */
import { randomBytes } from 'node:crypto';
import { api, BASE_URL } from './env';
import { freshLoopbackAddress, loopbackCookie, requestFrom } from './loopback';
import { linkTo, waitForMail } from './mail';

export type Role = 'owner' | 'grower' | 'viewer';

export interface TestUser {
  id: string;
  name: string;
  email: string;
  password: string;
  /** A Cookie header value carrying the session (send as `cookie`). */
  cookie: string;
}

export interface TestHousehold {
  id: number;
  name: string;
  timezone: string;
  units: 'metric' | 'us';
  yearStartMonth: number;
  /** ISO 4217 code; guessed from the zone when the test does not give one. */
  currency?: string | null;
}

/** A password that passes the rules (10+ characters). */
export const TEST_PASSWORD = 'bean-row-compost-42';

/** A fresh address under the reserved .invalid domain, e.g. grower-3f9a1c2b@test.selfsown.invalid. */
export function uniqueEmail(tag = 'user'): string {
  return `${tag}-${randomBytes(4).toString('hex')}@test.selfsown.invalid`;
}

/** The cookies a response sets, as one Cookie header value ("a=1; b=2"); '' when none. */
export function cookieFrom(headers: Headers): string {
  return headers
    .getSetCookie()
    .map((c) => c.split(';')[0]!)
    .filter((c) => !/=$/.test(c)) // a cookie set to '' is being deleted
    .join('; ');
}

/**
 * JSON request to the built server as the holder of `cookie` ('' for signed out). Like a browser's
 * fetch, a request other than GET/HEAD names its origin (the app's own unless `headers` says otherwise).
 */
export function apiAs(cookie: string, method: string, path: string, body?: unknown, headers: Record<string, string> = {}) {
  const safe = method === 'GET' || method === 'HEAD';
  return api(path, {
    method,
    headers: { ...(safe ? {} : { origin: BASE_URL }), ...(cookie ? { cookie } : {}), ...(body === undefined ? {} : { 'content-type': 'application/json' }), ...headers },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

/** POST /api/auth/sign-up/email (the answer is 200 whether or not the address is new). */
export function signUp(u: { name: string; email: string; password: string; next?: string }) {
  return apiAs('', 'POST', '/api/auth/sign-up/email', { name: u.name, email: u.email, password: u.password, callbackURL: u.next ?? '/households' });
}

/**
 * POST /api/auth/sign-in/email; cookie is '' unless it succeeded. Sent from a fresh loopback
 * address each time (unless `from` is given), so the sign-in limiter never gets in the way.
 */
export async function signIn(email: string, password: string, from = freshLoopbackAddress()): Promise<{ status: number; cookie: string; body: any; retryAfter: string }> {
  const r = await requestFrom(from, 'POST', '/api/auth/sign-in/email', { email, password });
  return { status: r.status, cookie: r.status === 200 ? loopbackCookie(r) : '', body: r.body, retryAfter: String(r.headers['x-retry-after'] ?? '') };
}

/** Opens a verification link as a browser would (no redirects followed); returns the session cookie. */
export async function followVerificationLink(link: string): Promise<{ status: number; location: string; cookie: string }> {
  const res = await fetch(link, { redirect: 'manual' });
  await res.arrayBuffer();
  return { status: res.status, location: res.headers.get('location') ?? '', cookie: cookieFrom(res.headers) };
}

/** A new account with a confirmed address, signed in. */
export async function newVerifiedUser(opts: { name?: string; email?: string; password?: string } = {}): Promise<TestUser> {
  const email = (opts.email ?? uniqueEmail(opts.name?.toLowerCase().replace(/[^a-z]+/g, '') || 'user')).toLowerCase();
  const name = opts.name ?? 'Test Grower';
  const password = opts.password ?? TEST_PASSWORD;
  const r = await signUp({ name, email, password });
  if (r.status !== 200) throw new Error(`sign-up of ${email} answered ${r.status}: ${JSON.stringify(r.body)}`);
  const mail = await waitForMail(email, { subject: /Confirm/ });
  const v = await followVerificationLink(linkTo(mail, '/api/auth/verify-email'));
  if (!v.cookie.includes('session_token')) throw new Error(`verifying ${email} set no session cookie (status ${v.status})`);
  return { id: r.body.user.id as string, name, email, password, cookie: v.cookie };
}

/** POST /api/households as the holder of `cookie`; throws unless 201. */
export async function createHousehold(cookie: string, input: Partial<Omit<TestHousehold, 'id'>> = {}): Promise<TestHousehold> {
  const r = await apiAs(cookie, 'POST', '/api/households', { name: 'Test plot', timezone: 'Europe/Berlin', units: 'metric', yearStartMonth: 1, ...input });
  if (r.status !== 201) throw new Error(`creating a household answered ${r.status}: ${JSON.stringify(r.body)}`);
  return r.body.household as TestHousehold;
}

/** Invites `member` by e-mail as `owner` and accepts with the mailed token: the real path. */
export async function addMember(owner: TestUser, householdId: number, member: TestUser, role: Role): Promise<void> {
  const inv = await apiAs(owner.cookie, 'POST', `/api/households/${householdId}/invitations`, { email: member.email, role });
  if (inv.status !== 201) throw new Error(`inviting ${member.email} answered ${inv.status}: ${JSON.stringify(inv.body)}`);
  const mail = await waitForMail(member.email, { subject: /invites you/ });
  const token = new URL(linkTo(mail, '/invite/')).pathname.split('/').pop()!;
  const acc = await apiAs(member.cookie, 'POST', '/api/invitations/accept', { token });
  if (acc.status !== 200) throw new Error(`accepting as ${member.email} answered ${acc.status}: ${JSON.stringify(acc.body)}`);
}

export interface RoleFixture {
  household: TestHousehold;
  owner: TestUser;
  grower: TestUser;
  viewer: TestUser;
  /** Signed in, but not a member of `household`. */
  outsider: TestUser;
}

/** One household with an owner, a grower and a viewer, plus a signed-in outsider. */
export async function householdWithRoles(input: Partial<Omit<TestHousehold, 'id'>> = {}): Promise<RoleFixture> {
  const [owner, grower, viewer, outsider] = await Promise.all([
    newVerifiedUser({ name: 'Olive Owner' }),
    newVerifiedUser({ name: 'Gus Grower' }),
    newVerifiedUser({ name: 'Vera Viewer' }),
    newVerifiedUser({ name: 'Otto Outsider' }),
  ]);
  const household = await createHousehold(owner.cookie, input);
  await addMember(owner, household.id, grower, 'grower');
  await addMember(owner, household.id, viewer, 'viewer');
  return { household, owner, grower, viewer, outsider };
}

export { BASE_URL };
