/**
 * Every request passes these steps in order. The order matters:
 * 1. security headers — outermost, so every answer carries them, the steps' own answers included;
 * 2. API errors — an /api/ answer Astro wrote as HTML or text (a method a route lacks) becomes JSON;
 * 3. origin check — a cross-site state change is refused before anything reads or writes;
 * 4. session — the signed-in user and session on Astro.locals;
 * 5. household — for page views, the user's households and the current one (needs the user);
 * 6. sign-in redirect — signed-out visitors of private pages go to /sign-in?next=… (needs the user).
 * Each step lives in its own module under src/server/middleware/.
 */
import { sequence } from 'astro:middleware';
import { apiErrors } from './server/middleware/api-errors';
import { household } from './server/middleware/household';
import { originCheck } from './server/middleware/origin-check';
import { securityHeaders } from './server/middleware/security-headers';
import { session } from './server/middleware/session';
import { signInRedirect } from '@/server/middleware/sign-in-redirect';

export const onRequest = sequence(securityHeaders, apiErrors, originCheck, session, household, signInRedirect);
