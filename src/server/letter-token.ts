/**
 * The monthly letter's unsubscribe token: base64url("householdId.userId") + "." + base64url of an
 * HMAC-SHA256 over that first part, keyed by a key derived from the auth secret (so the secret
 * itself never signs anything but sessions). It names one membership's letter and works without
 * signing in; it never expires (an old letter's link must still stop the letters), and a changed
 * auth secret voids every link.
 */
import { createHmac, timingSafeEqual } from 'node:crypto';
import { z } from 'zod';
import { authSecret } from './config';

/** The shape of a token as it arrives in `?t=`: two base64url parts joined by a dot. */
export const letterTokenParam = z.string().max(300).regex(/^[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+$/);

export interface LetterTokenSubject {
  householdId: number;
  userId: string;
}

/** A key of its own for the letter links, derived from the auth secret. */
function letterKey(): Buffer {
  return createHmac('sha256', authSecret()).update('selfsown:monthly-letter-unsubscribe:v1').digest();
}

function sign(payload: string): Buffer {
  return createHmac('sha256', letterKey()).update(payload).digest();
}

/** The token for one member's letter of one household. */
export function letterToken({ householdId, userId }: LetterTokenSubject): string {
  const payload = Buffer.from(`${householdId}.${userId}`, 'utf8').toString('base64url');
  return `${payload}.${sign(payload).toString('base64url')}`;
}

/** The household and member a token names, or null for anything malformed or not signed by us. */
export function readLetterToken(token: string | null | undefined): LetterTokenSubject | null {
  const parsed = letterTokenParam.safeParse(token);
  if (!parsed.success) return null;
  const [payload, mac] = parsed.data.split('.') as [string, string];
  const given = Buffer.from(mac, 'base64url');
  const expected = sign(payload);
  // Compared in constant time; a wrong length can be refused at once (it says nothing about the key).
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  const decoded = Buffer.from(payload, 'base64url').toString('utf8');
  const parts = /^([1-9][0-9]{0,9})\.([A-Za-z0-9_-]{1,36})$/.exec(decoded);
  if (!parts) return null;
  return { householdId: Number(parts[1]), userId: parts[2]! };
}
