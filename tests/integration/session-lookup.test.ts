/**
 * The one-query session lookup of the middleware (src/server/session-lookup.ts), and the household
 * gate that reads the session with the membership (src/server/authz.ts), answer exactly as
 * better-auth would: a current session signs the request in; a tampered cookie does not; an
 * expired session is refused and deleted, and one due for its daily refresh is refreshed — both by
 * better-auth itself, which the lookup hands those cases to.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { testPool } from '../support/env';
import { apiAs, createHousehold, newVerifiedUser } from '../support/users';

const pool = testPool();
afterAll(() => pool.end());

/** The session token and signature of a Cookie header's session cookie. */
function sessionParts(cookie: string): { name: string; token: string; signature: string } {
  const pair = cookie.split('; ').find((c) => c.includes('session_token='))!;
  const [name, value] = [pair.slice(0, pair.indexOf('=')), decodeURIComponent(pair.slice(pair.indexOf('=') + 1))];
  const dot = value.lastIndexOf('.');
  return { name, token: value.slice(0, dot), signature: value.slice(dot + 1) };
}

async function expiresAt(token: string): Promise<Date | null> {
  const [rows] = await pool.query('SELECT expires_at FROM session WHERE token = ?', [token]);
  return (rows as { expires_at: Date }[])[0]?.expires_at ?? null;
}

describe('the session lookup', () => {
  it('signs in a current session and refuses a cookie whose signature does not match', async () => {
    const u = await newVerifiedUser();
    expect((await apiAs(u.cookie, 'GET', '/api/households')).status).toBe(200);
    const { name, token, signature } = sessionParts(u.cookie);
    const other = await newVerifiedUser();
    // Another session's token under this one's signature, and this token under a changed signature.
    const swapped = `${name}=${encodeURIComponent(`${sessionParts(other.cookie).token}.${signature}`)}`;
    const flipped = `${name}=${encodeURIComponent(`${token}.${signature[0] === 'A' ? 'B' : 'A'}${signature.slice(1)}`)}`;
    expect((await apiAs(swapped, 'GET', '/api/households')).status).toBe(401);
    expect((await apiAs(flipped, 'GET', '/api/households')).status).toBe(401);
  });

  it('refuses an expired session, and better-auth deletes it', async () => {
    const u = await newVerifiedUser();
    const { token } = sessionParts(u.cookie);
    await pool.query('UPDATE session SET expires_at = NOW(3) - INTERVAL 1 MINUTE WHERE token = ?', [token]);
    expect((await apiAs(u.cookie, 'GET', '/api/households')).status).toBe(401);
    expect(await expiresAt(token)).toBeNull();
  });

  it('lets better-auth refresh a session older than a day (30-day sessions, refreshed daily: src/server/auth.ts)', async () => {
    const u = await newVerifiedUser();
    const { token } = sessionParts(u.cookie);
    // Ten days left: it was made 20 days ago, so its expiry is due to move.
    await pool.query('UPDATE session SET expires_at = NOW(3) + INTERVAL 10 DAY WHERE token = ?', [token]);
    expect((await apiAs(u.cookie, 'GET', '/api/households')).status).toBe(200);
    const days = ((await expiresAt(token))!.getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(29.9);
    expect(days).toBeLessThanOrEqual(30);
  });

  it('leaves a session made today as it is', async () => {
    const u = await newVerifiedUser();
    const { token } = sessionParts(u.cookie);
    const before = await expiresAt(token);
    expect((await apiAs(u.cookie, 'GET', '/api/households')).status).toBe(200);
    expect(await expiresAt(token)).toEqual(before);
  });
});

describe('the household gate reading the session with the membership', () => {
  it('answers a member, 404 to another signed-in person and 401 to a tampered or missing cookie', async () => {
    const u = await newVerifiedUser();
    const other = await newVerifiedUser();
    const h = await createHousehold(u.cookie);
    const path = `/api/households/${h.id}/people`;
    expect((await apiAs(u.cookie, 'GET', path)).status).toBe(200);
    expect((await apiAs(other.cookie, 'GET', path)).status).toBe(404);
    const { name, token, signature } = sessionParts(u.cookie);
    const flipped = `${name}=${encodeURIComponent(`${token}.${signature[0] === 'A' ? 'B' : 'A'}${signature.slice(1)}`)}`;
    expect((await apiAs(flipped, 'GET', path)).status).toBe(401);
    expect((await apiAs('', 'GET', path)).status).toBe(401);
    // Signed out and a household id that cannot be one: still 401 first, as before the gate read the session.
    expect((await apiAs('', 'GET', '/api/households/x1/people')).status).toBe(401);
    expect((await apiAs(u.cookie, 'GET', '/api/households/x1/people')).status).toBe(404);
  });

  it('refuses an expired session (deleted by better-auth) and lets better-auth refresh an old one', async () => {
    const u = await newVerifiedUser();
    const h = await createHousehold(u.cookie);
    const path = `/api/households/${h.id}/people`;
    const { token } = sessionParts(u.cookie);
    await pool.query('UPDATE session SET expires_at = NOW(3) + INTERVAL 10 DAY WHERE token = ?', [token]);
    expect((await apiAs(u.cookie, 'GET', path)).status).toBe(200);
    expect(((await expiresAt(token))!.getTime() - Date.now()) / 86_400_000).toBeGreaterThan(29.9);
    await pool.query('UPDATE session SET expires_at = NOW(3) - INTERVAL 1 MINUTE WHERE token = ?', [token]);
    expect((await apiAs(u.cookie, 'GET', path)).status).toBe(401);
    expect(await expiresAt(token)).toBeNull();
  });
});
