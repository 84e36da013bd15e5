/**
 * npm test: brings up the private MariaDB and a fresh test database (selfsown_test), loads the
 * reference foods, builds the app, serves it on a test port and runs unit, integration and e2e
 * tests against it, then the load stage (50 growers for 60 s against that server) and the faults
 * stage (its own MariaDB, killed and restarted, and its own app servers: src/cli/test-faults.ts).
 * Exits non-zero on any failure and ends with a summary.
 */
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { childEnv, loadDotEnv, outDir as buildDir, parseDatabaseUrl, testDatabaseUrl, serverNodeFlags, testRunConfig } from '@/server/config';
import { migrateDatabase } from '@/db/migrate';
import { recreateDatabase, serverPaths, stopServer } from './mariadb';
import { dbUp } from './db';
import { importFoods } from './import-foods';
import { startMailFake } from './mail-fake';
import { run, startService, stopService, waitForHttp } from './processes';
import { ensureProgram } from './system';
import { withFaultsDatabase } from './test-faults';

interface Stage {
  name: string;
  passed: number;
  failed: number;
  skipped: number;
  ok: boolean;
  seconds: number;
}

const root = process.cwd();
const outDir = buildDir(root);
/**
 * Developer shortcuts: TEST_STAGES=unit,integration,e2e,load,faults picks stages; TEST_FILES=a,b narrows files.
 * These and the report folder are read from the shell's environment, before `.env` is loaded.
 */
const { stages: wanted, files, port: portBeforeDotEnv } = testRunConfig();
const reports = resolve(root, '.data', `test-reports-${portBeforeDotEnv}`);
const bin = (name: string) => resolve(root, 'node_modules', '.bin', name);

function vitestCounts(file: string): { passed: number; failed: number; skipped: number } {
  if (!existsSync(file)) return { passed: 0, failed: 0, skipped: 0 };
  const r = JSON.parse(readFileSync(file, 'utf8')) as { numPassedTests: number; numFailedTests: number; numPendingTests: number; numTodoTests: number };
  return { passed: r.numPassedTests, failed: r.numFailedTests, skipped: r.numPendingTests + r.numTodoTests };
}

function playwrightCounts(file: string): { passed: number; failed: number; skipped: number } {
  if (!existsSync(file)) return { passed: 0, failed: 0, skipped: 0 };
  const r = JSON.parse(readFileSync(file, 'utf8')) as { stats: { expected: number; unexpected: number; flaky: number; skipped: number } };
  if (r.stats.flaky > 0) console.log(`• ${r.stats.flaky} e2e test(s) passed only on their retry (flaky): see the list above`);
  return { passed: r.stats.expected + r.stats.flaky, failed: r.stats.unexpected, skipped: r.stats.skipped };
}

async function stage(name: string, fn: () => Promise<{ code: number; counts?: { passed: number; failed: number; skipped: number } }>): Promise<Stage> {
  const t0 = Date.now();
  console.log(`\n━━ ${name} ━━`);
  const { code, counts } = await fn();
  const c = counts ?? { passed: 0, failed: 0, skipped: 0 };
  // A runner that fails without counting a failure (crash, no tests found) still fails the stage.
  const ok = code === 0 && c.failed === 0;
  return { name, ...c, failed: ok ? c.failed : Math.max(c.failed, 1), ok, seconds: (Date.now() - t0) / 1000 };
}

const filesFor = (dir: string) => files.filter((f) => f.includes(dir));

type Counts = { passed: number; failed: number; skipped: number };

/** Vitest's project `project` over `dir` (or the TEST_FILES in it), its counts read from its JSON report. */
async function vitestRun(project: string, dir: string, report: string, env: NodeJS.ProcessEnv): Promise<{ code: number; counts: Counts }> {
  const out = resolve(reports, `${report}.json`);
  const chosen = filesFor(dir);
  const code = await run(bin('vitest'), ['run', '--config', 'tests/vitest.config.ts', '--project', project, '--reporter=default', '--reporter=json', `--outputFile.json=${out}`, ...(chosen.length ? chosen : [dir])], env);
  return { code, counts: vitestCounts(out) };
}

