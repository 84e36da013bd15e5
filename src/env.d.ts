/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    user?: { id: string; email: string; name: string; emailVerified: boolean } | null;
    session?: { id: string; userId: string; expiresAt: Date } | null;
    /** Page views only (not /api): the signed-in user's households with their role, by name. */
    households?: { id: number; name: string; role: 'owner' | 'grower' | 'viewer' }[];
    /** Page views only: the household in the URL, else the remembered one (cookie `household`), else the only one. */
    household?: { id: number; name: string; role: 'owner' | 'grower' | 'viewer' } | null;
  }
}
