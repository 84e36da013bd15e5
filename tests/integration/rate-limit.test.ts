import { afterAll, describe, expect, it } from 'vitest';
import { testPool } from '../support/env';
import { newVerifiedUser, signIn } from '../support/users';

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
