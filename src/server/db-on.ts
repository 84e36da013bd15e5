/**
 * The Drizzle client on a given mysql2 pool. Data functions that take a pool (the benchmark and
 * the tests hand them their own) query through Drizzle's builder all the same: one client per pool,
 * made on first use and kept as long as the pool lives.
 */
import type { Pool } from 'mysql2/promise';
import { drizzleOn, type Db } from '@/db/client';

const clients = new WeakMap<Pool, Db>();

/** The Drizzle client for `pool`, e.g. dbOn(getPool()).select().from(foods). */
export function dbOn(pool: Pool): Db {
  let db = clients.get(pool);
  if (!db) clients.set(pool, (db = drizzleOn(pool)));
  return db;
}
