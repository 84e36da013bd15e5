/**
 * Nothing a second app server needs lives in the first one's memory: a session made through server A
 * works through server B, and the sign-in limits (per address, better-auth's counters, and per account,
 * src/server/auth-guards.ts) count attempts made through both. The servers run with
 * AUTH_SIGNIN_RATE_LIMIT=3/60 and AUTH_ACCOUNT_SIGNIN_RATE_LIMIT=4/60 (src/cli/test-cluster.ts).
 */
import { describe, expect, it } from 'vitest';
import { freshLoopbackAddress, loopbackCookie } from '../support/loopback';
import { newVerifiedUser, TEST_PASSWORD } from '../support/users';
import { call } from './support';

const signIn = (server: number, email: string, password: string, from = freshLoopbackAddress()) =>
  call(server, '', 'POST', '/api/auth/sign-in/email', { email, password }, {}, from);

describe('two app servers, one set of sessions and limits', () => {
  it('a session made through A is good on B, and signing out through B ends it on A', async () => {
    const u = await newVerifiedUser({ name: 'Sam Session' });
    const a = await signIn(0, u.email, TEST_PASSWORD);
    expect(a.status).toBe(200);
    const cookie = loopbackCookie(a);
    const created = await call(1, cookie, 'POST', '/api/households', { name: 'Two-door plot', timezone: 'Europe/Berlin', units: 'metric', yearStartMonth: 1 });
    expect(created.status).toBe(201);
    const onA = await call(0, cookie, 'GET', '/api/households');
    expect(onA.status).toBe(200);
    expect(onA.body.households.map((h: { id: number }) => h.id)).toContain(created.body.household.id);

    expect((await call(1, cookie, 'POST', '/api/auth/sign-out', {})).status).toBe(200);
    expect((await call(0, cookie, 'GET', '/api/households')).status).toBe(401);
  });

  it('the per-address sign-in limit counts attempts through both servers', async () => {
    const u = await newVerifiedUser({ name: 'Ada Address' });
    const from = freshLoopbackAddress();
    // Three wrong passwords from one address, through A, B, A: each refused as wrong (401).
    for (const server of [0, 1, 0]) expect((await signIn(server, u.email, 'not-the-password', from)).status).toBe(401);
    // The fourth, through B, is over the limit of 3 per minute counted across both.
    expect((await signIn(1, u.email, TEST_PASSWORD, from)).status).toBe(429);
  });

  it('the per-account limit counts attempts from many addresses through both servers', async () => {
    const u = await newVerifiedUser({ name: 'Ava Account' });
    for (const server of [0, 1, 0, 1]) expect((await signIn(server, u.email, 'not-the-password')).status).toBe(401);
    // A fifth attempt from yet another address, even with the right password: the account's 4 per minute are used.
    expect((await signIn(0, u.email, TEST_PASSWORD)).status).toBe(429);
  });
});
