/** Applies the committed migrations in drizzle/ to a database. */
import { resolve } from 'node:path';
import { drizzle } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import { createPool } from './client';

export async function migrateDatabase(url: string, root = process.cwd()): Promise<void> {
  const pool = createPool(url);
  try {
    await migrate(drizzle(pool), { migrationsFolder: resolve(root, 'drizzle') });
  } finally {
    await pool.end();
  }
}
