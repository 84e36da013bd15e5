/**
 * The one database client: a mysql2 pool wrapped by Drizzle. Created on first use so that importing
 * a module never opens a connection by itself.
 */
import mysql from 'mysql2/promise';
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import * as schema from './schema';
import { databaseUrl, dbPoolSize, parseDatabaseUrl } from '@/server/config';
import { infileStream } from '@/server/bulk-load';

export type Db = MySql2Database<typeof schema>;

let pool: mysql.Pool | null = null;
let db: Db | null = null;

export function createPool(url: string): mysql.Pool {
  const p = parseDatabaseUrl(url);
  return mysql.createPool({
    host: p.host,
    port: p.port,
    user: p.user,
    password: p.password,
    database: p.database,
    connectionLimit: dbPoolSize(),
    charset: 'utf8mb4_unicode_ci',
    timezone: 'Z',
    dateStrings: ['DATE'],
    multipleStatements: false,
    // LOAD DATA LOCAL INFILE reads only what src/server/bulk-load.ts offers, never a file on disk.
    infileStreamFactory: infileStream,
  });
}

/** The shared Drizzle client for DATABASE_URL. */
export function getDb(): Db {
  if (!db) {
    pool = createPool(databaseUrl());
    db = drizzle(pool, { schema, mode: 'default' });
  }
  return db;
}

/**
 * A query built once per client and kept: `build` makes a prepared Drizzle query (placeholders
 * for what changes per request), so a hot query is not written out as SQL again on every request.
 * Built again if the client was closed and opened anew.
 * @example const byToken = preparedOnce((db) => db.select().from(session).where(eq(session.token, sql.placeholder('token'))).prepare());
 *          await byToken().execute({ token });
 */
export function preparedOnce<T>(build: (db: Db) => T): () => T {
  let made: { db: Db; query: T } | null = null;
  return () => {
    const current = getDb();
    if (made?.db !== current) made = { db: current, query: build(current) };
    return made.query;
  };
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
