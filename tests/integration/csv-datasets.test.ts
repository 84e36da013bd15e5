/**
 * A CSV food code that two datasets share (here a test dataset reusing SR28's 11352 and IFCT's
 * F006, as an FDC SR Legacy upload reuses NDB numbers): a row naming no dataset takes the food of
 * the household's first dataset, a `dataset` column or a "slug:code" code names it exactly, and an
 * export writes the dataset so it re-imports as the same food whatever the order. The test
 * dataset's foods and figures are made up (they check the matching, not any food).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importDataset } from '@/server/food-import';
import { allPurchases, upload } from '../support/entries';
import { api, BASE_URL, testPool } from '../support/env';
import { apiAs, createHousehold, householdWithRoles, type RoleFixture } from '../support/users';

const CLASH = `clash-${Date.now().toString(36)}`;
const pool = testPool();
let t: RoleFixture;
const ids: Record<string, number> = {};

const idOf = async (code: string, dataset: string) => (await api(`/api/foods?code=${code}&dataset=${dataset}`)).body.foods[0].id as number;

beforeAll(async () => {
  const info = { slug: CLASH, name: 'Clashing codes', release: 't1', publisher: 'Test', licence: 'Public domain', sourceNote: 'Made up for a test.' };
  const food = (code: string, name: string) => ({ code, name, originalName: name, group: 'Test', refusePct: null, rawness: 0, weights: [] });
  await importDataset(pool, info, [food('11352', 'Clash tuber'), food('F006', 'Clash root')], [{ code: '11352', key: 'energy_kcal', amount: 50 }, { code: 'F006', key: 'energy_kcal', amount: 40 }], { force: true });
  ids.sr28 = await idOf('11352', 'usda-sr28');
  ids.clashTuber = await idOf('11352', CLASH);
  ids.ifct = await idOf('F006', 'ifct2017');
  ids.clashRoot = await idOf('F006', CLASH);
  t = await householdWithRoles({ name: 'Clash plot' });
});
afterAll(async () => {
  // Other files look 11352 up across every dataset: take the test dataset away again, with the entries on it.
  await pool.query('DELETE p FROM purchases p JOIN foods f ON f.id = p.food_id JOIN datasets d ON d.id = f.dataset_id WHERE d.slug = ?', [CLASH]);
  await pool.query('DELETE FROM datasets WHERE slug = ?', [CLASH]);
  await pool.end();
});

const bought = (rows: string[], header = 'date,food_code,quantity,unit') => [header, ...rows].join('\n');

describe('a food code two datasets share, in a CSV import', () => {
  it('takes the food of the first dataset in the household order for a bare code', async () => {
    const hid = t.household.id;
    // Datasets in the order loaded: usda-sr28, ifct2017, …, the test dataset last.
    const first = await upload(t.owner.cookie, hid, { kind: 'purchases', mode: 'preview', csv: bought(['2026-01-05,11352,1,kg', '2026-01-05,F006,1,kg']) });
    expect(first.status).toBe(200);
    expect(first.body.rows.map((r: { foodName: string }) => r.foodName)).toEqual(['Potatoes, flesh and skin, raw', 'Potato, brown skin, big']);
    expect((await apiAs(t.owner.cookie, 'PUT', `/api/households/${hid}/datasets`, { order: [CLASH, 'usda-sr28'] })).status).toBe(200);
    const second = await upload(t.owner.cookie, hid, { kind: 'purchases', mode: 'preview', csv: bought(['2026-01-05,11352,1,kg', '2026-01-05,F006,1,kg']) });
    expect(second.body.rows.map((r: { foodName: string }) => r.foodName)).toEqual(['Clash tuber', 'Clash root']);
  });

  it('takes the named dataset\'s food for a dataset column or a slug:code code, whatever the order', async () => {
    const hid = t.household.id; // order: the test dataset first (previous test)
    const r = await upload(t.owner.cookie, hid, {
      kind: 'purchases',
      mode: 'preview',
      csv: bought(['2026-01-06,11352,usda-sr28,1,kg', '2026-01-06,ifct2017:F006,,1,kg', `2026-01-06,${CLASH}:F006,${CLASH},1,kg`], 'date,food_code,dataset,quantity,unit'),
    });
    expect(r.status).toBe(200);
    expect(r.body.errors).toEqual([]);
    expect(r.body.rows.map((x: { foodName: string }) => x.foodName)).toEqual(['Potatoes, flesh and skin, raw', 'Potato, brown skin, big', 'Clash root']);
    const harvests = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'preview', csv: 'date,food_code,quantity,unit\n2026-01-06,usda-sr28:11352,2,kg' });
    expect(harvests.body.rows[0]).toMatchObject({ foodCode: '11352', foodName: 'Potatoes, flesh and skin, raw' });
  });

  it('names the row of a code missing from the named dataset, an unknown dataset and a contradiction', async () => {
    const r = await upload(t.owner.cookie, t.household.id, {
      kind: 'purchases',
      mode: 'commit',
      csv: bought(['2026-01-07,ifct2017:11352,,1,kg', '2026-01-07,11352,no-such-set,1,kg', '2026-01-07,usda-sr28:11352,ifct2017,1,kg', '2026-01-07,Bad Slug:11352,,1,kg'], 'date,food_code,dataset,quantity,unit'),
    });
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([
      { row: 2, column: 'food_code', message: 'There is no reference food with code "11352" in dataset ifct2017.' },
      { row: 3, column: 'food_code', message: 'There is no reference food with code "11352" in dataset no-such-set.' },
      { row: 4, column: 'dataset', message: 'The food_code names dataset usda-sr28 but the dataset column says ifct2017; keep one.' },
      { row: 5, column: 'food_code', message: '"Bad Slug" before the colon is not a dataset name; write the code like ifct2017:F006, or the dataset in its own column.' },
    ]);
    expect(r.body.unknownFoodCodes).toEqual(['ifct2017:11352', 'no-such-set:11352']);
  });

  it('exports the dataset beside the code, so a household with another order imports the same foods', async () => {
    const hid = t.household.id;
    const rows = ['2026-01-08,11352,,1,kg', '2026-01-08,usda-sr28:11352,,2,kg', '2026-01-08,F006,,3,kg'];
    expect((await upload(t.owner.cookie, hid, { kind: 'purchases', mode: 'commit', csv: bought(rows, 'date,food_code,dataset,quantity,unit') })).status).toBe(201);
    const res = await fetch(`${BASE_URL}/api/households/${hid}/exports/purchases.csv`, { headers: { cookie: t.owner.cookie } });
    const csv = await res.text();
    expect(csv.replace(/^\uFEFF/, '').split('\r\n')[0]).toBe('date,food_code,dataset,quantity,unit,price,currency,spread_months,trimmed,note');
    expect(csv).toContain(`2026-01-08,11352,${CLASH},1,kg`);
    expect(csv).toContain('2026-01-08,11352,usda-sr28,2,kg');

    const other = await createHousehold(t.owner.cookie, { name: 'Default order plot' }); // usda-sr28 first
    expect((await upload(t.owner.cookie, other.id, { kind: 'purchases', mode: 'commit', csv })).status).toBe(201);
    const foodsOf = async (h: number) =>
      (await allPurchases(t.owner.cookie, h)).purchases.map((p: { foodId: number; quantity: number }) => [p.quantity, p.foodId]).sort((a: number[], b: number[]) => a[0]! - b[0]!);
    expect(await foodsOf(hid)).toEqual([[1, ids.clashTuber], [2, ids.sr28], [3, ids.clashRoot]]);
    expect(await foodsOf(other.id)).toEqual(await foodsOf(hid));
  });
});
