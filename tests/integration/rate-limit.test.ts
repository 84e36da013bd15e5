import { createHash } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { testPool } from '../support/env';
import { freshLoopbackAddress } from '../support/loopback';
import { apiAs, newVerifiedUser, signIn, signUp, uniqueEmail } from '../support/users';

const pool = testPool();
afterAll(() => pool.end());

// `npm test` runs the server with AUTH_SIGNIN_RATE_LIMIT=5/2: five sign-in attempts per client
// address, the count starting over once 2 s pass without an allowed attempt. This test signs in
// from a loopback address of its own, so no other test shares its count.
const FROM = '127.77.0.1';
const MAX = 5;
const WINDOW_MS = 2000;

describe('sign-in rate limit (better-auth limiter, counters in MariaDB)', () => {
  it('answers 429 after repeated failed sign-ins, and lets the real owner in once the window passes', async () => {
    const u = await newVerifiedUser({ name: 'Targeted' });
    for (let i = 0; i < MAX; i += 1) {
      expect((await signIn(u.email, `wrong-password-${i}`, FROM)).status).toBe(401);
    }
    const blocked = await signIn(u.email, `wrong-password-again`, FROM);
    expect(blocked.status).toBe(429);
    expect(Number(blocked.retryAfter)).toBeGreaterThan(0);
    // While blocked, even the right password is refused (the limiter does not reveal which was right).
    const rightButBlocked = await signIn(u.email, u.password, FROM);
    expect(rightButBlocked.status).toBe(429);
    // The count lives in MariaDB (a second app server would see it), keyed by address and path.
    const [rows] = await pool.query("SELECT `key`, `count` FROM rate_limit WHERE `key` LIKE ?", [`%${FROM}%sign-in%`]);
    expect(rows).toEqual([expect.objectContaining({ count: MAX })]);
    // Another client address is not affected.
    expect((await signIn(u.email, u.password, '127.77.0.2')).status).toBe(200);

    // No lockout for ever: after the window the owner signs in.
    await new Promise((r) => setTimeout(r, WINDOW_MS + 300));
    const later = await signIn(u.email, u.password, FROM);
    expect(later.status).toBe(200);
    expect(later.cookie).toContain('session_token');
  });
});

// `npm test` runs the server with AUTH_ACCOUNT_SIGNIN_RATE_LIMIT=8/3: eight attempts at one account
// per 3 s window, from any addresses; successful sign-ins do not count.
const ACCOUNT_MAX = 8;
const ACCOUNT_WINDOW_MS = 3000;

describe('sign-in rate limit per account (many addresses, one count in MariaDB)', () => {
  it('answers 429 to every address once one account has had too many guesses, until the window ends', async () => {
    const u = await newVerifiedUser({ name: 'Guessed at' });
    // Each guess from its own address: the per-address limiter never sees more than one.
    const guesses = await Promise.all(Array.from({ length: ACCOUNT_MAX }, (_, i) => signIn(u.email, `wrong-password-${i}`, freshLoopbackAddress())));
    expect(guesses.map((g) => g.status)).toEqual(Array(ACCOUNT_MAX).fill(401));
    const blocked = await signIn(u.email.toUpperCase(), 'one-more-guess', freshLoopbackAddress());
    expect(blocked.status).toBe(429);
    expect(blocked.body.code).toBe('TOO_MANY_ATTEMPTS_FOR_ACCOUNT');
    expect(Number(blocked.retryAfter)).toBeGreaterThan(0);
    expect(Number(blocked.retryAfter)).toBeLessThanOrEqual(ACCOUNT_WINDOW_MS / 1000);
    expect((await signIn(u.email, u.password, freshLoopbackAddress())).status).toBe(429);
    // The count is a row keyed by the address's SHA-256 (no address stored), shared by every app server.
    const key = `account:${createHash('sha256').update(u.email.toLowerCase()).digest('hex')}`;
    const [rows] = await pool.query('SELECT `count` FROM rate_limit WHERE `key` = ?', [key]);
    expect((rows as { count: number }[])[0]!.count).toBeGreaterThan(ACCOUNT_MAX);

    await new Promise((r) => setTimeout(r, ACCOUNT_WINDOW_MS + 300));
    expect((await signIn(u.email, u.password, freshLoopbackAddress())).status).toBe(200);
  });

  it('does not count successful sign-ins against the account', async () => {
    const u = await newVerifiedUser({ name: 'Signs in often' });
    for (let i = 0; i < ACCOUNT_MAX + 3; i += 1) expect((await signIn(u.email, u.password, freshLoopbackAddress())).status).toBe(200);
  });
});

describe('names at sign-up follow the plain-text rule on the server', () => {
  it('refuses a name with a NUL or a line break with 400, creating no account, and stores a trimmed name', async () => {
    for (const name of ['Robin\u0000', 'Robin\nHood', 'Robin\ud800']) {
      const email = uniqueEmail('badname');
      const r = await signUp({ name, email, password: 'bean-row-compost-42' });
      expect(r.status).toBe(400);
      expect(r.body.code).toBe('INVALID_NAME');
      const [rows] = await pool.query('SELECT id FROM user WHERE email = ?', [email]);
      expect(rows).toEqual([]);
    }
    // The same rule when a signed-in person renames their account.
    const u = await newVerifiedUser({ name: 'Renamer' });
    const rename = await apiAs(u.cookie, 'POST', '/api/auth/update-user', { name: 'Re\u0007namer' });
    expect(rename.status).toBe(400);
    expect(rename.body.code).toBe('INVALID_NAME');
    const email = uniqueEmail('trimmed');
    expect((await signUp({ name: '  Robin  ', email, password: 'bean-row-compost-42' })).status).toBe(200);
    const [rows] = await pool.query('SELECT name FROM user WHERE email = ?', [email]);
    expect(rows).toEqual([{ name: 'Robin' }]);
  });
});
