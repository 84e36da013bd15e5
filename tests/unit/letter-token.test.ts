import { describe, expect, it } from 'vitest';
import { letterToken, readLetterToken } from '@/server/letter-token';

const subject = { householdId: 42, userId: '0b7f2d0e-3c1a-4f7e-9d3b-2a6c8e1f5a90' };

describe('the monthly letter unsubscribe token', () => {
  it('reads back the household and member it was made for', () => {
    expect(readLetterToken(letterToken(subject))).toEqual(subject);
  });

  it('refuses a token whose payload or signature was changed', () => {
    const [payload, mac] = letterToken(subject).split('.') as [string, string];
    const otherPayload = Buffer.from(`43.${subject.userId}`).toString('base64url');
    expect(readLetterToken(`${otherPayload}.${mac}`)).toBeNull();
    const flipped = mac.slice(0, -1) + (mac.endsWith('A') ? 'B' : 'A');
    expect(readLetterToken(`${payload}.${flipped}`)).toBeNull();
    expect(readLetterToken(`${payload}.${mac.slice(0, 10)}`)).toBeNull();
  });

  it('refuses malformed input without throwing', () => {
    for (const t of [null, undefined, '', '.', 'abc', 'a.b.c', 'x'.repeat(400), 'ä.ö']) expect(readLetterToken(t)).toBeNull();
  });
});
