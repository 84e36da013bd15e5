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
import { preparedOnce } from '@/db/client';
import { session, user } from '@/db/schema';
import { getAuth } from './auth';

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

const sessionByToken = preparedOnce((db) =>
  db
    .select({
      sessionId: session.id,
      expiresAt: session.expiresAt,
      userId: user.id,
      email: user.email,
      name: user.name,
      emailVerified: user.emailVerified,
    })
    .from(session)
    .innerJoin(user, eq(user.id, session.userId))
    .where(eq(session.token, sql.placeholder('token')))
    .limit(1)
    .prepare(),
);

/**
 * The request's session and user, null when it carries no validly signed session cookie, or
 * undefined when better-auth must decide (no such session, expired, due for refresh).
 */
export async function quickSession(headers: Headers, now: number = Date.now()): Promise<SignedInSession | null | undefined> {
  const ctx = await getAuth().$context;
  const value = cookieValue(headers.get('cookie'), ctx.authCookies.sessionToken.name);
  if (!value) return null;
  const token = verifiedToken(value, ctx.secret);
  if (!token) return null;
  const [row] = await sessionByToken().execute({ token });
  if (!row) return undefined;
  const expires = row.expiresAt.getTime();
  const { expiresIn, updateAge } = ctx.sessionConfig;
  // better-auth's own tests: expired, or old enough to have its expiry moved on this request.
  if (expires < now || expires - expiresIn * 1000 + updateAge * 1000 <= now) return undefined;
  return {
    user: { id: row.userId, email: row.email, name: row.name, emailVerified: row.emailVerified },
    session: { id: row.sessionId, userId: row.userId, expiresAt: row.expiresAt },
  };
}
