/**
 * `npm run backup` and `npm run restore <file>` as real processes: a backup of the test database
 * restored into a fresh database gives a second app server the same share report for a household
 * (its session too: the accounts are in the backup).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import mysql from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outDir } from '@/server/config';
import { startService, stopService, waitForHttp } from '@/cli/processes';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { BASE_URL, TEST_DB_URL } from '../support/env';
import { apiAs, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

const RESTORED_URL = `${TEST_DB_URL}_restored`;
const dir = mkdtempSync(join(tmpdir(), 'selfsown-backup-'));
const port = Number(new URL(BASE_URL).port) + 8;

function cli(script: string, args: string[], databaseUrl: string) {
  const r = spawnSync(resolve('node_modules/.bin/tsx'), [`src/cli/${script}.ts`, ...args], { env: { ...process.env, DATABASE_URL: databaseUrl }, encoding: 'utf8' });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

/** Drops the restored copy (the app user holds its grants once a restore has created it). */
async function dropRestored() {
  const c = await mysql.createConnection(TEST_DB_URL);
  try {
    await c.query(`DROP DATABASE IF EXISTS \`${new URL(RESTORED_URL).pathname.slice(1)}\``);
  } catch {
    // Never restored into yet: nothing to drop, and no grant to drop it with.
  } finally {
    await c.end();
  }
}

let owner: TestUser;
let hid: number;
beforeAll(async () => {
  owner = await newVerifiedUser({ name: 'Careful keeper' });
  hid = (await createHousehold(owner.cookie, { name: 'Backed-up plot' })).id;
  const potato = await foodId('11352'); // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
  const crop = await makeCrop(owner.cookie, hid, { name: 'Potato', category: 'root_tuber', foodId: potato });
  await logHarvest(owner.cookie, hid, { date: '2026-09-01', cropId: crop.id, quantity: 40, unit: 'kg', use: 'stored', spreadMonths: 6 });
  await logHarvest(owner.cookie, hid, { date: '2026-08-10', cropId: crop.id, quantity: 2.5, unit: 'kg', note: 'earlies\nfirst row' });
  expect((await apiAs(owner.cookie, 'POST', `/api/households/${hid}/purchases`, { date: '2026-09-05', foodId: await foodId('20081'), quantity: 16, unit: 'kg', spreadMonths: 4 })).status).toBe(201); // NDB 20081 wheat flour
  expect((await apiAs(owner.cookie, 'POST', `/api/households/${hid}/people`, { name: 'Eater', sex: 'female', ageYears: 40 })).status).toBe(201);
});

afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  await dropRestored();
});

describe('npm run backup / npm run restore', () => {
  it('refuses a restore without a file, or of a file that is not there', () => {
    const none = cli('restore', [], RESTORED_URL);
    expect(none.code).toBe(2);
    expect(none.err).toMatch(/which backup\?/);
    const missing = cli('restore', [join(dir, 'nope.sql')], RESTORED_URL);
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/there is no file/);
  });

  it('restores a backup into a fresh database that gives the same share report', async () => {
    const made = cli('backup', ['--dir', dir], TEST_DB_URL);
    expect(made.code, made.err).toBe(0);
    const file = /written to (\S+\.sql)/.exec(made.out)?.[1];
    expect(file).toMatch(/selfsown-\d{8}-\d{6}\.sql$/);
    expect(statSync(file!).size).toBeGreaterThan(1000);
    expect(statSync(file!).mode & 0o077).toBe(0); // readable by its owner only

    await dropRestored();
    const restored = cli('restore', [file!], RESTORED_URL);
    expect(restored.code, restored.err).toBe(0);
    expect(restored.out).toMatch(/restored \d+ tables/);

    const period = 'from=2026-08&to=2027-01';
    const original = await apiAs(owner.cookie, 'GET', `/api/households/${hid}/share?${period}`);
    expect(original.status).toBe(200);
    const server = startService('node', [resolve(outDir(), 'server/entry.mjs')], { ...process.env, DATABASE_URL: RESTORED_URL, PORT: String(port), HOST: '127.0.0.1', PUBLIC_ORIGIN: `http://127.0.0.1:${port}`, LETTERS_SCHEDULER: 'off' }, true);
    try {
      await waitForHttp(`http://127.0.0.1:${port}/`, 30_000, server);
      const copy = await fetch(`http://127.0.0.1:${port}/api/households/${hid}/share?${period}`, { headers: { cookie: owner.cookie } });
      expect(copy.status).toBe(200);
      expect(await copy.json()).toEqual(original.body);
      const harvests = await fetch(`http://127.0.0.1:${port}/api/households/${hid}/harvests`, { headers: { cookie: owner.cookie } });
      expect(((await harvests.json()) as any).harvests.map((h: any) => h.note)).toContain('earlies\nfirst row');
    } finally {
      await stopService(server);
    }
  });

  it('refuses to restore over a database that holds tables the backup does not', async () => {
    const made = cli('backup', ['--dir', dir], TEST_DB_URL);
    const file = /written to (\S+\.sql)/.exec(made.out)![1]!;
    const c = await mysql.createConnection(RESTORED_URL);
    await c.query('CREATE TABLE IF NOT EXISTS from_a_newer_version (id INT PRIMARY KEY)');
    await c.end();
    const r = cli('restore', [file], RESTORED_URL);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/from_a_newer_version/);
    expect(existsSync(file)).toBe(true);
  });
});
