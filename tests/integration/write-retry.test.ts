/**
 * The write retry rule (src/server/write-retry.ts) against the real MariaDB: two connections lock two
 * rows in opposite orders, so InnoDB picks one as the deadlock victim (1213) and rolls it back. The
 * retried transaction then runs whole again and both changes are stored exactly once. The same
 * helper is what the Drizzle client puts around every transaction (src/db/client.ts), which the
 * second test shows through `drizzleOn()`.
 */
import mysql from 'mysql2/promise';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drizzleOn } from '@/db/client';
import { isRetryableLock } from '@/server/db-errors';
import { withWriteRetry, writeRetries } from '@/server/write-retry';
import { testPool, TEST_DB_URL } from '../support/env';
import { parseDatabaseUrl } from '@/server/config';

const TABLE = 'write_retry_probe';
let pool: mysql.Pool;

/** A plain connection of its own (not pooled), so each side holds its transaction open. */
function connect() {
  const p = parseDatabaseUrl(TEST_DB_URL);
  return mysql.createConnection({ host: p.host, port: p.port, user: p.user, password: p.password, database: p.database });
}

beforeAll(async () => {
  pool = testPool();
  await pool.query(`DROP TABLE IF EXISTS ${TABLE}`);
  await pool.query(`CREATE TABLE ${TABLE} (id INT PRIMARY KEY, n INT NOT NULL) ENGINE=InnoDB`);
});

afterAll(async () => {
  await pool.query(`DROP TABLE IF EXISTS ${TABLE}`);
  await pool.end();
});

/** Two transactions that lock rows 1 and 2 in opposite orders, each waiting for the other's first lock. */
async function crossedUpdates(run: (first: number, second: number, tries: number[]) => Promise<void>): Promise<number[]> {
  await pool.query(`DELETE FROM ${TABLE}`);
  await pool.query(`INSERT INTO ${TABLE} (id, n) VALUES (1, 0), (2, 0)`);
  const tries: number[] = [0, 0];
  await Promise.all([run(1, 2, tries), run(2, 1, tries)]);
  return tries;
}

describe('withWriteRetry on a real deadlock', () => {
  it('without the retry one side fails with 1213; with it both changes land once', async () => {
    // Without: the victim's error reaches the caller.
    await pool.query(`DELETE FROM ${TABLE}`);
    await pool.query(`INSERT INTO ${TABLE} (id, n) VALUES (1, 0), (2, 0)`);
    const bare = await Promise.allSettled(
      [
        [1, 2],
        [2, 1],
      ].map(async ([first, second]) => {
        const c = await connect();
        try {
          await c.beginTransaction();
          await c.query(`UPDATE ${TABLE} SET n = n + 1 WHERE id = ?`, [first]);
          await new Promise((r) => setTimeout(r, 300));
          await c.query(`UPDATE ${TABLE} SET n = n + 1 WHERE id = ?`, [second]);
          await c.commit();
        } catch (e) {
          await c.rollback().catch(() => undefined);
          throw e;
        } finally {
          await c.end();
        }
      }),
    );
    const failed = bare.filter((r) => r.status === 'rejected');
    expect(failed).toHaveLength(1);
    expect(isRetryableLock((failed[0] as PromiseRejectedResult).reason)).toBe(true);

    // With: the victim runs again and both transactions' two increments are stored.
    const before = writeRetries();
    const tries = await crossedUpdates(async (first, second, tries) => {
      const c = await connect();
      try {
        await withWriteRetry(async () => {
          tries[first - 1]!++;
          await c.beginTransaction();
          try {
            await c.query(`UPDATE ${TABLE} SET n = n + 1 WHERE id = ?`, [first]);
            await new Promise((r) => setTimeout(r, 300));
            await c.query(`UPDATE ${TABLE} SET n = n + 1 WHERE id = ?`, [second]);
            await c.commit();
          } catch (e) {
            await c.rollback();
            throw e;
          }
        });
      } finally {
        await c.end();
      }
    });
    const [rows] = (await pool.query(`SELECT id, n FROM ${TABLE} ORDER BY id`)) as unknown as [{ id: number; n: number }[]];
    expect(rows).toEqual([
      { id: 1, n: 2 },
      { id: 2, n: 2 },
    ]);
    expect(tries[0]! + tries[1]!).toBe(3); // one side ran twice
    expect(writeRetries() - before).toBe(1);
  });

  it('every transaction of the Drizzle client is retried whole', async () => {
    const db = drizzleOn(pool);
    const tries = await crossedUpdates(async (first, second, tries) => {
      await db.transaction(async (tx) => {
        tries[first - 1]!++;
        await tx.execute(sql.raw(`UPDATE ${TABLE} SET n = n + 1 WHERE id = ${first}`));
        await new Promise((r) => setTimeout(r, 300));
        await tx.execute(sql.raw(`UPDATE ${TABLE} SET n = n + 1 WHERE id = ${second}`));
      });
    });
    const [rows] = (await pool.query(`SELECT id, n FROM ${TABLE} ORDER BY id`)) as unknown as [{ id: number; n: number }[]];
    expect(rows.map((r) => r.n)).toEqual([2, 2]);
    expect(tries[0]! + tries[1]!).toBe(3);
  });

  it('other errors are not retried', async () => {
    let tries = 0;
    await expect(
      withWriteRetry(async () => {
        tries++;
        await pool.query(`INSERT INTO ${TABLE} (id, n) VALUES (1, 0), (1, 0)`);
      }),
    ).rejects.toThrow(/Duplicate/);
    expect(tries).toBe(1);
  });
});
