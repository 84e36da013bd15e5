/**
 * Whether the database answers now, for /api/health and for the answers better-auth writes itself
 * (a 500 from its routes while the database is down becomes our 503). One `SELECT 1` through the
 * app's pool, given two seconds: a dead server refuses at once, a hung one must not hold the health
 * check past what a load balancer waits. An 'up' is trusted for a second (the health check stays
 * near-trivial under load); a 'down' is asked again next time, so recovery shows at once.
 */
import { getPool } from '@/db/client';
import { isDatabaseUnavailable } from './db-errors';

const PROBE_EVERY_MS = 1_000;
const PROBE_TIMEOUT_MS = 2_000;

export type DatabaseState = 'up' | 'down';

let last: { state: DatabaseState; at: number } | null = null;
let running: Promise<DatabaseState> | null = null;

async function probe(): Promise<DatabaseState> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<DatabaseState>((ok) => {
    timer = setTimeout(() => ok('down'), PROBE_TIMEOUT_MS);
  });
  const query = getPool()
    .query('SELECT 1')
    .then((): DatabaseState => 'up')
    .catch((e: unknown): DatabaseState => {
      if (!isDatabaseUnavailable(e)) console.error('database probe failed', e);
      return 'down';
    });
  try {
    return await Promise.race([query, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

/** 'up' when the database answered a query within the last second or answers one now. */
export async function databaseState(now = Date.now()): Promise<DatabaseState> {
  if (last?.state === 'up' && now - last.at < PROBE_EVERY_MS) return 'up';
  running ??= probe().then((state) => {
    last = { state, at: Date.now() };
    running = null;
    return state;
  });
  return running;
}
