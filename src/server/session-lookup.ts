/**
 * The signed-in session of a request in one query. better-auth's getSession reads the session and
 * then its user (two round trips before any route can start); every request pays for it. This
 * answers the common case the same way in one query — the cookie's signature checked as
 * better-auth signs it (HMAC-SHA256 of the token with the app's secret), then the session joined
 * to its user — and leaves every other case to better-auth itself: a session that has expired
 * (better-auth deletes it), one due for its daily refresh (better-auth moves its expiry), a token
 * with no row. So what a request is allowed to do never differs from better-auth's answer; only
 * the round trips do. Nothing is kept between requests.
 */
import { createHmac, timingSafeEqual } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { getPool } from '@/db/client';
import { session, user } from '@/db/schema';
import { getAuth } from './auth';
import { rawQuery, readFields, selectList } from './raw-query';

export interface SignedInSession {
  user: { id: string; email: string; name: string; emailVerified: boolean };
  session: { id: string; userId: string; expiresAt: Date };
}

/** The value of the first cookie called `name` in a Cookie header (as better-call reads it), or null. */
export function cookieValue(header: string | null, name: string): string | null {
  if (!header) return null;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq === -1 || part.slice(0, eq).trim() !== name) continue;
    let value = part.slice(eq + 1).trim();
    if (value.startsWith('"')) value = value.slice(1, -1);
    try {
      return decodeURIComponent(value);
    } catch {
      return value;
    }
  }
  return null;
}

/**
 * The token of a signed cookie value ("token.signature", the signature base64 HMAC-SHA256 of the
 * token), or null when the signature does not match `secret` — better-call's getSignedCookie rule.
 */
export function verifiedToken(value: string, secret: string): string | null {
  const dot = value.lastIndexOf('.');
  if (dot < 1) return null;
  const token = value.slice(0, dot);
  const signature = value.slice(dot + 1);
  if (signature.length !== 44 || !signature.endsWith('=')) return null;
  const expected = createHmac('sha256', secret).update(token).digest();
  const given = Buffer.from(signature, 'base64');
  return given.length === expected.length && timingSafeEqual(given, expected) ? token : null;
}

/** The session columns every lookup reads (session joined to its user). */
export const sessionColumns = {
  sessionId: session.id,
  expiresAt: session.expiresAt,
  userId: user.id,
  email: user.email,
  name: user.name,
  emailVerified: user.emailVerified,
};

export type SessionRow = { sessionId: string; expiresAt: Date; userId: string; email: string; name: string; emailVerified: boolean };

/** Every request's one query, so a prepared statement over the binary protocol (raw-query.ts), as the household gate's. */
const sessionByToken = rawQuery<Record<string, unknown>>(sql`
    SELECT ${selectList(sessionColumns)} FROM ${session} JOIN ${user} ON ${eq(user.id, session.userId)}
     WHERE ${eq(session.token, sql.placeholder('token'))} LIMIT 1`);

/** The token of the request's session cookie when its signature is ours, else null (signed out: better-auth answers the same without a query). */
export async function sessionCookieToken(headers: Headers): Promise<string | null> {
  const ctx = await getAuth().$context;
  const value = cookieValue(headers.get('cookie'), ctx.authCookies.sessionToken.name);
  return value ? verifiedToken(value, ctx.secret) : null;
}

/**
 * A session row as signed in, or undefined when better-auth must see it: expired (it deletes it)
 * or old enough to have its expiry moved on this request — better-auth's own two tests.
 */
export async function currentSession(row: SessionRow | undefined, now: number = Date.now()): Promise<SignedInSession | undefined> {
  if (!row) return undefined;
  const { expiresIn, updateAge } = (await getAuth().$context).sessionConfig;
  const expires = row.expiresAt.getTime();
  if (expires < now || expires - expiresIn * 1000 + updateAge * 1000 <= now) return undefined;
  return {
    user: { id: row.userId, email: row.email, name: row.name, emailVerified: row.emailVerified },
    session: { id: row.sessionId, userId: row.userId, expiresAt: row.expiresAt },
  };
}

/**
 * The request's session and user, null when it carries no validly signed session cookie, or
 * undefined when better-auth must decide (no such session, expired, due for refresh).
 */
export async function quickSession(headers: Headers, now: number = Date.now()): Promise<SignedInSession | null | undefined> {
  const token = await sessionCookieToken(headers);
  if (!token) return null;
  const [raw] = await sessionByToken.run(getPool(), { token });
  return currentSession(raw ? readFields(sessionColumns, raw) : undefined, now);
}

/** The request's session by quickSession, else by better-auth's getSession; null when signed out. */
export async function requestSession(headers: Headers): Promise<SignedInSession | null> {
  const quick = await quickSession(headers);
  if (quick !== undefined) return quick;
  const s = await getAuth().api.getSession({ headers });
  return s ? { user: s.user, session: s.session } : null;
}

/** Puts a session (or nobody) on Astro.locals, as the middleware's session step does. */
export function putSession(locals: App.Locals, s: SignedInSession | null): void {
  // The site-admin flag is looked up by the admin pages that need it, not on every request.
  locals.user = s ? { id: s.user.id, email: s.user.email, name: s.user.name, emailVerified: s.user.emailVerified } : null;
  locals.session = s ? { id: s.session.id, userId: s.session.userId, expiresAt: s.session.expiresAt } : null;
}
