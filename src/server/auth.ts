/**
 * Sign-in with better-auth: email + password, sessions and limiter counters in MariaDB (nothing in
 * process memory that a second app server would need), verification and password reset by e-mail.
 *
 * Links in mail always land on our own pages: the verification link goes through better-auth's
 * /api/auth/verify-email and then to /verify?next=…; the reset link through
 * /api/auth/reset-password/{token} to /reset-password?token=….
 */
import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { getDb } from '@/db/client';
import { account, rateLimit, session, user, verification } from '@/db/schema';
import { PASSWORD_MAX, PASSWORD_MIN } from '@/lib/account-schemas';
import { safeNext } from '@/lib/safe-next';
import { authSecret, publicOrigin, rateLimitRule, secureCookies } from './config';
import { authAfter, authBefore } from './auth-guards';
import { linkMail, sendMail } from './mail';
import { refuseDisabledSession } from './admin-accounts';

/** The header our auth route sets from the socket's address (never taken from the client). */
export const CLIENT_IP_HEADER = 'x-selfsown-client-ip';

/** Session cookies are named selfsown.session_token (with __Secure- in front over https). */
export const COOKIE_PREFIX = 'selfsown';

/**
 * better-auth's verification link, its callback pointed at our /verify page. The sign-up form sends
 * the page to continue to afterwards (e.g. /invite/…) as callbackURL; anything else is dropped.
 */
export function verificationLink(url: string): string {
  const u = new URL(url);
  const asked = u.searchParams.get('callbackURL');
  const next = asked?.startsWith('/verify') ? '' : safeNext(asked, '');
  u.searchParams.set('callbackURL', next && next !== '/' ? `/verify?next=${encodeURIComponent(next)}` : '/verify');
  return u.toString();
}

/** better-auth's reset link for `token`, landing on our /reset-password page (whatever the client asked). */
export function resetLink(token: string): string {
  return `${publicOrigin()}/api/auth/reset-password/${encodeURIComponent(token)}?callbackURL=${encodeURIComponent('/reset-password')}`;
}

function createAuth() {
  return betterAuth({
    appName: 'Selfsown',
    baseURL: publicOrigin(),
    basePath: '/api/auth',
    secret: authSecret(),
    trustedOrigins: [publicOrigin()],
    database: drizzleAdapter(getDb(), {
      provider: 'mysql',
      schema: { user, session, account, verification, rateLimit },
    }),
    emailAndPassword: {
      enabled: true,
      requireEmailVerification: true,
      minPasswordLength: PASSWORD_MIN,
      maxPasswordLength: PASSWORD_MAX,
      resetPasswordTokenExpiresIn: 60 * 60,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user: u, token }) => {
        await sendMail(
          linkMail(
            u.email,
            'Choose a new Selfsown password',
            'Someone (we hope you) asked to reset the password of your Selfsown account.',
            'Choose a new password',
            resetLink(token),
            'The link works once and for one hour. If you did not ask, ignore this mail: your password stays as it is.',
          ),
        );
      },
      // Sign-up answers the same for a known address (no account enumeration); the owner hears of it.
      onExistingUserSignUp: async ({ user: u }) => {
        await sendMail(
          linkMail(
            u.email,
            'You already have a Selfsown account',
            'Someone (we hope you) tried to sign up to Selfsown with this address, which already has an account.',
            'Sign in',
            `${publicOrigin()}/sign-in`,
            'Forgot the password? Use "Forgot your password?" on the sign-in page. If this was not you, ignore this mail.',
          ),
        );
      },
    },
    emailVerification: {
      sendOnSignUp: true,
      sendOnSignIn: true,
      autoSignInAfterVerification: true,
      expiresIn: 60 * 60 * 24,
      sendVerificationEmail: async ({ user: u, url }) => {
        await sendMail(
          linkMail(
            u.email,
            'Confirm your e-mail for Selfsown',
            `Welcome to Selfsown, ${u.name}. Please confirm that this address is yours.`,
            'Confirm my address',
            verificationLink(url),
            'The link works for 24 hours. If you did not sign up, ignore this mail.',
          ),
        );
      },
    },
    session: { expiresIn: 60 * 60 * 24 * 30, updateAge: 60 * 60 * 24 },
    // An account a site administrator disabled gets no new session: sign-in answers 403.
    databaseHooks: { session: { create: { before: async (s) => refuseDisabledSession(s) } } },
    // Plain-text names and the per-account sign-in limit (src/server/auth-guards.ts).
    hooks: { before: authBefore, after: authAfter },
    rateLimit: {
      enabled: true,
      storage: 'database',
      modelName: 'rateLimit',
      ...rateLimitRule('AUTH_RATE_LIMIT', { max: 100, window: 60 }),
      customRules: {
        '/sign-in/email': rateLimitRule('AUTH_SIGNIN_RATE_LIMIT', { max: 5, window: 60 }),
        '/sign-up/email': rateLimitRule('AUTH_SIGNUP_RATE_LIMIT', { max: 10, window: 600 }),
        '/request-password-reset': rateLimitRule('AUTH_RESET_RATE_LIMIT', { max: 5, window: 600 }),
        '/send-verification-email': rateLimitRule('AUTH_RESET_RATE_LIMIT', { max: 5, window: 600 }),
      },
    },
    advanced: {
      cookiePrefix: COOKIE_PREFIX,
      ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] },
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax' },
      useSecureCookies: secureCookies(),
      database: { generateId: () => crypto.randomUUID() },
    },
  });
}

let instance: ReturnType<typeof createAuth> | null = null;

export function getAuth() {
  instance ??= createAuth();
  return instance;
}
