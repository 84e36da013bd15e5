/**
 * The demo seed `npm start` runs: when the database has no demo owner it creates the invented demo
 * household (src/server/demo/generate-demo.ts: three growing years up to today) and three confirmed
 * accounts, one per role; the owner is also site administrator. Runs once: when the demo owner
 * exists it changes nothing (so a deleted demo household stays deleted; `npm run demo:reset`
 * rebuilds it).
 */
import { randomUUID } from 'node:crypto';
import { hashPassword } from 'better-auth/crypto';
import { eq, inArray } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/mysql2';
import { createPool } from '@/db/client';
import * as schema from '@/db/schema';
import { databaseUrl, loadDotEnv } from '@/server/config';
import { loadCropTable } from '@/server/crop-table-file';
import { DEMO_HOUSEHOLD } from '@/server/demo/demo-catalogue';
import { demoFoodCodes } from '@/server/demo/demo-foods';
import { DEFAULT_DEMO_SEED, generateDemo } from '@/server/demo/generate-demo';
import { loadDemoFoods, writeDemo } from '@/server/demo/write-demo';
import { DEMO_OWNER_EMAIL } from '@/server/demo-preview';
import { isMain } from './is-main';

export { DEMO_HOUSEHOLD };
export const DEMO_PASSWORD = 'selfsown-demo';
/** The owner's address has one home, beside the landing page's preview that looks it up. */
export const DEMO_EMAIL = DEMO_OWNER_EMAIL;

/** The demo's accounts, one per role (invented people; `.invalid` addresses never receive mail). */
export const DEMO_ACCOUNTS = [
  { role: 'owner', email: DEMO_EMAIL, name: 'Maren (demo owner)' },
  { role: 'grower', email: 'grower.demo@selfsown.invalid', name: 'Ivo (demo grower)' },
  { role: 'viewer', email: 'viewer.demo@selfsown.invalid', name: 'Rowan (demo viewer)' },
] as const;

export interface SeedOptions {
  log?: (line: string) => void;
  seed?: number;
  /** Last day with entries; default today in the demo household's zone. */
  anchor?: string;
}

export interface SeedResult {
  created: boolean;
  householdId?: number;
}

/** Lines that name the three demo accounts, for `npm start` and the reset. */
export function demoAccountLines(): string[] {
  return DEMO_ACCOUNTS.map((a) => `${a.role.padEnd(6)}  ${a.email}  /  ${DEMO_PASSWORD}${a.role === 'owner' ? '   (also site administrator)' : ''}`);
}

/** Creates the demo accounts and household unless the demo owner exists. */
export async function seedDemo(url: string, options: SeedOptions | ((line: string) => void) = {}): Promise<SeedResult> {
  const opts = typeof options === 'function' ? { log: options } : options;
  const log = opts.log ?? console.log;
  const pool = createPool(url);
  const db = drizzle(pool, { schema, mode: 'default' });
  try {
    const [existing] = await db.select({ id: schema.user.id }).from(schema.user).where(eq(schema.user.email, DEMO_EMAIL));
    if (existing) {
      log(`• demo account ${DEMO_EMAIL} exists; nothing seeded`);
      return { created: false };
    }
    const taken = await db.select({ email: schema.user.email }).from(schema.user).where(inArray(schema.user.email, DEMO_ACCOUNTS.map((a) => a.email)));
    if (taken.length > 0) throw new Error(`${taken.map((t) => t.email).join(', ')} already exist without the demo owner; remove them or run npm run demo:reset.`);

    const cropTable = loadCropTable();
    const foods = await loadDemoFoods(db, demoFoodCodes(cropTable));
    const started = Date.now();
    const data = generateDemo({ seed: opts.seed ?? DEFAULT_DEMO_SEED, anchor: opts.anchor, cropTable, foods });
    const hash = await hashPassword(DEMO_PASSWORD);
    const result = await db.transaction(async (tx) => {
      const now = new Date();
      const ids: string[] = [];
      for (const a of DEMO_ACCOUNTS) {
        const id = randomUUID();
        ids.push(id);
        await tx.insert(schema.user).values({ id, name: a.name, email: a.email, emailVerified: true, createdAt: now, updatedAt: now });
        await tx.insert(schema.account).values({ id: randomUUID(), accountId: id, providerId: 'credential', userId: id, password: hash, createdAt: now, updatedAt: now });
      }
      await tx.insert(schema.siteAdmins).values({ userId: ids[0]! });
      const written = await writeDemo(tx, data, foods, { userIds: [ids[0]!, ids[1]!] });
      // Owners and growers get the monthly letter from the day they join, as real members do.
      await tx.insert(schema.memberships).values(DEMO_ACCOUNTS.map((a, i) => ({ householdId: written.householdId, userId: ids[i]!, role: a.role, monthlyLetter: a.role !== 'viewer' })));
      return written;
    });
    log(
      `• demo seeded in ${((Date.now() - started) / 1000).toFixed(1)} s: "${DEMO_HOUSEHOLD.name}", ${data.household.recordsSince} to ${data.months.at(-1)!.month}, ` +
        `${result.harvests} harvests, ${result.purchases} bought-food entries, ${result.plantings} plantings`,
    );
    return { created: true, householdId: result.householdId };
  } finally {
    await pool.end();
  }
}

if (isMain(import.meta.url)) {
  loadDotEnv();
  seedDemo(databaseUrl())
    .then(() => {
      for (const line of demoAccountLines()) console.log(`  ${line}`);
    })
    .catch((e: unknown) => {
      console.error(`seed-demo: ${e instanceof Error ? e.message : String(e)}`);
      process.exit(1);
    });
}
