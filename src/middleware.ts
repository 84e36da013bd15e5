/**
 * Every request passes these steps in order. The order matters:
 * 1. security headers — outermost, so every answer carries them, the steps' own answers included;
 * 2. API errors — an /api/ answer Astro wrote as HTML or text (a method a route lacks) becomes JSON;
 * 3. database down — a 503 with Retry-After (JSON or a plain page) when a later step or the page
 *    cannot reach the database;
 * 4. origin check — a cross-site state change is refused before anything reads or writes;
 * 5. session — the signed-in user and session on Astro.locals;
 * 6. household — for page views, the user's households and the current one (needs the user);
 * 7. sign-in redirect — signed-out visitors of private pages go to /sign-in?next=… (needs the user).
 * Each step lives in its own module under src/server/middleware/.
 */
import { sequence } from 'astro:middleware';
import { apiErrors } from './server/middleware/api-errors';
import { databaseDown } from './server/middleware/database-down';
import { household } from './server/middleware/household';
import { originCheck } from './server/middleware/origin-check';
import { securityHeaders } from './server/middleware/security-headers';
import { session } from './server/middleware/session';
import { signInRedirect } from '@/server/middleware/sign-in-redirect';

export const onRequest = sequence(securityHeaders, apiErrors, databaseDown, originCheck, session, household, signInRedirect);
