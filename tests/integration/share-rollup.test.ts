/**
 * The share rollup and the stored share answers (issue 14) against the real MariaDB and the built
 * server. After every kind of write that changes a household's share report — entries logged,
 * edited, deleted and imported, a crop matched to another food, marked not food or renamed, larder
 * records, people, the records start and the time zone, a reference food reload — the answer the
 * API serves (the rollup kept by triggers, the stored answer) must equal a recomputation from the
 * raw entries: the rollup rebuilt by grouping the entries again and every stored answer voided.
 * Each case reads the report first, so a write that failed to void the stored answer would be
 * served stale, and checks that the write changed the answer, so the comparison can fail.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Pool } from 'mysql2/promise';
import { and, eq, inArray } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/mysql2';
import * as schema from '@/db/schema';
import { importDataset, type DatasetInfo } from '@/server/food-import';
import { cropOfHarvest, foodOfHarvest, harvestNameSql } from '@/server/harvest-sql';
import { rebuildShareRollup } from '@/server/share-rollup';
import { testPool } from '../support/env';
import { foodId, logHarvest, makeCrop, upload } from '../support/entries';
import { apiAs, householdWithRoles, type RoleFixture } from '../support/users';

let pool: Pool;
let t: RoleFixture;
let hid: number;
const RANGE = 'from=2025-03&to=2026-02';

const share = async (household = hid, range = RANGE) => {
  const r = await apiAs(t.owner.cookie, 'GET', `/api/households/${household}/share?${range}`);
  expect(r.status).toBe(200);
  return r.body;
};

/** The household's rollup rows, in key order. */
async function groups(household = hid): Promise<unknown[]> {
  const [h] = await pool.query('SELECT `day`, `use`, spread, preserve_method, crop_id, food_id, grams, edible_grams, entries FROM harvest_groups WHERE household_id = ? ORDER BY `day`, `use`, spread, preserve_method, crop_id, food_id', [household]);
  const [p] = await pool.query('SELECT `day`, spread, food_id, grams, edible_grams, entries FROM purchase_groups WHERE household_id = ? ORDER BY `day`, spread, food_id', [household]);
  return [h, p];
}

/** Equal, numbers to 1e-9 of their size (a sum kept by adding and taking off may differ in the last bits). */
function expectClose(actual: unknown, expected: unknown, path = 'answer'): void {
  if (typeof expected === 'number' && typeof actual === 'number') {
    expect(Math.abs(actual - expected), `${path}: ${actual} vs ${expected}`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)));
  } else if (expected && typeof expected === 'object') {
    expect(actual !== null && typeof actual === 'object', `${path} is an object`).toBe(true);
    const a = actual as Record<string, unknown>;
    const e = expected as Record<string, unknown>;
    expect(Object.keys(a).sort(), path).toEqual(Object.keys(e).sort());
    for (const k of Object.keys(e)) expectClose(a[k], e[k], `${path}.${k}`);
  } else expect(actual, path).toEqual(expected);
}

/**
 * Reads the report (so it is stored), writes, reads it again and compares it with the report
 * recomputed from the raw entries: the kept rollup must equal the rebuilt one, and the served
 * answer the recomputed one; and the write must have changed the answer.
 */
async function afterWrite(write: () => Promise<void>, opts: { household?: number; range?: string } = {}): Promise<any> {
  const household = opts.household ?? hid;
  const before = await share(household, opts.range);
  expect(await share(household, opts.range)).toEqual(before);
  await write();
  const served = await share(household, opts.range);
  const kept = await groups(household);
  await rebuildShareRollup(drizzle(pool, { schema, mode: 'default' }), household);
  expectClose(await groups(household), kept, 'rollup');
  expectClose(served, await share(household, opts.range));
  expect(served).not.toEqual(before);
  return served;
}

const ok = (r: { status: number; body: unknown }, status = 200) => expect(r.status, JSON.stringify(r.body)).toBe(status);
const path = (p: string) => `/api/households/${hid}${p}`;
let potato: any;
let lot: any;

