/**
 * npm run admin:grant <email>
 * Makes an existing account a site administrator (reference-data management).
 */
import { eq } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/mysql2';
import { createPool } from '@/db/client';
import { migrateDatabase } from '@/db/migrate';
import * as schema from '@/db/schema';
import { databaseUrl, loadDotEnv } from '@/server/config';
import { dbUp } from './db';
import { isMain } from './is-main';

/** Grants the admin flag to the account with `email`; true if it was new, false if already held. */
export async function grantAdmin(url: string, email: string): Promise<boolean> {
  const pool = createPool(url);
  const db = drizzle(pool, { schema, mode: 'default' });
  try {
    const [u] = await db.select({ id: schema.user.id }).from(schema.user).where(eq(schema.user.email, email.trim().toLowerCase()));
    if (!u) throw new Error(`no account has the e-mail ${email}; sign up first, then grant`);
    const [res] = await db.insert(schema.siteAdmins).ignore().values({ userId: u.id });
    return res.affectedRows === 1;
  } finally {
    await pool.end();
  }
}

async function main(): Promise<void> {
  loadDotEnv();
  const email = process.argv[2];
  if (!email || !email.includes('@')) throw new Error('usage: npm run admin:grant <email>');
  const url = databaseUrl();
  await dbUp(url);
  await migrateDatabase(url);
  const added = await grantAdmin(url, email);
  console.log(added ? `• ${email} is now a site administrator` : `• ${email} was already a site administrator`);
}

if (isMain(import.meta.url)) {
  main().catch((e: unknown) => {
    console.error(`admin:grant: ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
