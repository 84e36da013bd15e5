/**
 * An administrator's FoodData Central CSV upload against the built server and MariaDB: refused
 * files, a bad row that changes nothing, a new dataset found by search, a new release that says
 * whose figures it moves before it is applied, and kept search answers that follow every load (at
 * once when this server made it, within REVISION_TRUST_MS when another process did). The CSV
 * files follow FDC's column layout; the foods and figures in them are made up for the test (they
 * check the loading, not any food).
 */
import type { Pool } from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { grantAdmin } from '@/cli/admin-grant';
import { searchFoods } from '@/server/food-search';
import { REVISION_TRUST_MS } from '@/server/food-search-cache';
import { BASE_URL, TEST_DB_URL, testPool } from '../support/env';
import { apiAs, householdWithRoles, newVerifiedUser, type TestUser } from '../support/users';

const SLUG = `fdc-test-${Date.now().toString(36)}`;
const csv = (rows: (string | number)[][]) => rows.map((r) => r.map((c) => `"${c}"`).join(',')).join('\r\n') + '\r\n';
const NUTRIENT = csv([['id', 'name', 'unit_name', 'nutrient_nbr', 'rank'], [1008, 'Energy', 'KCAL', '208', 300], [1003, 'Protein', 'G', '203', 600]]);
const FOOD = csv([
  ['fdc_id', 'data_type', 'description', 'food_category_id', 'publication_date'],
  [990001, 'sr_legacy_food', 'Quillroot, raw', '', '2019-04-01'],
  [990002, 'sr_legacy_food', 'Quillroot, boiled', '', '2019-04-01'],
]);
const amounts = (kcalRaw: number | string) =>
  csv([
    ['id', 'fdc_id', 'nutrient_id', 'amount', 'data_points', 'derivation_id', 'min', 'max', 'median', 'footnote', 'min_year_acquired'],
    [1, 990001, 1008, kcalRaw, '', '', '', '', '', '', ''],
    [2, 990001, 1003, 2, '', '', '', '', '', '', ''],
    [3, 990002, 1008, 60, '', '', '', '', '', '', ''],
  ]);

let pool: Pool;
let admin: TestUser;
beforeAll(async () => {
  pool = testPool();
  admin = await newVerifiedUser({ name: 'Data Admin' });
  await grantAdmin(TEST_DB_URL, admin.email);
});
afterAll(() => pool.end());

async function upload(files: Record<string, string | Uint8Array>, meta: Record<string, string> = {}) {
  const form = new FormData();
  const all = { slug: SLUG, name: 'Test FDC table', release: 'r1', publisher: 'Test', licence: 'Public domain', ...meta };
  for (const [k, v] of Object.entries(all)) form.set(k, v);
  for (const [name, body] of Object.entries(files)) form.append('files', new Blob([body as BlobPart], { type: 'text/csv' }), name);
  const res = await fetch(`${BASE_URL}/api/admin/uploads`, { method: 'POST', headers: { cookie: admin.cookie, origin: BASE_URL }, body: form });
  return { status: res.status, body: (await res.json()) as any };
}

async function settled(id: number) {
  for (let i = 0; i < 200; i++) {
    const r = await apiAs(admin.cookie, 'GET', `/api/admin/uploads/${id}`);
    if (r.body.upload.status !== 'reading') return r.body.upload;
    await new Promise((res) => setTimeout(res, 50));
  }
  throw new Error('the upload did not finish reading');
}

const counts = async () => {
  const [[r]] = (await pool.query('SELECT (SELECT COUNT(*) FROM datasets) AS d, (SELECT COUNT(*) FROM foods) AS f, (SELECT COUNT(*) FROM food_nutrients) AS n')) as unknown as [{ d: number; f: number; n: number }[]];
  return r;
};

