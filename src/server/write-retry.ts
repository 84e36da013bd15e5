/**
 * The one retry rule for writes. MariaDB may end a transaction with a deadlock (1213) — on one server
 * when two transactions lock rows in opposite orders, and on a Galera cluster whenever two nodes
 * commit conflicting writes at the same moment (the later one fails certification at COMMIT). The
 * transaction is rolled back whole, so running it again from the start is safe: every write path
 * goes through `withWriteRetry`, which `src/db/client.ts` puts around every `db.transaction(…)` and
 * every single autocommit statement of the pool, so no caller has to remember it.
 *
 * Only lock errors are retried. A lost connection is not: the COMMIT may have landed, and only an
 * Idempotency-Key (harvests, bought food, staples) makes sending the request again safe.
 */
import { isRetryableLock } from './db-errors';

/** Tries in all, the first included: enough for a busy cluster, bounded so a request still ends. */
export const WRITE_ATTEMPTS = 6;

let retriesSoFar = 0;

/** Retries done by this process since it started (the cluster test reads it from the log lines). */
export function writeRetries(): number {
  return retriesSoFar;
}

/**
 * Runs `work` (one whole transaction or one autocommit statement) and runs it again, after a short
 * random pause that grows with each try, when MariaDB answered a deadlock or lock wait timeout.
 * Example: `await withWriteRetry(() => db.transaction(async (tx) => …))`
 */
export async function withWriteRetry<T>(work: () => Promise<T>, attempts = WRITE_ATTEMPTS): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (e) {
      if (!isRetryableLock(e) || attempt >= attempts) throw e;
      retriesSoFar++;
      // One line per retry: how often a cluster conflicts is worth seeing in the server's log.
      console.warn(`selfsown: write retried after a lock conflict (try ${attempt + 1} of ${attempts})`);
      // Random pauses keep two retrying twins from meeting again at once.
      await new Promise((done) => setTimeout(done, 5 + Math.random() * 25 * attempt));
    }
  }
}
