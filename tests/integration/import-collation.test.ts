/**
 * The import preview names crops by the database's own rule: MariaDB's utf8mb4_unicode_ci (the
 * crops.name collation, see src/cli/mariadb.ts) compares case- and accent-blind, so "Pois mangetoût"
 * and "Pois mangetout" are one crop to the unique index. Preview and commit must agree (issue 15:
 * preview said "ok" for two crops that the commit then refused as one).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { allHarvests, foodId, makeCrop, upload } from '../support/entries';
import { testPool } from '../support/env';
import { apiAs, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

const pool = testPool();
let owner: TestUser;
let peas: number;
beforeAll(async () => {
  owner = await newVerifiedUser({ name: 'Accent grower' });
  peas = await foodId('11300'); // USDA SR28, NDB 11300 "Peas, edible-podded, raw"
});
afterAll(() => pool.end());

const crops = async (hid: number) => (await apiAs(owner.cookie, 'GET', `/api/households/${hid}/crops?includeArchived=1`)).body.crops.map((c: any) => c.name);

describe('crop names in an import, by the database collation', () => {
  it('is the collation the crops table really uses', async () => {
    const [rows] = await pool.query("SELECT COLLATION_NAME AS c FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'crops' AND COLUMN_NAME = 'name'");
    expect(rows).toEqual([{ c: 'utf8mb4_unicode_ci' }]);
    const [eq] = await pool.query("SELECT 'Pois mangetout' = 'Pois mangetoût' COLLATE utf8mb4_unicode_ci AS same");
    expect(eq).toEqual([{ same: 1 }]);
  });

  it('matches a name that differs from a crop only by accent and case to that crop, in preview and commit', async () => {
    const h = await createHousehold(owner.cookie, { name: 'Accented plot' });
    await makeCrop(owner.cookie, h.id, { name: 'Pois mangetout', category: 'legume', foodId: peas });
    const csv = 'date,crop,quantity,unit\n2026-06-01,Pois mangetoût,1,kg\n2026-06-02,POIS MANGETOUT,2,kg\n';
    const preview = await upload(owner.cookie, h.id, { kind: 'harvests', mode: 'preview', csv, createCrops: [{ name: 'Pois mangetoût', category: 'legume', foodId: peas }] });
    expect(preview.status).toBe(200);
    expect(preview.body.errors).toEqual([]);
    expect(preview.body.unknownCrops).toEqual([]);
    expect(preview.body.rows.map((r: any) => r.crop)).toEqual(['Pois mangetout', 'Pois mangetout']);
    const commit = await upload(owner.cookie, h.id, { kind: 'harvests', mode: 'commit', csv, createCrops: [{ name: 'Pois mangetoût', category: 'legume', foodId: peas }] });
    expect(commit.status, JSON.stringify(commit.body)).toBe(201);
    expect(await crops(h.id)).toEqual(['Pois mangetout']);
    expect((await allHarvests(owner.cookie, h.id)).total).toBe(2);
  });

  it('lists two spellings of one new crop once, and creates it once', async () => {
    const h = await createHousehold(owner.cookie, { name: 'Two spellings' });
    const csv = 'date,crop,quantity,unit\n2026-06-01,Pois mangetoût,1,kg\n2026-06-02,Pois Mangetout,2,kg\n';
    const preview = await upload(owner.cookie, h.id, { kind: 'harvests', mode: 'preview', csv });
    expect(preview.body.unknownCrops.map((c: any) => c.name)).toEqual(['Pois mangetoût']);
    // Both spellings asked for: the preview and the commit both make one crop of them.
    const createCrops = [{ name: 'Pois mangetoût', category: 'legume', foodId: peas }, { name: 'Pois Mangetout', category: 'legume', foodId: peas }];
    const again = await upload(owner.cookie, h.id, { kind: 'harvests', mode: 'preview', csv, createCrops });
    expect(again.body.errors).toEqual([]);
    expect(new Set(again.body.rows.map((r: any) => r.crop))).toEqual(new Set(['Pois mangetoût']));
    const commit = await upload(owner.cookie, h.id, { kind: 'harvests', mode: 'commit', csv, createCrops });
    expect(commit.status, JSON.stringify(commit.body)).toBe(201);
    expect(await crops(h.id)).toEqual(['Pois mangetoût']);
  });

  it('keeps crops apart that the collation tells apart (Ø is not O)', async () => {
    const h = await createHousehold(owner.cookie, { name: 'Nordic plot' });
    await makeCrop(owner.cookie, h.id, { name: 'Øland wheat', category: 'grain' });
    const preview = await upload(owner.cookie, h.id, { kind: 'harvests', mode: 'preview', csv: 'date,crop,quantity,unit\n2026-06-01,Oland wheat,1,kg\n' });
    expect(preview.body.unknownCrops.map((c: any) => c.name)).toEqual(['Oland wheat']);
  });
});