/** The faults stage: the Vitest file (database killed, app restarted) and the browser's queue over a restart (Playwright). */
async function faultsStage(port: string, testUrl: string, env: NodeJS.ProcessEnv): Promise<{ code: number; counts: Counts }> {
  return withFaultsDatabase(port, testUrl, async (faultsEnv) => {
    const stageEnv = { ...env, ...faultsEnv };
    const chosen = files.length ? files.filter((f) => f.includes('tests/faults/')) : [];
    const api = chosen.length && !chosen.some((f) => f.endsWith('.test.ts')) ? { code: 0, counts: { passed: 0, failed: 0, skipped: 0 } } : await vitestRun('faults', 'tests/faults/', 'faults', stageEnv);
    let browser = { code: 0, counts: { passed: 0, failed: 0, skipped: 0 } };
    if (!chosen.length || chosen.some((f) => f.endsWith('.spec.ts'))) {
      const out = resolve(reports, 'faults-e2e.json');
      const code = await run(bin('playwright'), ['test', '--config', 'tests/faults/playwright.config.ts', ...chosen.filter((f) => f.endsWith('.spec.ts'))], { ...stageEnv, PLAYWRIGHT_JSON_OUTPUT_NAME: out });
      browser = { code, counts: playwrightCounts(out) };
    }
    return {
      code: api.code || browser.code,
      counts: { passed: api.counts.passed + browser.counts.passed, failed: api.counts.failed + browser.counts.failed, skipped: api.counts.skipped + browser.counts.skipped },
    };
  });
}

