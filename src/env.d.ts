/// <reference types="astro/client" />
/// <reference types="vite-plugin-pwa/client" />

/**
 * What src/middleware.ts puts on Astro.locals. Every page and API route sees all four set (the
 * steps in src/server/middleware/ set them before the route runs); they are optional only because
 * an answer given by an earlier step (the origin check's 403) or an error page rendered without the
 * middleware has none.
 */
declare namespace App {
  interface Locals {
    /** The signed-in user, else null (session step; also null on /api/auth/ and /_astro/). */
    user?: { id: string; email: string; name: string; emailVerified: boolean } | null;
    /** Their better-auth session, else null (session step). */
    session?: { id: string; userId: string; expiresAt: Date } | null;
    /** On /api/households/{id}/…: user and session are read by the household gate with the membership (authz.ts), not by the session step. */
    sessionWithGate?: boolean;
    /** Page views only (not /api; household step): the signed-in user's households with their role, by name. */
    households?: { id: number; name: string; role: 'owner' | 'grower' | 'viewer' }[];
    /** Page views only (household step): the household in the URL, else the remembered one (cookie `household`), else the only one. */
    household?: { id: number; name: string; role: 'owner' | 'grower' | 'viewer' } | null;
  }
}