beforeAll(async () => {
  pool = testPool();
  t = await householdWithRoles({ name: 'Rollup plot', timezone: 'Europe/London' });
  hid = t.household.id;
  potato = await makeCrop(t.owner.cookie, hid, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  lot = await logHarvest(t.owner.cookie, hid, { cropId: potato.id, date: '2025-09-20', quantity: 40, unit: 'kg', use: 'stored', spreadMonths: 6 });
  await logHarvest(t.owner.cookie, hid, { cropId: potato.id, date: '2025-07-02', quantity: 3, unit: 'kg', use: 'fresh' });
  ok(await apiAs(t.owner.cookie, 'POST', path('/people'), { name: 'Ada', sex: 'female', ageYears: 40 }), 201);
});

afterAll(async () => {
  await pool.end();
});

describe('entries', () => {
  it('a harvest logged', async () => {
    await afterWrite(async () => void (await logHarvest(t.owner.cookie, hid, { cropId: potato.id, date: '2025-10-05', quantity: 12, unit: 'kg', use: 'preserved', preserveMethod: 'frozen', spreadMonths: 4 })));
  });

  it('a harvest edited: weight, date and use', async () => {
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', path(`/harvests/${lot.id}`), { quantity: 55 })));
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', path(`/harvests/${lot.id}`), { date: '2025-09-28', spreadMonths: 5 })));
  });

  it('a harvest deleted', async () => {
    const h = await logHarvest(t.owner.cookie, hid, { cropId: potato.id, date: '2025-08-11', quantity: 9, unit: 'kg', use: 'fresh' });
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'DELETE', path(`/harvests/${h.id}`)), 204));
  });

  it('bought food logged, edited and deleted', async () => {
    const flour = await foodId('20081');
    let id = 0;
    await afterWrite(async () => {
      const r = await apiAs(t.owner.cookie, 'POST', path('/purchases'), { date: '2025-11-03', foodId: flour, quantity: 16, unit: 'kg', spreadMonths: 3 });
      ok(r, 201);
      id = r.body.purchase.id;
    });
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', path(`/purchases/${id}`), { quantity: 25, spreadMonths: 2 })));
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'DELETE', path(`/purchases/${id}`)), 204));
  });

  it('a CSV import committed (its rows bulk-loaded as written)', async () => {
    const note = 'dug wet\nback \\ bed "3", Größe L';
    const csv = `date,crop,quantity,unit,use,spread_months,note\n2025-08-01,Potato,2.5,kg,fresh,,"${note.replace(/"/g, '""')}"\n2025-09-30,Potato,30,kg,stored,5,\n2025-10-01,Potato,1,kg,given,,\n`;
    await afterWrite(async () => ok(await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'commit', csv }), 201));
    const [rows] = (await pool.query("SELECT note, quantity, unit FROM harvests WHERE household_id = ? AND `date` = '2025-08-01'", [hid])) as any;
    expect(rows).toEqual([{ note, quantity: 2.5, unit: 'kg' }]);
  });
});

describe('crops and larder records', () => {
  it('a crop matched to another food (its harvests re-matched)', async () => {
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', path(`/crops/${potato.id}`), { foodId: await foodId('11355') })));
  });

  it('a crop renamed; a crop marked not food and back (its harvests given away still count as production)', async () => {
    const served = await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', path(`/crops/${potato.id}`), { name: 'Maincrop potato' })));
    expect(served.topCrops.map((c: any) => c.name)).toContain('Maincrop potato');
    const chard = await makeCrop(t.owner.cookie, hid, { name: 'Kale', foodId: await foodId('11233'), category: 'leafy_green' });
    await logHarvest(t.owner.cookie, hid, { cropId: chard.id, date: '2025-07-20', quantity: 4, unit: 'kg', use: 'given' });
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', path(`/crops/${chard.id}`), { notFood: true, foodId: null })));
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', path(`/crops/${chard.id}`), { notFood: false, foodId: await foodId('11233') })));
  });

  it('names crops as the harvest list does: "Name (variety)", else after the food logged (harvestNameSql)', async () => {
    const bean = await makeCrop(t.owner.cookie, hid, { name: 'Runner bean', variety: 'Scarlet Emperor', foodId: await foodId('11052'), category: 'legume' });
    const served = await afterWrite(async () => {
      await logHarvest(t.owner.cookie, hid, { cropId: bean.id, date: '2025-08-14', quantity: 6, unit: 'kg', use: 'fresh' });
      await logHarvest(t.owner.cookie, hid, { foodId: await foodId('11233'), date: '2025-08-15', quantity: 2, unit: 'kg', use: 'fresh' });
    });
    // The report names crops in code (share-rollup.ts); the harvest list and the larder in SQL.
    const db = drizzle(pool, { schema, mode: 'default' });
    const listed = await db
      .selectDistinct({ name: harvestNameSql() })
      .from(schema.harvests)
      .leftJoin(schema.crops, cropOfHarvest())
      .leftJoin(schema.foods, foodOfHarvest())
      .where(and(eq(schema.harvests.householdId, hid), inArray(schema.harvests.date, ['2025-08-14', '2025-08-15'])));
    const names = listed.map((r) => r.name).sort();
    expect(names).toEqual(['Kale, raw', 'Runner bean (Scarlet Emperor)']);
    for (const name of names) expect(served.topCrops.map((c: any) => c.name)).toContain(name);
    // And the harvest list's own answer says the same (cropDisplayName).
    const list = await apiAs(t.owner.cookie, 'GET', path('/harvests?from=2025-08-14&to=2025-08-14'));
    expect(list.body.harvests.map((h: any) => h.cropName)).toContain('Runner bean (Scarlet Emperor)');
  });

  it('a larder record added and removed (the lot leaves the rollup and comes back)', async () => {
    let outcome = 0;
    await afterWrite(async () => {
      const r = await apiAs(t.owner.cookie, 'POST', path('/larder/outcomes'), { harvestId: lot.id, kind: 'spoiled', date: '2025-12-01', lostFraction: 0.5 });
      ok(r, 201);
      outcome = r.body.outcome.id;
    });
    const [[inGroups]] = (await pool.query('SELECT COUNT(*) AS n FROM harvest_groups WHERE household_id = ? AND `use` = ? AND spread = 5', [hid, 'stored'])) as any;
    expect(inGroups.n).toBe(1); // the imported lot of 30 September; the recorded lot is read on its own
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'DELETE', path(`/larder/outcomes/${outcome}`)), 204));
  });
});