async function main(): Promise<number> {
  loadDotEnv();
  const { port, smtpPort } = testRunConfig();
  const started = Date.now();
  const testUrl = testDatabaseUrl();
  const baseUrl = `http://127.0.0.1:${port}`;
  const paths = serverPaths();
  const wasRunning = existsSync(paths.pidFile);
  rmSync(reports, { recursive: true, force: true });
  mkdirSync(reports, { recursive: true });

  ensureProgram('chromium', 'chromium');
  console.log('━━ set-up ━━');
  await dbUp(testUrl);
  await recreateDatabase(paths, parseDatabaseUrl(testUrl));
  await migrateDatabase(testUrl);
  const importStart = Date.now();
  await importFoods(testUrl);
  console.log(`• reference foods imported into the test database in ${((Date.now() - importStart) / 1000).toFixed(1)} s`);

  // The test run's own fake SMTP server and outbox, derived from TEST_PORT so parallel runs do not clash.
  const mailDir = resolve(root, '.data', `test-mail-${port}`);
  rmSync(mailDir, { recursive: true, force: true });
  const mailFake = await startMailFake({ port: smtpPort, dir: mailDir });
  console.log(`• fake SMTP on 127.0.0.1:${smtpPort}, mail in ${mailDir}`);

  // And its own folder for dataset uploads, so a test can watch a file arrive.
  const uploadDir = resolve(root, '.data', `test-uploads-${port}`);
  rmSync(uploadDir, { recursive: true, force: true });

  const env = childEnv({
    // Always the fake, whatever .env says: tests never send real mail.
    SMTP_URL: '',
    FAKE_SMTP_PORT: String(smtpPort),
    MAIL_DIR: mailDir,
    UPLOAD_DIR: uploadDir,
    // Generous limits so many test users can sign up; sign-in keeps a small limit with a short
    // window (the rate-limit test connects from its own loopback address, 127.0.0.x).
    AUTH_RATE_LIMIT: '100000/60',
    AUTH_SIGNUP_RATE_LIMIT: '100000/60',
    AUTH_RESET_RATE_LIMIT: '1000/60',
    AUTH_SIGNIN_RATE_LIMIT: '5/2',
    AUTH_ACCOUNT_SIGNIN_RATE_LIMIT: '8/3',
    DATABASE_URL: testUrl,
    TEST_DATABASE_URL: testUrl,
    HOST: '127.0.0.1',
    PORT: port,
    PUBLIC_ORIGIN: baseUrl,
    TEST_BASE_URL: baseUrl,
    NODE_ENV: 'production',
    SELFSOWN_ALLOW_DEV_SECRET: '1',
    // The server under test runs no hourly letter job: the letter tests run the CLI themselves.
    LETTERS_SCHEDULER: 'off',
  });

  const stages: Stage[] = [];
  if (wanted.has('unit')) stages.push(
    await stage('unit tests', async () => {
      const out = resolve(reports, 'unit.json');
      const code = await run(bin('vitest'), ['run', '--config', 'tests/vitest.config.ts', '--project', 'unit', '--reporter=default', '--reporter=json', `--outputFile.json=${out}`, ...filesFor('unit')], env);
      return { code, counts: vitestCounts(out) };
    }),
  );

  const build = await stage('build', async () => ({ code: await run(bin('astro'), ['build'], env) }));
  stages.push(build);
  if (build.ok) {
    const server = startService('node', [...serverNodeFlags(), resolve(outDir, 'server/entry.mjs')], env, true);
    try {
      await waitForHttp(`${baseUrl}/`, 30_000, server);
      if (wanted.has('integration')) stages.push(
        await stage('integration tests (MariaDB + built server)', async () => {
          const out = resolve(reports, 'integration.json');
          const code = await run(bin('vitest'), ['run', '--config', 'tests/vitest.config.ts', '--project', 'integration', '--reporter=default', '--reporter=json', `--outputFile.json=${out}`, ...filesFor('integration')], env);
          return { code, counts: vitestCounts(out) };
        }),
      );
      if (wanted.has('e2e')) stages.push(
        await stage('e2e tests (Playwright, Debian Chromium)', async () => {
          const out = resolve(reports, 'e2e.json');
          const code = await run(bin('playwright'), ['test', '--config', 'tests/playwright.config.ts', ...filesFor('e2e')], { ...env, PLAYWRIGHT_JSON_OUTPUT_NAME: out });
          return { code, counts: playwrightCounts(out) };
        }),
      );
      if (wanted.has('load')) stages.push(await stage('load (50 growers for 60 s, built server)', () => vitestRun('faults', 'tests/load/', 'load', env)));
    } finally {
      await stopService(server);
    }
    if (wanted.has('faults')) stages.push(await stage('faults (MariaDB killed, app restarted)', () => faultsStage(port, testUrl, env)));
  }
  await mailFake.close();
  if (!wasRunning) await stopServer(paths);

  const total = stages.reduce((a, s) => ({ passed: a.passed + s.passed, failed: a.failed + s.failed, skipped: a.skipped + s.skipped }), { passed: 0, failed: 0, skipped: 0 });
  console.log('\n━━ summary ━━');
  for (const s of stages) {
    console.log(`${s.ok ? 'PASS' : 'FAIL'}  ${s.name.padEnd(44)} ${String(s.passed).padStart(4)} passed ${String(s.failed).padStart(3)} failed  ${s.seconds.toFixed(1)} s`);
  }
  console.log(`time: ${((Date.now() - started) / 1000).toFixed(0)} s`);
  const allOk = stages.every((s) => s.ok) && total.passed > 0;
  console.log(`${total.passed} passed, ${total.failed} failed, ${total.skipped} skipped`);
  return allOk ? 0 : 1;
}

main().then(
  (code) => process.exit(code),
  (e: unknown) => {
    console.error(`test: ${e instanceof Error ? e.stack ?? e.message : String(e)}`);
    console.log('0 passed, 1 failed');
    process.exit(1);
  },
);
