/**
 * npm run test:cluster: the app as a hosted Selfsown runs it — two built app servers on a three-node
 * MariaDB Galera cluster on loopback — and the tests in tests/cluster/ against it (growers writing
 * through both servers while a node is killed and rejoins, sessions and limits shared, conflicting
 * writes, the monthly letter sent once). Installs galera-4 when missing; everything it starts is
 * stopped at the end, on failure and on Ctrl-C, and the nodes' data is removed after a passing run.
 * Bounded: the whole command gives up after 10 minutes.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, openSync, readdirSync, rmSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { spawn, type ChildProcess } from 'node:child_process';
import { migrateDatabase } from '@/db/migrate';
import { createPool } from '@/db/client';
import { builtinDataset } from '@/server/builtin-datasets';
import { childEnv, clusterDataDir, loadDotEnv, outDir as buildDir, testRunConfig } from '@/server/config';
import { importDataset } from '@/server/food-import';
import { clusterLayout, initCluster, layoutJson, rootConnection, startCluster, stopCluster, type GaleraCluster } from './galera';
import { startMailFake, type MailFake } from './mail-fake';
import { run, stopService, waitForHttp } from './processes';

const LIMIT_MS = 10 * 60_000;
const DATABASE = 'selfsown_test_cluster';
const USER = 'selfsown';
const PASSWORD = 'selfsown-cluster';

const root = process.cwd();
const bin = (name: string) => resolve(root, 'node_modules', '.bin', name);
const lap = (t0: number) => `${((Date.now() - t0) / 1000).toFixed(1)} s`;

/** The newest modification time under `dir` (files only), for "is the build older than the code?". */
function newest(dir: string): number {
  let latest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = resolve(dir, entry.name);
    latest = Math.max(latest, entry.isDirectory() ? newest(path) : statSync(path).mtimeMs);
  }
  return latest;
}

/** True when the build in `out` is newer than src/, public/ and the lock file (as after `npm test`). */
function buildIsFresh(out: string): boolean {
  const entry = resolve(out, 'server', 'entry.mjs');
  if (!existsSync(entry)) return false;
  const built = statSync(entry).mtimeMs;
  return built > Math.max(newest(resolve(root, 'src')), newest(resolve(root, 'public')), statSync(resolve(root, 'package-lock.json')).mtimeMs, statSync(resolve(root, 'astro.config.mjs')).mtimeMs);
}

/** The database and its user, created on node 1 (Galera replicates both to the others). */
async function createDatabase(cluster: GaleraCluster): Promise<void> {
  const c = await rootConnection(cluster.nodes[0]!);
  if (!c) throw new Error('node 1 does not answer');
  try {
    await c.query(`CREATE DATABASE \`${DATABASE}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    for (const host of ['127.0.0.1', 'localhost']) {
      await c.query('CREATE USER ?@? IDENTIFIED BY ?', [USER, host, PASSWORD]);
      await c.query(`GRANT ALL PRIVILEGES ON \`${DATABASE}\`.* TO ?@?`, [USER, host]);
    }
  } finally {
    await c.end();
  }
}

/** DATABASE_URL listing the nodes, `first` (1-based) first and the others after it. */
function urlFrom(cluster: GaleraCluster, first: number): string {
  const n = cluster.nodes.length;
  const order = cluster.nodes.map((_, i) => cluster.nodes[(first - 1 + i) % n]!);
  return `mysql://${USER}:${PASSWORD}@${order.map((x) => `127.0.0.1:${x.port}`).join(',')}/${DATABASE}`;
}

/** Noon UTC on the 2nd of the current month, as ISO 8601. */
function lettersDueAt(): string {
  const d = new Date();
  return new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 2, 12)).toISOString();
}

/** A built app server with its output in `logFile`, in its own process group. */
function startApp(env: NodeJS.ProcessEnv, logFile: string): ChildProcess {
  const out = openSync(logFile, 'a');
  return spawn('node', [resolve(buildDir(root), 'server/entry.mjs')], { env, detached: true, stdio: ['ignore', out, out] });
}

