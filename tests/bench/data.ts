/**
 * npm run bench:data — the benchmark's data, from the demo generator (INVENTED data, for timing only):
 * one heavy household of ten growing years (two lines of beds, so about 60 crops, frequent pickings
 * and shopping trips: ≈ 25,000 harvests and 7,500 purchases, six people), one small household (one
 * year, four beds) and 2,000 more small households of a year each — the service case — each with an
 * owner account. Written to its own databases on the private MariaDB: selfsown_bench (everything)
 * and selfsown_bench_small (the small household alone, the "otherwise empty" database; another
 * name with BENCH_DATABASE, see benchUrls). The heavy
 * household goes in one transaction, the 2,000 in transactions of 50 households.
 * `npm run bench` calls this when the data are missing or of an older layout (BENCH_FRESH=1: always).
 */
import { randomUUID } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { hashPassword } from 'better-auth/crypto';
import { drizzle } from 'drizzle-orm/mysql2';
import type { Pool } from 'mysql2/promise';
import { createPool } from '@/db/client';
import { migrateDatabase } from '@/db/migrate';
import * as schema from '@/db/schema';
import { todayIn } from '@/lib/months';
import { importFoods } from '@/cli/import-foods';
import { dbUp } from '@/cli/db';
import { isMain } from '@/cli/is-main';
import { recreateDatabase, serverPaths } from '@/cli/mariadb';
import { loadDotEnv, parseDatabaseUrl, testDatabaseUrl } from '@/server/config';
import { loadCropTable } from '@/server/crop-table-file';
import { DEMO_PEOPLE } from '@/server/demo/demo-catalogue';
import { demoFoodCodes } from '@/server/demo/demo-foods';
import { generateDemo } from '@/server/demo/generate-demo';
import type { DemoOptions } from '@/server/demo/demo-types';
import type { Tx } from '@/server/entry-input';
import { loadDemoFoods, writeDemo, type DbFood } from '@/server/demo/write-demo';

/** Bump when the generated data change shape, so `npm run bench` makes them again. */
const DATA_LAYOUT = 1;
export const SERVICE_HOUSEHOLDS = Number(process.env.BENCH_SERVICE_HOUSEHOLDS || 2000);
const SERVICE_BATCH = 50;
export const BENCH_EMAIL = 'bench@selfsown.invalid';
export const BENCH_PASSWORD = 'selfsown-bench';

/** Six people: the demo's four and two lodgers (invented). */
const SIX_PEOPLE = [
  ...DEMO_PEOPLE,
  { name: 'Lodger one (bench)', sex: 'female' as const, ageYears: 67, activity: 'low' as const },
  { name: 'Lodger two (bench)', sex: 'male' as const, ageYears: 24, activity: 'active' as const },
];
export const HEAVY: Omit<DemoOptions, 'cropTable' | 'foods' | 'anchor'> = { seed: 14, years: 10, lines: 2, pickScale: 4.5, tripsPerBuy: 6, people: SIX_PEOPLE };
const SMALL: Omit<DemoOptions, 'cropTable' | 'foods' | 'anchor'> = { seed: 7, years: 1, bedCount: 4 };

export interface BenchData {
  layout: number;
  anchor: string;
  url: string;
  smallUrl: string;
  heavyId: number;
  /** The small household in selfsown_bench (beside the 2,000) and alone in selfsown_bench_small. */
  smallId: number;
  smallAloneId: number;
  services: number;
  counts: { harvests: number; purchases: number; crops: number; people: number };
}

/**
 * The bench's database name (BENCH_DATABASE, default selfsown_bench); the small and food databases
 * add _small and _foods. Two checkouts benching on one MariaDB each set their own.
 */
export function benchDatabase(): string {
  const name = process.env.BENCH_DATABASE || 'selfsown_bench';
  if (!/^[A-Za-z0-9_]+$/.test(name)) throw new Error(`BENCH_DATABASE "${name}" may use only letters, digits and _`);
  return name;
}

export function benchUrls(): { url: string; smallUrl: string; foodsUrl: string } {
  const base = testDatabaseUrl().replace(/\/[A-Za-z0-9_]+$/, '');
  const name = benchDatabase();
  return { url: `${base}/${name}`, smallUrl: `${base}/${name}_small`, foodsUrl: `${base}/${name}_foods` };
}

/** Where the bench keeps its files: .data/bench, or .data/bench/<name> for another BENCH_DATABASE. */
export function benchDir(): string {
  const name = benchDatabase();
  return resolve(process.cwd(), '.data', 'bench', ...(name === 'selfsown_bench' ? [] : [name]));
}

const markerPath = () => resolve(benchDir(), 'data.json');

/** The data of an earlier `bench:data`, when they are still there and of this layout; else null. */
export async function existingData(): Promise<BenchData | null> {
  if (!existsSync(markerPath())) return null;
  const d = JSON.parse(readFileSync(markerPath(), 'utf8')) as BenchData;
  if (d.layout !== DATA_LAYOUT || d.services !== SERVICE_HOUSEHOLDS || d.url !== benchUrls().url) return null;
  const pool = createPool(d.url);
  try {
    const [rows] = await pool.query('SELECT COUNT(*) AS n FROM households WHERE id IN (?)', [[d.heavyId, d.smallId]]);
    return (rows as { n: number }[])[0]!.n === 2 ? d : null;
  } catch {
    return null;
  } finally {
    await pool.end();
  }
}

