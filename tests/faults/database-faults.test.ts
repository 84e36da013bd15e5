/**
 * Faults (issue 15), against the stage's private MariaDB and a built app server of its own:
 * - MariaDB killed (SIGKILL) in the middle of committing a 50,000-row harvest import: after the
 *   restart the household has every row or none, and the rollup agrees with the rows;
 * - while the database is down every request that needs it answers 503 `database_unavailable`
 *   with Retry-After (a page: the plain "back in a moment" page) within seconds, never a 500;
 * - the database back, the same app process answers again (its pool reconnects), no restart;
 * - the app server restarted: the same session cookie still works, and an Idempotency-Key sent
 *   before the restart replays its stored answer after it (nothing of either lives in the process).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiAs, createHousehold, newVerifiedUser, signIn, type TestUser } from '../support/users';
import { makeCrop, upload } from '../support/entries';
import { APP_BASE, privateDb, startApp, timed, type AppServer } from './harness';

const ROWS = 50_000;
/** Slowest answer allowed while the database is down: a refused connect is immediate, so this is generous. */
const DOWN_ANSWER_MS = 3_000;
const CROPS = ['Potato', 'Leek', 'Kale', 'Onion', 'Beetroot'];

let app: AppServer;
let owner: TestUser;
let hid: number;

/** 50,000 harvests over two past years, five crops, quantities with one decimal. */
function bigHarvestCsv(): string {
  const lines = ['Date,Crop,Quantity,Unit,Use'];
  const start = Date.UTC(2024, 0, 1);
  for (let i = 0; i < ROWS; i++) {
    const day = new Date(start + (i % 730) * 86_400_000).toISOString().slice(0, 10);
    lines.push(`${day},${CROPS[i % CROPS.length]},${((i % 97) + 1) / 10},kg,fresh`);
  }
  return lines.join('\n');
}

async function storedRows(householdId: number): Promise<{ harvests: number; rollupEntries: number; grams: number; rollupGrams: number }> {
  const [h] = await privateDb.query<{ n: number; g: number | null }[]>('SELECT COUNT(*) AS n, SUM(grams) AS g FROM harvests WHERE household_id = ?', [householdId]);
  const [r] = await privateDb.query<{ n: number | null; g: number | null }[]>('SELECT SUM(entries) AS n, SUM(grams) AS g FROM harvest_groups WHERE household_id = ?', [householdId]);
  return { harvests: Number(h!.n), rollupEntries: Number(r!.n ?? 0), grams: Number(h!.g ?? 0), rollupGrams: Number(r!.g ?? 0) };
}

function expectUnavailable(r: { status: number; body: any; headers: Headers }, what = '') {
  expect(r.status, `${what}: ${JSON.stringify(r.body)}`).toBe(503);
  expect(r.body.error.code).toBe('database_unavailable');
  expect(r.body.error.message).toMatch(/cannot reach its database/);
  expect(r.headers.get('retry-after')).toBe('5');
}

beforeAll(async () => {
  app = await startApp();
  owner = await newVerifiedUser({ name: 'Fay Fault' });
  const h = await createHousehold(owner.cookie, { name: 'Fault plot', timezone: 'Europe/London' });
  hid = h.id;
  for (const name of CROPS) await makeCrop(owner.cookie, hid, { name, foodId: null, category: 'other' });
});

afterAll(async () => {
  await privateDb.start();
  await app?.stop();
});