describe('people and the household', () => {
  it('a person added and changed', async () => {
    let id = 0;
    await afterWrite(async () => {
      const r = await apiAs(t.owner.cookie, 'POST', path('/people'), { name: 'Bo', sex: 'male', ageYears: 9 });
      ok(r, 201);
      id = r.body.person.id;
    });
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', path(`/people/${id}`), { ageYears: 15, atHomePct: 60 })));
  });

  it('the records start changed', async () => {
    await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hid}`, { recordsSince: '2025-09' })));
  });

  it('the time zone changed (it moves the default records start, from the creation day in that zone)', async () => {
    const other = await apiAs(t.owner.cookie, 'POST', '/api/households', { name: 'Zone plot', timezone: 'Europe/London' });
    ok(other, 201);
    const id = other.body.household.id as number;
    // Created 30 June 23:30 UTC: 1 July in London, still 30 June in New York.
    await pool.query("UPDATE households SET created_at = '2025-06-30 23:30:00' WHERE id = ?", [id]);
    const crop = await makeCrop(t.owner.cookie, id, { name: 'Kale', foodId: await foodId('11233'), category: 'leafy_green' });
    await logHarvest(t.owner.cookie, id, { cropId: crop.id, date: '2025-08-04', quantity: 2, unit: 'kg', use: 'fresh' });
    ok(await apiAs(t.owner.cookie, 'POST', `/api/households/${id}/people`, { name: 'Cy', sex: 'female', ageYears: 30 }), 201);
    const served = await afterWrite(async () => ok(await apiAs(t.owner.cookie, 'PATCH', `/api/households/${id}`, { timezone: 'America/New_York' })), { household: id });
    expect(served.recordsSince).toBe('2025-06');
  });
});

describe('reference foods', () => {
  it('a reload of the dataset behind a crop', async () => {
    const info: DatasetInfo = { slug: 'rollup-test', name: 'Rollup test foods', release: '1', publisher: 'Selfsown tests', licence: 'test data', sourceNote: 'invented for this test' };
    // Invented test food: only the reload's effect is checked, never a real composition.
    const food = (kcal: number) => ({ foods: [{ code: 'RT1', name: 'Test roots', originalName: 'TEST ROOTS', group: 'Test', refusePct: 0, rawness: 0, weights: [] }], amounts: [{ code: 'RT1', key: 'energy_kcal', amount: kcal }] });
    const first = food(100);
    await importDataset(pool, info, first.foods, first.amounts, { force: true });
    const [[row]] = (await pool.query("SELECT f.id FROM foods f JOIN datasets d ON d.id = f.dataset_id WHERE d.slug = 'rollup-test' AND f.code = 'RT1'")) as any;
    const roots = await makeCrop(t.owner.cookie, hid, { name: 'Test roots', foodId: row.id, category: 'root_tuber' });
    await logHarvest(t.owner.cookie, hid, { cropId: roots.id, date: '2025-10-10', quantity: 10, unit: 'kg', use: 'fresh' });
    const served = await afterWrite(async () => {
      const second = food(200);
      await importDataset(pool, info, second.foods, second.amounts, { force: true });
    });
    const crop = served.topCrops.find((c: any) => c.name === 'Test roots');
    expect(crop.values.energy_kcal).toBeCloseTo(20_000, 6); // 10 kg × 200 kcal per 100 g (the reloaded amount)
  });
});
