/**
 * Two checks better-auth does not make itself, run as its `hooks` (src/server/auth.ts):
 *
 * - **Names follow the plain-text rule** (src/lib/plain-text.ts) on the server too: sign-up and
 *   account updates with a NUL, a line break or a lone UTF-16 half in the name are refused (400),
 *   and the name is stored trimmed.
 * - **Sign-in is limited per account** as well as per address. better-auth's limiter counts per
 *   client address, so many addresses would give many guesses at one account. Here every attempt
 *   at an address is counted in MariaDB (better-auth's `rate_limit` table, key `account:` + the
 *   SHA-256 of the lower-cased address, so no address is stored in it) before the password is
 *   checked, atomically, so parallel guesses are all counted; a successful sign-in takes its own
 *   count back. Over AUTH_ACCOUNT_SIGNIN_RATE_LIMIT (default 10 per 15 minutes) the account
 *   answers 429 with X-Retry-After until the window ends — for everyone, the owner included: the
 *   way back in meanwhile is "Forgot your password?". Nothing lives in process memory, so every app
 *   server sees the same count.
 */
import { createHash, randomUUID } from 'node:crypto';
import { APIError, createAuthMiddleware } from 'better-auth/api';
import { sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { accountName } from '@/lib/account-schemas';
import { rateLimitRule } from './config';

const SIGN_IN = '/sign-in/email';
const NAMED_PATHS = new Set(['/sign-up/email', '/update-user']);

/** The limiter row's key for an address. Example: `accountKey('Robin@Example.org ')` → 'account:5c0e…' */
export function accountKey(email: string): string {
  return `account:${createHash('sha256').update(email.trim().toLowerCase()).digest('hex')}`;
}

function accountRule() {
  return rateLimitRule('AUTH_ACCOUNT_SIGNIN_RATE_LIMIT', { max: 10, window: 15 * 60 });
}

/** Counts one sign-in attempt at `email`; 429 when the account has had too many in its window. */
async function countAttempt(email: string): Promise<void> {
  const { max, window } = accountRule();
  const key = accountKey(email);
  const now = Date.now();
  const windowStart = now - window * 1000;
  // One statement, so parallel attempts each add one. The window runs from its first attempt;
  // MariaDB applies the assignments left to right, so last_request sees the new count.
  await getDb().execute(sql`
    INSERT INTO rate_limit (id, \`key\`, count, last_request) VALUES (${randomUUID()}, ${key}, 1, ${now})
    ON DUPLICATE KEY UPDATE
      count = IF(last_request <= ${windowStart}, 1, count + 1),
      last_request = IF(count = 1, ${now}, last_request)`);
  const [rows] = (await getDb().execute(sql`SELECT count, last_request AS since FROM rate_limit WHERE \`key\` = ${key}`)) as unknown as [{ count: number; since: number }[]];
  const row = rows[0];
  if (row && row.count > max) {
    const retryAfter = Math.max(1, Math.ceil((Number(row.since) + window * 1000 - now) / 1000));
    throw new APIError(
      'TOO_MANY_REQUESTS',
      { code: 'TOO_MANY_ATTEMPTS_FOR_ACCOUNT', message: 'Too many sign-in attempts for this account. Wait a while, or choose a new password with "Forgot your password?".' },
      { 'X-Retry-After': String(retryAfter) },
    );
  }
}

/** A successful sign-in takes back its own attempt (failures stay counted). */
async function uncountAttempt(email: string): Promise<void> {
  await getDb().execute(sql`UPDATE rate_limit SET count = GREATEST(count - 1, 0) WHERE \`key\` = ${accountKey(email)}`);
}

const bodyField = (body: unknown, name: string): unknown => (body && typeof body === 'object' ? (body as Record<string, unknown>)[name] : undefined);

/** better-auth's `hooks.before`. */
export const authBefore = createAuthMiddleware(async (ctx) => {
  if (NAMED_PATHS.has(ctx.path) && bodyField(ctx.body, 'name') !== undefined) {
    const name = accountName.safeParse(bodyField(ctx.body, 'name'));
    if (!name.success) throw new APIError('BAD_REQUEST', { code: 'INVALID_NAME', message: name.error.issues[0]?.message ?? 'Check the name.' });
    return { context: { body: { ...(ctx.body as object), name: name.data } } };
  }
  const email = bodyField(ctx.body, 'email');
  // A body without a text address is refused by better-auth's own validation next.
  if (ctx.path === SIGN_IN && typeof email === 'string') await countAttempt(email);
});

/** better-auth's `hooks.after`. */
export const authAfter = createAuthMiddleware(async (ctx) => {
  const email = bodyField(ctx.body, 'email');
  if (ctx.path !== SIGN_IN || typeof email !== 'string') return;
  if (!(ctx.context.returned instanceof APIError)) await uncountAttempt(email);
});