async function main(): Promise<number> {
  loadDotEnv();
  const started = Date.now();
  const { port } = testRunConfig();
  const base = clusterDataDir(root);
  const cluster = clusterLayout(base, Number(port) + 1);
  const appPorts = [Number(port) + 4, Number(port) + 5];
  // Beside npm test's own fake (TEST_PORT + 10000), so the two commands may run side by side.
  const smtpPort = Number(port) + 10001;
  const apps: ChildProcess[] = [];
  let mail: MailFake | null = null;
  let tornDown = false;

  const teardown = async () => {
    if (tornDown) return;
    tornDown = true;
    for (const a of apps) await stopService(a).catch(() => undefined);
    await mail?.close().catch(() => undefined);
    await stopCluster(cluster);
  };
  const interrupted = (signal: string) => {
    console.log(`\n• ${signal}: stopping the app servers and the cluster`);
    void teardown().then(() => process.exit(130));
  };
  process.once('SIGINT', () => interrupted('SIGINT'));
  process.once('SIGTERM', () => interrupted('SIGTERM'));
  const deadline = setTimeout(() => {
    console.error(`test:cluster: over ${LIMIT_MS / 60_000} minutes; giving up`);
    void teardown().then(() => process.exit(1));
  }, LIMIT_MS);
  deadline.unref();

  let ok = false;
  try {
    console.log('━━ cluster ━━');
    initCluster(cluster);
    await startCluster(cluster);
    console.log(`• three Galera nodes synced on 127.0.0.1:${cluster.nodes.map((n) => n.port).join(', ')} (${lap(started)})`);
    await createDatabase(cluster);
    await migrateDatabase(urlFrom(cluster, 1));
    // One built-in dataset (IFCT 2017, ~550 foods) is enough for food-matched crops and letters.
    const ifct = builtinDataset('ifct2017')!;
    const { foods, amounts } = ifct.load();
    const pool = createPool(urlFrom(cluster, 1));
    try {
      await importDataset(pool, ifct.info, foods, amounts);
    } finally {
      await pool.end();
    }
    console.log(`• migrated and loaded ${foods.length} reference foods through node 1 (${lap(started)})`);

    const out = buildDir(root);
    if (buildIsFresh(out)) console.log(`• reusing the build in ${out}`);
    else if ((await run(bin('astro'), ['build'], childEnv())) !== 0) throw new Error('astro build failed');

    const mailDir = resolve(base, 'mail');
    mail = await startMailFake({ port: smtpPort, dir: mailDir });
    const publicOrigin = `http://127.0.0.1:${appPorts[0]}`;
    const secret = randomBytes(32).toString('base64url');
    const appEnv = (i: number) =>
      childEnv({
        // Server A prefers node 1, server B node 2; each fails over to the others in turn.
        DATABASE_URL: urlFrom(cluster, i + 1),
        HOST: '127.0.0.1',
        PORT: String(appPorts[i]),
        // Both stand behind one public address (a proxy's): the same origin and the same secret.
        PUBLIC_ORIGIN: publicOrigin,
        BETTER_AUTH_SECRET: secret,
        NODE_ENV: 'production',
        SMTP_URL: '',
        FAKE_SMTP_PORT: String(smtpPort),
        MAIL_DIR: mailDir,
        AUTH_RATE_LIMIT: '100000/60',
        AUTH_SIGNUP_RATE_LIMIT: '100000/60',
        AUTH_RESET_RATE_LIMIT: '1000/60',
        AUTH_SIGNIN_RATE_LIMIT: '3/60',
        AUTH_ACCOUNT_SIGNIN_RATE_LIMIT: '4/60',
        // Both servers run the letter job at the same instants (every 10 s) to race for each letter.
        LETTERS_SCHEDULER: 'on',
        LETTERS_SCHEDULE: '*/10 * * * * *',
        // The 2nd of this month: last month's letters are due whatever today's date (due on days 1–7).
        LETTERS_NOW: lettersDueAt(),
      });
    const logs = [resolve(base, 'app-a.log'), resolve(base, 'app-b.log')];
    for (const i of [0, 1]) apps.push(startApp(appEnv(i), logs[i]!));
    for (const [i, a] of apps.entries()) await waitForHttp(`http://127.0.0.1:${appPorts[i]}/`, 60_000, a);
    console.log(`• app servers A on :${appPorts[0]} (node 1 first) and B on :${appPorts[1]} (node 2 first) (${lap(started)})`);

    console.log('\n━━ cluster tests ━━');
    const code = await run(bin('vitest'), ['run', '--config', 'tests/vitest.config.ts', '--project', 'cluster'], {
      ...appEnv(0),
      TEST_BASE_URL: publicOrigin,
      TEST_DATABASE_URL: urlFrom(cluster, 1),
      CLUSTER_APP_URLS: appPorts.map((p) => `http://127.0.0.1:${p}`).join(','),
      CLUSTER_APP_LOGS: logs.join(','),
      CLUSTER_LAYOUT: layoutJson(cluster),
    });
    ok = code === 0;
  } catch (e) {
    console.error(`test:cluster: ${e instanceof Error ? e.stack ?? e.message : String(e)}`);
  } finally {
    await teardown();
    clearTimeout(deadline);
  }
  if (ok) rmSync(base, { recursive: true, force: true });
  else console.log(`• the nodes' and servers' logs are kept in ${base}`);
  console.log(`${ok ? 'PASS' : 'FAIL'}  test:cluster in ${lap(started)}`);
  return ok ? 0 : 1;
}

main().then(
  (code) => process.exit(code),
  (e: unknown) => {
    console.error(`test:cluster: ${e instanceof Error ? e.stack ?? e.message : String(e)}`);
    process.exit(1);
  },
);