describe('MariaDB killed in the middle of a 50,000-row import', () => {
  it('keeps all rows or none, answers 503 while down, and the app recovers by itself', async () => {
    const csv = bigHarvestCsv();
    const watcher = await privateDb.connect();
    const t0 = performance.now();
    const answer = upload(owner.cookie, hid, { kind: 'harvests', mode: 'commit', csv });
    let early: unknown = null;
    void answer.then((r) => (early = r));
    // Wait until the import's open transaction has written a good part of its rows (read
    // uncommitted: the rows are not committed yet), then pull the plug.
    await watcher.query('SET SESSION TRANSACTION ISOLATION LEVEL READ UNCOMMITTED');
    let writtenAtKill = 0;
    for (;;) {
      const [rows] = await watcher.query('SELECT COUNT(*) AS n FROM harvests WHERE household_id = ?', [hid]);
      writtenAtKill = Number((rows as { n: number }[])[0]!.n);
      if (writtenAtKill >= ROWS / 10) break;
      if (early) throw new Error(`the import answered before it was cut: ${JSON.stringify(early).slice(0, 500)}`);
      if (performance.now() - t0 > 120_000) throw new Error('the import never started writing rows');
      await new Promise((r) => setTimeout(r, 10));
    }
    await privateDb.kill();
    watcher.destroy();
    const cut = await timed(() => answer);
    console.log(`• SIGKILL after ${((performance.now() - t0) / 1000).toFixed(1)} s, with ${writtenAtKill} of ${ROWS} rows written in the open transaction; the import answered ${cut.value.status} ${cut.ms.toFixed(0)} ms later`);
    expectUnavailable(cut.value);

    // Down: every request that needs the database answers 503 quickly; nothing else breaks.
    const down: [string, () => Promise<{ status: number; body: any; headers: Headers }>][] = [
      ['GET /api/households', () => apiAs(owner.cookie, 'GET', '/api/households')],
      ['GET …/share', () => apiAs(owner.cookie, 'GET', `/api/households/${hid}/share`)],
      ['POST …/harvests', () => apiAs(owner.cookie, 'POST', `/api/households/${hid}/harvests`, { cropId: 1, date: '2025-06-01', quantity: 1, unit: 'kg', use: 'fresh' })],
    ];
    for (const [what, send] of down) {
      const r = await timed(send);
      expect(r.ms, what).toBeLessThan(DOWN_ANSWER_MS);
      expectUnavailable(r.value, what);
    }
    const health = await apiAs('', 'GET', '/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ ok: false, database: 'down' });
    // better-auth's own route: its 500 becomes the same 503.
    const signInDown = await timed(() => signIn(owner.email, owner.password));
    expect(signInDown.ms).toBeLessThan(DOWN_ANSWER_MS);
    expect(signInDown.value.status).toBe(503);
    expect(signInDown.value.body.error.code).toBe('database_unavailable');
    // A signed-in page: the plain 503 page, in the app's look, with no script.
    const page = await timed(() => fetch(`${APP_BASE}/households/${hid}`, { headers: { cookie: owner.cookie }, redirect: 'manual' }));
    expect(page.ms).toBeLessThan(DOWN_ANSWER_MS);
    expect(page.value.status).toBe(503);
    expect(page.value.headers.get('retry-after')).toBe('5');
    expect(page.value.headers.get('content-type')).toMatch(/^text\/html/);
    const html = await page.value.text();
    expect(html).toContain('Back in a moment');
    expect(html).not.toContain('<script');
    // Signed-out pages: those that read the database get the same 503 page; none is a 500.
    const publicPages: string[] = [];
    for (const path of ['/', '/sign-in', '/foods?q=potato']) {
      const r = await timed(() => fetch(`${APP_BASE}${path}`, { redirect: 'manual' }));
      const text = await r.value.text();
      expect(r.ms, path).toBeLessThan(DOWN_ANSWER_MS);
      expect([200, 503], path).toContain(r.value.status);
      if (r.value.status === 503) expect(text, path).toContain('Back in a moment');
      publicPages.push(`${path} ${r.value.status}`);
    }
    console.log(`• signed-out pages while the database is down: ${publicPages.join(', ')}`);
    // What needs no database still answers: a static file, a signed-out request's 401.
    expect((await fetch(`${APP_BASE}/favicon.svg`)).status).toBe(200);
    expect((await apiAs('', 'GET', `/api/households/${hid}/harvests`)).status).toBe(401);

    const restart = await timed(() => privateDb.start());
    const after = await storedRows(hid);
    console.log(`• MariaDB back in ${(restart.ms / 1000).toFixed(1)} s: ${after.harvests} of ${ROWS} rows stored, rollup ${after.rollupEntries} entries`);
    expect([0, ROWS]).toContain(after.harvests);
    expect(after.rollupEntries).toBe(after.harvests);
    expect(after.rollupGrams).toBeCloseTo(after.grams, 3);

    // The same app process, no restart: its pool reconnects on the next request.
    expect(app.child.exitCode).toBeNull();
    expect((await apiAs('', 'GET', '/api/health')).body).toEqual({ ok: true, database: 'up' });
    expect((await apiAs(owner.cookie, 'GET', '/api/households')).status).toBe(200);
    expect((await fetch(`${APP_BASE}/households/${hid}`, { headers: { cookie: owner.cookie }, redirect: 'manual' })).status).toBe(200);

    // And the file, sent again, is stored whole: all of it, once.
    if (after.harvests === 0) {
      const again = await timed(() => upload(owner.cookie, hid, { kind: 'harvests', mode: 'commit', csv }));
      expect(again.value.status).toBe(201);
      expect(again.value.body).toMatchObject({ ok: true, created: ROWS });
      console.log(`• the same 50,000 rows committed after the restart in ${(again.ms / 1000).toFixed(1)} s`);
    }
    const whole = await storedRows(hid);
    expect(whole.harvests).toBe(ROWS);
    expect(whole.rollupEntries).toBe(ROWS);
  });
});

describe('the app server restarted while people are signed in', () => {
  it('keeps the session, and replays an Idempotency-Key sent before the restart', async () => {
    const grower = await newVerifiedUser({ name: 'Rue Restart' });
    const h = await createHousehold(grower.cookie, { name: 'Restart plot' });
    const crop = await makeCrop(grower.cookie, h.id, { name: 'Chard', foodId: null, category: 'leafy_green' });
    const body = { cropId: crop.id, date: '2025-06-01', quantity: 1.25, unit: 'kg', use: 'fresh' };
    const key = { 'idempotency-key': 'restart-chard-1' };
    const first = await apiAs(grower.cookie, 'POST', `/api/households/${h.id}/harvests`, body, key);
    expect(first.status).toBe(201);

    await app.stop();
    app = await startApp();

    const me = await apiAs(grower.cookie, 'GET', '/api/households');
    expect(me.status).toBe(200);
    expect(me.body.households.map((x: { id: number }) => x.id)).toContain(h.id);
    const page = await fetch(`${APP_BASE}/households/${h.id}`, { headers: { cookie: grower.cookie }, redirect: 'manual' });
    expect(page.status).toBe(200);
    const again = await apiAs(grower.cookie, 'POST', `/api/households/${h.id}/harvests`, body, key);
    expect(again.status).toBe(201);
    expect(again.headers.get('idempotency-replayed')).toBe('true');
    expect(again.body.harvest.id).toBe(first.body.harvest.id);
    const [n] = await privateDb.query<{ n: number }[]>('SELECT COUNT(*) AS n FROM harvests WHERE household_id = ?', [h.id]);
    expect(Number(n!.n)).toBe(1);
  });
});