describe('FoodData Central upload', () => {
  it('refuses a missing required file, a zip, and a file it does not know, with a reason', async () => {
    const missing = await upload({ 'food.csv': FOOD, 'nutrient.csv': NUTRIENT });
    expect(missing.status).toBe(422);
    expect(missing.body.error).toMatchObject({ code: 'missing_files', message: expect.stringContaining('food_nutrient.csv') });
    const zip = await upload({ 'food.csv': new Uint8Array([0x50, 0x4b, 3, 4, 0, 0]), 'nutrient.csv': NUTRIENT, 'food_nutrient.csv': amounts(70) });
    expect(zip.status).toBe(415);
    expect(zip.body.error.code).toBe('not_csv');
    expect((await upload({ 'branded_food.csv': FOOD })).status).toBe(415);
    const badMeta = await upload({ 'food.csv': FOOD, 'nutrient.csv': NUTRIENT, 'food_nutrient.csv': amounts(70) }, { slug: 'Not A Slug!' });
    expect(badMeta.status).toBe(400);
    expect(badMeta.body.error.fields.slug).toBeTruthy();
  });

  it('refuses a file without a needed column on its line 1', async () => {
    const r = await upload({ 'food.csv': FOOD.replace('"description"', '"title"'), 'nutrient.csv': NUTRIENT, 'food_nutrient.csv': amounts(70) });
    const job = await settled(r.body.upload.id);
    expect(job.status).toBe('failed');
    expect(job.errors[0]).toMatchObject({ file: 'food.csv', line: 1, column: 'description' });
  });

  it('names the file, line and column of a bad row, and changes nothing', async () => {
    const before = await counts();
    const r = await upload({ 'food.csv': FOOD, 'nutrient.csv': NUTRIENT, 'food_nutrient.csv': amounts('lots') });
    expect(r.status).toBe(202);
    const job = await settled(r.body.upload.id);
    expect(job.status).toBe('failed');
    expect(job.errors).toEqual([{ file: 'food_nutrient.csv', line: 2, column: 'amount', message: '"lots" is not an amount of 0 or more.' }]);
    expect(await counts()).toEqual(before);
    const apply = await apiAs(admin.cookie, 'POST', `/api/admin/uploads/${job.id}/apply`);
    expect(apply.status).toBe(409);
    expect(await counts()).toEqual(before);
  });

  it('loads a new dataset after confirmation, found by a search restricted to it', async () => {
    const r = await upload({ 'food.csv': FOOD, 'nutrient.csv': NUTRIENT, 'food_nutrient.csv': amounts(70) });
    const job = await settled(r.body.upload.id);
    expect(job).toMatchObject({ status: 'ready', format: 'sr_legacy', foodCount: 2, amountCount: 3, changes: null });
    expect((await apiAs(admin.cookie, 'GET', `/api/foods?q=quillroot&dataset=${SLUG}`)).status).toBe(404); // not applied yet
    // Asked before the load, the unrestricted search finds nothing; that answer is kept (food-search-cache.ts).
    for (let i = 0; i < 2; i++) expect((await apiAs(admin.cookie, 'GET', '/api/foods?q=quillroot')).body.foods).toEqual([]);
    const applied = await apiAs(admin.cookie, 'POST', `/api/admin/uploads/${job.id}/apply`);
    expect(applied.status).toBe(200);
    expect(applied.body.upload.status).toBe('applied');
    const hits = await apiAs(admin.cookie, 'GET', `/api/foods?q=quillroot&dataset=${SLUG}`);
    expect(hits.body.foods.map((f: { code: string; refusePct: null }) => [f.code, f.refusePct])).toEqual([['990001', null], ['990002', null]]);
    // The load voids the kept answer: the same search, asked again, is the search worked out now.
    const again = await apiAs(admin.cookie, 'GET', '/api/foods?q=quillroot');
    expect(again.body.foods.map((f: { code: string }) => f.code)).toEqual(['990001', '990002']);
    expect(again.body.foods).toEqual(JSON.parse(JSON.stringify(await searchFoods(pool, 'quillroot', 20))));
    expect((await apiAs(admin.cookie, 'POST', `/api/admin/uploads/${job.id}/apply`)).status).toBe(409);
    const log = (await apiAs(admin.cookie, 'GET', '/api/admin/actions')).body.actions;
    expect(log[0]).toMatchObject({ action: 'dataset.apply', subject: SLUG, userEmail: admin.email });
  });

  it("tells whose figures a new release moves before it is applied, then moves them", async () => {
    const t = await householdWithRoles({ name: 'Quillroot eaters' });
    const hid = t.household.id;
    const raw = (await apiAs(t.owner.cookie, 'GET', `/api/foods?code=990001&dataset=${SLUG}`)).body.foods[0].id;
    const boiled = (await apiAs(t.owner.cookie, 'GET', `/api/foods?code=990002&dataset=${SLUG}`)).body.foods[0].id;
    for (const foodId of [raw, boiled]) expect((await apiAs(t.owner.cookie, 'POST', `/api/households/${hid}/purchases`, { date: '2026-02-10', foodId, quantity: 1, unit: 'kg' })).status).toBe(201);

    // Release 2: the raw food's energy 70 → 80 kcal per 100 g and its name longer, the boiled food dropped.
    const food2 = FOOD.split('\r\n').filter((l) => !l.includes('990002')).join('\r\n').replace('Quillroot, raw', 'Quillroot, raw, peeled');
    const r = await upload({ 'food.csv': food2, 'nutrient.csv': NUTRIENT, 'food_nutrient.csv': amounts(80).split('\r\n').filter((l) => !l.includes('990002')).join('\r\n') }, { release: 'r2' });
    const job = await settled(r.body.upload.id);
    expect(job.status).toBe('ready');
    const mine = job.changes.find((c: { householdId: number }) => c.householdId === hid);
    // 1,000 g at 70 and 1,000 g at 60 kcal/100 g now; 1,000 g at 80 after, the boiled food unknown
    expect(mine).toMatchObject({ entries: 2, kcalBefore: 700 + 600, kcalAfter: 800, proteinBefore: 20, proteinAfter: 20, foodsChanged: ['990001'], foodsDropped: ['990002'] });

    const before = await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/share?from=2026-02&to=2026-02`);
    expect(before.body.months[0].values.energy_kcal.bought).toBeCloseTo(1300, 6);
    const search = async () => (await apiAs(t.owner.cookie, 'GET', `/api/foods?q=quillroot&dataset=${SLUG}`)).body.foods;
    expect((await search()).map((f: { name: string }) => f.name)).toEqual(['Quillroot, raw', 'Quillroot, boiled']);
    expect((await apiAs(admin.cookie, 'POST', `/api/admin/uploads/${job.id}/apply`)).status).toBe(200);
    // The same search, asked again at once, has the new name and no longer offers the dropped food
    // (a food with no figures now): the kept answer went with the load.
    const renamed = await search();
    expect(renamed.map((f: { name: string }) => f.name)).toEqual(['Quillroot, raw, peeled']);
    expect(renamed).toEqual(JSON.parse(JSON.stringify(await searchFoods(pool, 'quillroot', 20, { dataset: SLUG }))));
    const after = await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/share?from=2026-02&to=2026-02`);
    expect(after.body.months[0].values.energy_kcal.bought).toBeCloseTo(800, 6);
    expect((await apiAs(admin.cookie, 'GET', '/api/datasets')).body.datasets.find((d: { slug: string }) => d.slug === SLUG).release).toBe('r2');
  });

  it('sees a load made by another process (the revision moved in the database) within REVISION_TRUST_MS', async () => {
    const search = async () => (await apiAs(admin.cookie, 'GET', `/api/foods?q=quillroot&dataset=${SLUG}`)).body.foods;
    expect((await search()).map((f: { name: string }) => f.name)).toEqual(['Quillroot, raw, peeled']);
    // What `npm run db:import-foods` would commit from its own process: a new name, the revision one more.
    await pool.query("UPDATE foods JOIN datasets ON datasets.id = foods.dataset_id SET foods.name = 'Quillroot, raw, scrubbed' WHERE datasets.slug = ? AND foods.code = '990001'", [SLUG]);
    await pool.query('UPDATE datasets SET revision = revision + 1 WHERE slug = ?', [SLUG]);
    await new Promise((res) => setTimeout(res, REVISION_TRUST_MS + 50));
    const now = await search();
    expect(now.map((f: { name: string }) => f.name)).toEqual(['Quillroot, raw, scrubbed']);
    expect(now).toEqual(JSON.parse(JSON.stringify(await searchFoods(pool, 'quillroot', 20, { dataset: SLUG }))));
  });
});
