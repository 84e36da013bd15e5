/**
 * The session lookup reads better-auth's signed session cookie itself (src/server/session-lookup.ts):
 * it must accept exactly what better-call signs and nothing else.
 */
import { serializeSignedCookie } from 'better-call';
import { describe, expect, it } from 'vitest';
import { cookieValue, verifiedToken } from '@/server/session-lookup';

const SECRET = 'a-test-secret-of-at-least-thirty-two-characters';

async function signed(token: string, secret = SECRET): Promise<string> {
  // "name=value; Path=…": better-call's own Set-Cookie for a signed cookie.
  return (await serializeSignedCookie('selfsown.session_token', token, secret)).split(';')[0]!;
}

describe('the signed session cookie', () => {
  it('reads the token better-call signed, among other cookies', async () => {
    const header = `household=4; ${await signed('tok-en_123')}; theme=light`;
    const value = cookieValue(header, 'selfsown.session_token')!;
    expect(verifiedToken(value, SECRET)).toBe('tok-en_123');
  });

  it('refuses another secret, a changed token and a missing signature', async () => {
    const value = cookieValue(await signed('abc'), 'selfsown.session_token')!;
    expect(verifiedToken(value, `${SECRET}-other`)).toBeNull();
    expect(verifiedToken(`abd${value.slice(3)}`, SECRET)).toBeNull();
    expect(verifiedToken('abc', SECRET)).toBeNull();
    expect(cookieValue('other=1', 'selfsown.session_token')).toBeNull();
    expect(cookieValue(null, 'selfsown.session_token')).toBeNull();
  });

  it('takes the first of two cookies of one name, as better-call does', async () => {
    const header = `${await signed('first')}; ${await signed('second')}`;
    expect(verifiedToken(cookieValue(header, 'selfsown.session_token')!, SECRET)).toBe('first');
  });
});
