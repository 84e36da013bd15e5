/**
 * npm run bench: the planting planner (./plan.ts), then the share report against the bare SQL
 * aggregate it rests on (BENCH_ONLY=plan skips the database part), measured side by side in one
 * run (ratios, not absolute times, since shared machines drift). Uses its own database, selfsown_bench, on the private MariaDB server; never the demo or test data.
 */
import { performance } from 'node:perf_hooks';
import type { Pool } from 'mysql2/promise';
import { createPool } from '@/db/client';
import { migrateDatabase } from '@/db/migrate';
import { loadDotEnv, parseDatabaseUrl, testDatabaseUrl } from '@/server/config';
import { dbUp } from '@/cli/db';
import { importFoods } from '@/cli/import-foods';
import { recreateDatabase, serverPaths } from '@/cli/mariadb';
import { householdShare } from '@/server/share-data';
import { benchPlan } from './plan';

const YEARS = Number(process.env.BENCH_YEARS || 10);
const HARVESTS_PER_YEAR = Number(process.env.BENCH_HARVESTS_PER_YEAR || 3000);
const PURCHASES_PER_YEAR = Number(process.env.BENCH_PURCHASES_PER_YEAR || 400);
const ROUNDS = Number(process.env.BENCH_ROUNDS || 15);

// Synthetic load only (timing, never an oracle): common garden foods by SR28 code.
const CROP_CODES = ['11352', '11485', '20014', '16042', '11233', '09003', '01123', '11124', '11529', '11205'];
const BOUGHT_CODES = ['20081', '04053', '19335', '01077', '20044'];
const USES = ['fresh', 'fresh', 'fresh', 'stored', 'preserved', 'seed', 'given', 'sold', 'lost'];

/** A deterministic pseudo-random sequence, so every run loads the same rows. */
function rng(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32);
}

async function seed(pool: Pool): Promise<{ householdId: number; from: string; to: string }> {
  const [h] = await pool.query("INSERT INTO households (name, timezone, units) VALUES ('Bench household', 'UTC', 'metric')");
  const householdId = (h as { insertId: number }).insertId;
  const [foods] = await pool.query('SELECT id, code FROM foods WHERE code IN (?)', [[...CROP_CODES, ...BOUGHT_CODES]]);
  const idOf = new Map((foods as { id: number; code: string }[]).map((f) => [f.code, f.id]));
  const cropIds: { id: number; foodId: number }[] = [];
  for (const code of CROP_CODES) {
    const [c] = await pool.query("INSERT INTO crops (household_id, name, food_id, category) VALUES (?, ?, ?, 'other')", [householdId, `Crop ${code}`, idOf.get(code)]);
    cropIds.push({ id: (c as { insertId: number }).insertId, foodId: idOf.get(code)! });
  }
  const r = rng(42);
  const firstYear = 2026 - YEARS + 1;
  const harvests: unknown[][] = [];
  const purchases: unknown[][] = [];
  for (let y = firstYear; y <= 2026; y++) {
    for (let i = 0; i < HARVESTS_PER_YEAR; i++) {
      const crop = cropIds[Math.floor(r() * cropIds.length)]!;
      const use = USES[Math.floor(r() * USES.length)]!;
      const grams = 100 + Math.floor(r() * 5000);
      const date = `${y}-${String(1 + Math.floor(r() * 12)).padStart(2, '0')}-${String(1 + Math.floor(r() * 28)).padStart(2, '0')}`;
      const spread = use === 'stored' || use === 'preserved' ? 1 + Math.floor(r() * 12) : 1;
      harvests.push([householdId, crop.id, crop.foodId, date, grams, 'g', grams, grams * 0.8, use, spread]);
    }
    for (let i = 0; i < PURCHASES_PER_YEAR; i++) {
      const code = BOUGHT_CODES[Math.floor(r() * BOUGHT_CODES.length)]!;
      const grams = 500 + Math.floor(r() * 20000);
      const date = `${y}-${String(1 + Math.floor(r() * 12)).padStart(2, '0')}-${String(1 + Math.floor(r() * 28)).padStart(2, '0')}`;
      purchases.push([householdId, idOf.get(code), date, grams, 'g', grams, grams, 1 + Math.floor(r() * 6)]);
    }
  }
  for (let i = 0; i < harvests.length; i += 2000) {
    await pool.query('INSERT INTO harvests (household_id, crop_id, food_id, date, quantity, unit, grams, edible_grams, `use`, spread_months) VALUES ?', [harvests.slice(i, i + 2000)]);
  }
  await pool.query('INSERT INTO purchases (household_id, food_id, date, quantity, unit, grams, edible_grams, spread_months) VALUES ?', [purchases]);
  await pool.query("INSERT INTO people (household_id, name, sex, age_years) VALUES (?, 'A', 'female', 40), (?, 'B', 'male', 42)", [householdId, householdId]);
  console.log(`• seeded ${harvests.length} harvests and ${purchases.length} purchases over ${YEARS} years`);
  return { householdId, from: `${firstYear}-01`, to: '2026-12' };
}

