/**
 * The demo seed `npm start` runs: on first start it creates an invented demo household and its
 * owner, a confirmed account that is also site administrator. Runs once: when the demo account
 * exists it changes nothing (so a deleted demo household stays deleted).
 *
 *   sign in as  demo@selfsown.invalid  /  selfsown-demo
 *
 * Its crops, people, harvests and bought food come from `seed-demo-records.ts`.
 */
import { randomUUID } from 'node:crypto';
import { hashPassword } from 'better-auth/crypto';
import { eq } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/mysql2';
import { createPool } from '@/db/client';
import * as schema from '@/db/schema';
import { databaseUrl, loadDotEnv } from '@/server/config';
import { isMain } from './is-main';
import { seedDemoRecords } from './seed-demo-records';

export const DEMO_EMAIL = 'demo@selfsown.invalid';
export const DEMO_PASSWORD = 'selfsown-demo';
/** Invented for the demo: no real place or people. */
export const DEMO_HOUSEHOLD = { name: 'Fernhollow Plot (demo)', timezone: 'Europe/London', units: 'metric' as const, yearStartMonth: 3 };

export async function seedDemo(url: string, log: (line: string) => void = console.log): Promise<{ created: boolean; householdId?: number }> {
  const pool = createPool(url);
  const db = drizzle(pool, { schema, mode: 'default' });
  try {
    const [existing] = await db.select({ id: schema.user.id }).from(schema.user).where(eq(schema.user.email, DEMO_EMAIL));
    if (existing) {
      log(`• demo account ${DEMO_EMAIL} exists; nothing seeded`);
      return { created: false };
    }
    const userId = randomUUID();
    const hash = await hashPassword(DEMO_PASSWORD);
    const householdId = await db.transaction(async (tx) => {
      const now = new Date();
      await tx.insert(schema.user).values({ id: userId, name: 'Demo Grower', email: DEMO_EMAIL, emailVerified: true, createdAt: now, updatedAt: now });
      await tx.insert(schema.account).values({ id: randomUUID(), accountId: userId, providerId: 'credential', userId, password: hash, createdAt: now, updatedAt: now });
      await tx.insert(schema.siteAdmins).values({ userId });
      const [res] = await tx.insert(schema.households).values(DEMO_HOUSEHOLD);
      await tx.insert(schema.memberships).values({ householdId: res.insertId, userId, role: 'owner' });
      // Invented people who eat there, so the demo's need and home share have something to stand on.
      await tx.insert(schema.people).values([
        { householdId: res.insertId, name: 'Ada (demo)', sex: 'female', ageYears: 41, activity: 'active' },
        { householdId: res.insertId, name: 'Tomas (demo)', sex: 'male', ageYears: 44, activity: 'active' },
        { householdId: res.insertId, name: 'Lio (demo)', sex: 'male', ageYears: 9, activity: 'low', atHomePct: 80 },
      ]);
      await seedDemoRecords(tx, res.insertId, userId, { log });
      return res.insertId;
    });
    log(`• demo seeded: sign in as ${DEMO_EMAIL} / ${DEMO_PASSWORD} (owner of "${DEMO_HOUSEHOLD.name}", site admin)`);
    return { created: true, householdId };
  } finally {
    await pool.end();
  }
}

if (isMain(import.meta.url)) {
  loadDotEnv();
  seedDemo(databaseUrl()).catch((e: unknown) => {
    console.error(`seed-demo: ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
