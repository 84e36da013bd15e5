/**
 * npm run bench — the hot paths against the limits of the stack, measured side by side in one run
 * (ratios, since absolute times drift on shared machines), never part of the test suite. Uses its
 * own databases on the private MariaDB (selfsown_bench, selfsown_bench_small, selfsown_bench_foods,
 * or BENCH_DATABASE and its _small and _foods; made by ./data.ts when missing) and the BUILT app (`astro build` first unless BENCH_NO_BUILD=1),
 * started on free loopback ports. Prints a table and writes .data/bench/latest.json (.data/bench/<BENCH_DATABASE>/ for another name) as
 * [{ name, value, baseline, ratio, target, pass }], each the median of alternating rounds.
 *
 * Rows: share-10y, share-12m, share-growth, share-service (./share.ts), search (./search.ts),
 * import-foods, import-csv (./imports.ts), load, rss (./load.ts), plan (./plan.ts).
 * BENCH_ONLY=plan,share,… runs some of them; BENCH_ROUNDS (default 15), BENCH_IMPORT_ROUNDS (3),
 * BENCH_LOAD_ROUNDS (3) and BENCH_LOAD_SECONDS (20) size the rounds; BENCH_FRESH=1 remakes the data.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { availableParallelism, totalmem } from 'node:os';
import { resolve } from 'node:path';
import { createPool } from '@/db/client';
import { migrateDatabase } from '@/db/migrate';
import { run } from '@/cli/processes';
import { childEnv, loadDotEnv } from '@/server/config';
import { BENCH_EMAIL, BENCH_PASSWORD, benchDir, benchUrls, existingData, makeBenchData } from './data';
import { benchImportCsv, benchImportFoods } from './imports';
import { benchLoad } from './load';
import { benchPlan } from './plan';
import type { BenchRow } from './rows';
import { benchSearch } from './search';
import { startBenchServer } from './server';
import { benchShare } from './share';

const ROUNDS = Number(process.env.BENCH_ROUNDS || 15);
const IMPORT_ROUNDS = Number(process.env.BENCH_IMPORT_ROUNDS || 3);
const LOAD_ROUNDS = Number(process.env.BENCH_LOAD_ROUNDS || 3);
const only = new Set((process.env.BENCH_ONLY || 'plan,share,search,import-foods,import-csv,load').split(',').map((s) => s.trim()));

const fmt = (n: number | null) => (n === null ? '—' : Math.abs(n) >= 100 ? n.toFixed(0) : n.toFixed(2));
const UNITS: Record<string, string> = { 'share-growth': '×', load: 'req/s', rss: 'MB' };

function printTable(rows: BenchRow[]): void {
  console.log('\nname           value (unit)        baseline     ratio   target                          pass');
  for (const r of rows) {
    const unit = UNITS[r.name] ?? 'ms';
    console.log(`${r.name.padEnd(14)} ${`${fmt(r.value)} ${unit}`.padEnd(19)} ${fmt(r.baseline).padStart(8)}  ${fmt(r.ratio).padStart(8)}   ${r.target.padEnd(31)} ${r.pass ? 'yes' : 'NO'}`);
  }
}

async function main(): Promise<void> {
  loadDotEnv();
  const rows: BenchRow[] = [];
  console.log(`bench on ${availableParallelism()} cores, ${(totalmem() / 2 ** 30).toFixed(0)} GB, Node ${process.version}, ${new Date().toISOString()}`);
  if (only.has('plan')) rows.push(await benchPlan(ROUNDS));

  const dbRows = ['share', 'search', 'import-foods', 'import-csv', 'load'].filter((r) => only.has(r));
  if (dbRows.length > 0) {
    let data = process.env.BENCH_FRESH === '1' ? null : await existingData();
    if (!data) data = await makeBenchData();
    else for (const url of [data.url, data.smallUrl]) await migrateDatabase(url);
    console.log(`• bench data of ${data.anchor}: heavy household ${data.counts.harvests} harvests, ${data.counts.purchases} purchases, ${data.counts.crops} crops, ${data.counts.people} people; ${data.services} service households`);
    if (process.env.BENCH_NO_BUILD !== '1' && (await run(resolve('node_modules', '.bin', 'astro'), ['build'], childEnv({ NODE_ENV: 'production' }))) !== 0) {
      throw new Error('astro build failed');
    }
    const account = { email: BENCH_EMAIL, password: BENCH_PASSWORD };
    const server = await startBenchServer(data.url, account);
    const smallServer = await startBenchServer(data.smallUrl, account);
    const pool = createPool(data.url);
    const smallPool = createPool(data.smallUrl);
    try {
      if (only.has('share')) rows.push(...(await benchShare({ server, smallServer, pool, smallPool, heavyId: data.heavyId, smallId: data.smallId, smallAloneId: data.smallAloneId, anchor: data.anchor, rounds: ROUNDS })));
      if (only.has('search')) rows.push(await benchSearch(server, pool));
      if (only.has('import-foods')) rows.push(await benchImportFoods(benchUrls().foodsUrl, IMPORT_ROUNDS));
      if (only.has('import-csv')) rows.push(await benchImportCsv(server, pool, data.heavyId, IMPORT_ROUNDS));
      if (only.has('load')) rows.push(...(await benchLoad(server, data.heavyId, LOAD_ROUNDS)));
    } finally {
      await pool.end();
      await smallPool.end();
      await server.stop();
      await smallServer.stop();
    }
  }
  printTable(rows);
  const latest = resolve(benchDir(), 'latest.json');
  mkdirSync(benchDir(), { recursive: true });
  writeFileSync(latest, JSON.stringify(rows, null, 2) + '\n');
  console.log(`\n• ${rows.filter((r) => r.pass).length} of ${rows.length} rows pass; ${latest}`);
}

main().then(
  () => process.exit(0),
  (e: unknown) => {
    console.error(e);
    process.exit(1);
  },
);