/** The bare aggregate the report rests on: the same grouping of entries, with no further work. */
async function bareAggregate(pool: Pool, householdId: number, from: string, to: string): Promise<number> {
  const [a] = await pool.query(
    `SELECT DATE_FORMAT(h.date, '%Y-%m') AS m, h.use, h.spread_months, h.crop_id, h.food_id, SUM(h.edible_grams) AS g
       FROM harvests h WHERE h.household_id = ? AND h.date BETWEEN ? AND ?
      GROUP BY m, h.use, h.spread_months, h.crop_id, h.food_id`,
    [householdId, `${from}-01`, `${to}-31`],
  );
  const [b] = await pool.query(
    `SELECT DATE_FORMAT(p.date, '%Y-%m') AS m, p.spread_months, p.food_id, SUM(p.edible_grams) AS g
       FROM purchases p WHERE p.household_id = ? AND p.date BETWEEN ? AND ?
      GROUP BY m, p.spread_months, p.food_id`,
    [householdId, `${from}-01`, `${to}-31`],
  );
  return (a as unknown[]).length + (b as unknown[]).length;
}

const median = (xs: number[]) => [...xs].sort((x, y) => x - y)[Math.floor(xs.length / 2)]!;

async function main(): Promise<void> {
  loadDotEnv();
  await benchPlan(ROUNDS);
  if (process.env.BENCH_ONLY === 'plan') return;
  const url = testDatabaseUrl().replace(/\/[A-Za-z0-9_]+$/, '/selfsown_bench');
  process.env.DATABASE_URL = url; // the shared client (people) reads the same database
  await dbUp(url);
  await recreateDatabase(serverPaths(), parseDatabaseUrl(url));
  await migrateDatabase(url);
  await importFoods(url);
  const pool = createPool(url);
  try {
    const { householdId, from, to } = await seed(pool);
    // Records from the start of the seeded range, so every month is counted as before issue 9.
    const household = { id: householdId, timezone: 'UTC', createdAt: new Date(`${from}-01T00:00:00Z`), recordsSince: from };
    for (const [label, f] of [['10 years', from], ['12 months', '2026-01']] as const) {
      const bare: number[] = [];
      const report: number[] = [];
      await bareAggregate(pool, householdId, f, to); // warm both paths once
      await householdShare(household, f, to, pool);
      for (let i = 0; i < ROUNDS; i++) {
        let t = performance.now();
        await bareAggregate(pool, householdId, f, to);
        bare.push(performance.now() - t);
        t = performance.now();
        await householdShare(household, f, to, pool);
        report.push(performance.now() - t);
      }
      console.log(`share report over ${label}, median of ${ROUNDS} alternating rounds:`);
      console.log(`  bare SQL grouping   ${median(bare).toFixed(1)} ms`);
      console.log(`  householdShare()    ${median(report).toFixed(1)} ms`);
      console.log(`  ratio report / bare ${(median(report) / median(bare)).toFixed(2)}×`);
    }
  } finally {
    await pool.end();
  }
}

main().then(
  () => process.exit(0),
  (e: unknown) => {
    console.error(e);
    process.exit(1);
  },
);
