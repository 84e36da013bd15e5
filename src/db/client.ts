/**
 * The one database client: a pool over DATABASE_URL's host or hosts (src/db/failover-pool.ts)
 * wrapped by Drizzle. Created on first use so that importing a module never opens a connection by
 * itself.
 *
 * Every `db.transaction(…)` of a client made here runs whole again after a deadlock or a Galera
 * certification conflict (`withWriteRetry`, src/server/write-retry.ts); the pool does the same for
 * single autocommit statements. A transaction's callback must therefore only touch the database
 * (or state it rebuilds on each run): it may run more than once.
 */
import type mysql from 'mysql2/promise';
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import * as schema from './schema';
import { databaseUrl, dbPoolSize, parseDatabaseUrl } from '@/server/config';
import { infileStream } from '@/server/bulk-load';
import { withWriteRetry } from '@/server/write-retry';
import { FailoverPool } from './failover-pool';

export type Db = MySql2Database<typeof schema>;

let pool: mysql.Pool | null = null;
let db: Db | null = null;

/**
 * A pool for `url` (one host or a comma-separated list). Typed as mysql2's Pool: FailoverPool has
 * the members this code base and Drizzle call (query, execute, getConnection, end).
 */
export function createPool(url: string): mysql.Pool {
  const p = parseDatabaseUrl(url);
  const failover = new FailoverPool(p.hosts, {
    user: p.user,
    password: p.password,
    database: p.database,
    connectionLimit: dbPoolSize(),
    charset: 'utf8mb4_unicode_ci',
    timezone: 'Z',
    dateStrings: ['DATE'],
    multipleStatements: false,
    // A dead host must not hold a request for long before the next one is tried.
    connectTimeout: 5000,
    // LOAD DATA LOCAL INFILE reads only what src/server/bulk-load.ts offers, never a file on disk.
    infileStreamFactory: infileStream,
  });
  return failover as unknown as mysql.Pool;
}

/** Drizzle on `pool`, its transactions retried whole after a deadlock (see the head of this file). */
export function drizzleOn(onPool: mysql.Pool): Db {
  const client = drizzle(onPool, { schema, mode: 'default' });
  const transaction = client.transaction.bind(client);
  client.transaction = ((work, config) => withWriteRetry(() => transaction(work, config))) as Db['transaction'];
  return client;
}

/** The shared Drizzle client for DATABASE_URL. */
export function getDb(): Db {
  if (!db) {
    pool = createPool(databaseUrl());
    db = drizzleOn(pool);
  }
  return db;
}

/** The raw pool, for bulk statements Drizzle does not express well. */
export function getPool(): mysql.Pool {
  getDb();
  return pool!;
}

export async function closeDb(): Promise<void> {
  if (pool) await pool.end();
  pool = null;
  db = null;
}