/** The bench account (owner of the heavy and the small household), confirmed, with a password. */
async function benchUser(pool: Pool, hash: string): Promise<string> {
  const db = drizzle(pool, { schema, mode: 'default' });
  const id = randomUUID();
  const now = new Date();
  await db.insert(schema.user).values({ id, name: 'Bench owner', email: BENCH_EMAIL, emailVerified: true, createdAt: now, updatedAt: now });
  await db.insert(schema.account).values({ id: randomUUID(), accountId: id, providerId: 'credential', userId: id, password: hash, createdAt: now, updatedAt: now });
  return id;
}

/** Generates and writes one household with its owner's membership, in the caller's transaction. */
async function writeHousehold(tx: Tx, options: DemoOptions, foods: Map<string, DbFood>, ownerId: string) {
  const data = generateDemo(options);
  const written = await writeDemo(tx, data, foods, { userIds: [ownerId] });
  await tx.insert(schema.memberships).values({ householdId: written.householdId, userId: ownerId, role: 'owner' });
  return { written, data };
}

/** Makes both databases from scratch and returns what `npm run bench` needs to find them. */
export async function makeBenchData(log: (line: string) => void = console.log): Promise<BenchData> {
  const { url, smallUrl } = benchUrls();
  const anchor = todayIn('Europe/London');
  const cropTable = loadCropTable();
  const hash = await hashPassword(BENCH_PASSWORD);
  for (const u of [url, smallUrl]) {
    await dbUp(u);
    await recreateDatabase(serverPaths(), parseDatabaseUrl(u));
    await migrateDatabase(u);
    await importFoods(u);
  }
  const pool = createPool(url);
  const smallPool = createPool(smallUrl);
  try {
    const db = drizzle(pool, { schema, mode: 'default' });
    const foods = await loadDemoFoods(db, demoFoodCodes(cropTable));
    const owner = await benchUser(pool, hash);
    let t = Date.now();
    const heavy = await db.transaction((tx) => writeHousehold(tx, { ...HEAVY, anchor, cropTable, foods }, foods, owner));
    log(`• heavy household: ${heavy.written.harvests} harvests, ${heavy.written.purchases} purchases, ${heavy.data.crops.length} crops, ${heavy.data.people.length} people in ${((Date.now() - t) / 1000).toFixed(1)} s`);
    const small = await db.transaction((tx) => writeHousehold(tx, { ...SMALL, anchor, cropTable, foods }, foods, owner));

    t = Date.now();
    for (let first = 0; first < SERVICE_HOUSEHOLDS; first += SERVICE_BATCH) {
      await db.transaction(async (tx) => {
        const n = Math.min(SERVICE_BATCH, SERVICE_HOUSEHOLDS - first);
        const now = new Date();
        const owners = Array.from({ length: n }, (_, i) => ({ id: randomUUID(), name: `Grower ${first + i + 1}`, email: `grower${first + i + 1}@bench.invalid`, emailVerified: true, createdAt: now, updatedAt: now }));
        await tx.insert(schema.user).values(owners);
        for (let i = 0; i < n; i++) await writeHousehold(tx, { seed: 1000 + first + i, years: 1, bedCount: 4, anchor, cropTable, foods }, foods, owners[i]!.id);
      });
      if ((first + SERVICE_BATCH) % 500 === 0) log(`  service households ${first + SERVICE_BATCH}/${SERVICE_HOUSEHOLDS} (${((Date.now() - t) / 1000).toFixed(0)} s)`);
    }

    const smallDb = drizzle(smallPool, { schema, mode: 'default' });
    const smallOwner = await benchUser(smallPool, hash);
    const smallFoods = await loadDemoFoods(smallDb, demoFoodCodes(cropTable));
    const alone = await smallDb.transaction((tx) => writeHousehold(tx, { ...SMALL, anchor, cropTable, foods: smallFoods }, smallFoods, smallOwner));

    const data: BenchData = {
      layout: DATA_LAYOUT,
      anchor,
      url,
      smallUrl,
      heavyId: heavy.written.householdId,
      smallId: small.written.householdId,
      smallAloneId: alone.written.householdId,
      services: SERVICE_HOUSEHOLDS,
      counts: { harvests: heavy.written.harvests, purchases: heavy.written.purchases, crops: heavy.data.crops.length, people: heavy.data.people.length },
    };
    mkdirSync(resolve(markerPath(), '..'), { recursive: true });
    writeFileSync(markerPath(), JSON.stringify(data, null, 2) + '\n');
    return data;
  } finally {
    await pool.end();
    await smallPool.end();
  }
}

if (isMain(import.meta.url)) {
  loadDotEnv();
  const t = Date.now();
  makeBenchData().then(
    (d) => {
      console.log(`• bench data ready in ${((Date.now() - t) / 1000).toFixed(0)} s (anchor ${d.anchor}); ${markerPath()}`);
      process.exit(0);
    },
    (e: unknown) => {
      console.error(e);
      process.exit(1);
    },
  );
}
