/**
 * npm run demo:reset: deletes the demo household and the three demo accounts and builds them again
 * (a fresh three years up to today). It touches only the demo accounts and the households the demo
 * owner owns, and refuses — changing nothing — when such a household has a member who is not a demo
 * account (someone joined it; their records are not ours to delete).
 */
import { and, eq, inArray } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/mysql2';
import { createPool } from '@/db/client';
import * as schema from '@/db/schema';
import { databaseUrl, loadDotEnv } from '@/server/config';
import { deleteHouseholdRows } from '@/server/households';
import { isMain } from './is-main';
import { DEMO_ACCOUNTS, DEMO_EMAIL, demoAccountLines, seedDemo, type SeedOptions, type SeedResult } from './seed-demo';

export class DemoResetRefused extends Error {}

/** Removes the demo accounts and their households, then seeds the demo again. */
export async function resetDemo(url: string, options: SeedOptions = {}): Promise<SeedResult & { removedHouseholds: number }> {
  const log = options.log ?? console.log;
  const pool = createPool(url);
  const db = drizzle(pool, { schema, mode: 'default' });
  let removed = 0;
  try {
    const demoEmails = DEMO_ACCOUNTS.map((a) => a.email as string);
    await db.transaction(async (tx) => {
      const accounts = await tx.select({ id: schema.user.id, email: schema.user.email }).from(schema.user).where(inArray(schema.user.email, demoEmails)).for('update');
      const owner = accounts.find((a) => a.email === DEMO_EMAIL);
      const owned = owner
        ? await tx.select({ id: schema.memberships.householdId }).from(schema.memberships).where(and(eq(schema.memberships.userId, owner.id), eq(schema.memberships.role, 'owner')))
        : [];
      const householdIds = owned.map((o) => o.id);
      if (householdIds.length > 0) {
        const members = await tx
          .select({ householdId: schema.memberships.householdId, email: schema.user.email })
          .from(schema.memberships)
          .innerJoin(schema.user, eq(schema.user.id, schema.memberships.userId))
          .where(inArray(schema.memberships.householdId, householdIds));
        const others = members.filter((m) => !demoEmails.includes(m.email));
        if (others.length > 0) {
          throw new DemoResetRefused(
            `the demo owner's household ${others[0]!.householdId} has a member who is not a demo account (${others.map((o) => o.email).join(', ')}); remove them from it first — nothing was changed.`,
          );
        }
      }
      for (const id of householdIds) await deleteHouseholdRows(tx, id);
      // Sessions, credentials and memberships go with the user (ON DELETE CASCADE).
      if (accounts.length > 0) await tx.delete(schema.user).where(inArray(schema.user.id, accounts.map((a) => a.id)));
      removed = householdIds.length;
    });
    log(`• demo removed: ${removed} household(s)`);
  } finally {
    await pool.end();
  }
  const seeded = await seedDemo(url, options);
  return { ...seeded, removedHouseholds: removed };
}

if (isMain(import.meta.url)) {
  loadDotEnv();
  resetDemo(databaseUrl())
    .then(() => {
      console.log('Demo accounts:');
      for (const line of demoAccountLines()) console.log(`  ${line}`);
    })
    .catch((e: unknown) => {
      console.error(`demo:reset: ${e instanceof Error ? e.message : String(e)}`);
      process.exit(1);
    });
}
