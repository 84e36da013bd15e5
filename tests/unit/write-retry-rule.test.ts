/**
 * Which database errors the write retry rule runs a transaction again for (src/server/db-errors.ts,
 * src/server/write-retry.ts). Codes as mysql2 names them; Drizzle wraps the driver's error as `cause`.
 * 1213 and 1205 are MariaDB's deadlock and lock wait timeout; 1467 is what a deadlock on the
 * auto-increment lock reaches the client as (MariaDB MDEV-33593).
 */
import { describe, expect, it } from 'vitest';
import { isRetryableLock } from '@/server/db-errors';
import { withWriteRetry } from '@/server/write-retry';

const driverError = (code: string) => Object.assign(new Error(code), { code });
const wrapped = (code: string) => Object.assign(new Error('Failed query'), { cause: driverError(code) });

describe('the write retry rule', () => {
  it('retries deadlocks, lock wait timeouts and auto-increment lock deadlocks, also under Drizzle', () => {
    for (const code of ['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT', 'ER_AUTOINC_READ_FAILED']) {
      expect(isRetryableLock(driverError(code))).toBe(true);
      expect(isRetryableLock(wrapped(code))).toBe(true);
    }
    for (const code of ['ER_DUP_ENTRY', 'ER_NO_REFERENCED_ROW_2', 'PROTOCOL_CONNECTION_LOST', 'ECONNREFUSED']) expect(isRetryableLock(wrapped(code))).toBe(false);
  });

  it('runs the work again until it succeeds, and gives up after six tries', async () => {
    let tries = 0;
    await expect(withWriteRetry(async () => (++tries < 3 ? Promise.reject(wrapped('ER_LOCK_DEADLOCK')) : 'done'))).resolves.toBe('done');
    expect(tries).toBe(3);
    let counted = 0;
    await withWriteRetry(async () => {
      counted++;
      throw wrapped('ER_LOCK_DEADLOCK');
    }).catch((e: unknown) => expect(isRetryableLock(e)).toBe(true));
    expect(counted).toBe(6);
  });
});
