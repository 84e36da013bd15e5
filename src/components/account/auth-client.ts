/**
 * better-auth's own browser client for the account forms, so sign-up, sign-in, password reset and
 * verification mail go through the library that serves them (`/api/auth/*`) rather than hand-made
 * requests. `authCall()` turns its answer into the one thing the forms need: nothing on success, or
 * the failure with its status, better-auth's error code, its sentence and the limiter's wait.
 */
import { createAuthClient, type ErrorContext } from 'better-auth/react';

/**
 * The client, on this site's own origin. The default redirect plugin is off: the forms choose where
 * to go next themselves, through the safe `next` path.
 */
export const authClient = createAuthClient({ basePath: '/api/auth', disableDefaultFetchPlugins: true });

/** A refused or unanswered account request. `status` 0 means no answer at all. */
export interface AuthFailure {
  status: number;
  /** better-auth's error code, e.g. 'EMAIL_NOT_VERIFIED' ('' when it gave none). */
  code: string;
  message: string;
  /** Seconds to wait, from the rate limiter's X-Retry-After header, when it refused. */
  retryAfter: string | null;
}

const OFFLINE = 'Could not reach Selfsown. Check your connection and try again.';
const FALLBACK = 'Something went wrong. Please try again.';

type Answer = { error: { status: number; code?: string | undefined; message?: string | undefined } | null };

/**
 * Runs one client call, giving it the options that catch the response headers; null on success.
 * Example: `await authCall((o) => authClient.signIn.email({ email, password }, o))` → null or { status: 401, … }
 */
export async function authCall(call: (fetchOptions: { onError: (ctx: ErrorContext) => void }) => Promise<Answer>): Promise<AuthFailure | null> {
  let retryAfter: string | null = null;
  try {
    const { error } = await call({ onError: (ctx) => void (retryAfter = ctx.response.headers.get('x-retry-after')) });
    if (!error) return null;
    return { status: error.status, code: error.code ?? '', message: error.message || FALLBACK, retryAfter };
  } catch {
    return { status: 0, code: 'network', message: OFFLINE, retryAfter: null };
  }
}

/** The sentence for a limiter refusal. Example: `tooMany('1')` → 'Too many attempts from here. Wait 1 second and try again.' */
export function tooMany(retryAfter: string | null): string {
  const s = Number(retryAfter);
  return `Too many attempts from here. Wait ${s > 0 ? `${s} second${s === 1 ? '' : 's'}` : 'a minute'} and try again.`;
}
