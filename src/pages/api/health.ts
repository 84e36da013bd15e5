import type { APIRoute } from 'astro';
import { json } from '@/server/http';

/**
 * GET /api/health: a trivial JSON answer (`{ ok: true }`) for load balancers and the benchmark's
 * load baseline. It reads nothing and says nothing about the server beyond that it answers.
 */
export const GET: APIRoute = () => json({ ok: true });
