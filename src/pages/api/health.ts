import type { APIRoute } from 'astro';
import { DATABASE_RETRY_AFTER_SECONDS } from '@/server/db-errors';
import { databaseState } from '@/server/db-state';
import { json } from '@/server/http';

/**
 * GET /api/health: whether this server answers and reaches its database — 200 `{ ok: true,
 * database: 'up' }`, or 503 `{ ok: false, database: 'down' }` with Retry-After, so a load balancer
 * takes a server that lost its database out of the rotation. The database is asked at most once a
 * second (src/server/db-state.ts), so the benchmark's load baseline stays a near-trivial answer.
 */
export const GET: APIRoute = async () => {
  const database = await databaseState();
  if (database === 'up') return json({ ok: true, database });
  return json({ ok: false, database }, 503, { 'retry-after': String(DATABASE_RETRY_AFTER_SECONDS) });
};
