import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { allHarvests, allPurchases, foodId, makeCrop, upload } from '../support/entries';
import { api, BASE_URL, testPool } from '../support/env';
import { apiAs, createHousehold, householdWithRoles, type RoleFixture } from '../support/users';

// 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959)
const LB = 453.59237;

let t: RoleFixture;
let hid: number;
let potatoFood: number;
const pool = testPool();

beforeAll(async () => {
  t = await householdWithRoles();
  hid = t.household.id;
  potatoFood = await foodId('11352');
  await makeCrop(t.owner.cookie, hid, { name: 'Potato', variety: 'Charlotte', foodId: potatoFood, category: 'root_tuber' });
  await makeCrop(t.owner.cookie, hid, { name: 'Butternut squash', foodId: await foodId('11485'), category: 'squash' });
});

afterAll(async () => {
  await pool.end();
});

const goodLog = [
  'Date,Crop,Variety,Quantity,Unit,Use,Spread months,Note',
  '2025-07-01,Potato,Charlotte,10,lb,fresh,,first earlies',
  '2025-09-14,potato,charlotte,20,kg,stored,6,',
  '2025-09-28,Butternut squash,,16,oz,fresh,,',
].join('\n');

describe('importing a harvest log', () => {
  it('previews the rows as they would be stored, writing nothing', async () => {
    const r = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'preview', csv: goodLog });
    expect(r.status).toBe(200);
    expect(r.body.ok).toBe(true);
    expect(r.body.errors).toEqual([]);
    expect(r.body.rowCount).toBe(3);
    expect(r.body.rows).toHaveLength(3);
    expect(r.body.rows[0]).toMatchObject({ row: 2, crop: 'Potato (Charlotte)', foodCode: '11352', quantity: 10, unit: 'lb', use: 'fresh', note: 'first earlies' });
    expect(r.body.rows[0].grams).toBeCloseTo(10 * LB, 9);
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse
    expect(r.body.rows[0].edibleGrams).toBeCloseTo(10 * LB * 0.75, 9);
    expect((await allHarvests(t.owner.cookie, hid)).total).toBe(0);
  });

  it('refuses a harvest dated after today in the household time zone, writing nothing', async () => {
    const later = `${goodLog}\n2099-07-01,Potato,Charlotte,3,kg,fresh,,`;
    const r = await upload(t.grower.cookie, hid, { kind: 'harvests', mode: 'commit', csv: later });
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([{ row: 5, column: 'date', message: expect.stringMatching(/after today/) }]);
    expect((await allHarvests(t.owner.cookie, hid)).total).toBe(0);
  });

  it('writes nothing when one row is bad, and names the row and column', async () => {
    const bad = `${goodLog}\n2025-02-30,Potato,Charlotte,3,kg,fresh,,\n2025-10-01,Potato,Charlotte,0,kg,fresh,,`;
    const r = await upload(t.grower.cookie, hid, { kind: 'harvests', mode: 'commit', csv: bad });
    expect(r.status).toBe(422);
    expect(r.body.ok).toBe(false);
    expect(r.body.errors).toEqual([
      { row: 5, column: 'date', message: expect.stringMatching(/does not exist/) },
      { row: 6, column: 'quantity', message: expect.stringMatching(/more than 0/) },
    ]);
    expect(r.body.error.code).toBe('invalid_rows');
    expect(r.body.error.message).toMatch(/Row 5/);
    expect((await allHarvests(t.owner.cookie, hid)).total).toBe(0);
  });

  it('names unknown crops and writes nothing (not even the crops) until they are created', async () => {
    const withOca = `${goodLog}\n2025-11-02,Oca,,2,kg,stored,,`;
    const preview = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'preview', csv: withOca });
    expect(preview.body.ok).toBe(false);
    // Oca has no row in reference-data/crops.csv, so its kind is left to the grower ('other').
    expect(preview.body.unknownCrops).toEqual([{ name: 'Oca', category: 'other' }]);
    expect(preview.body.errors).toEqual([{ row: 5, column: 'crop', message: expect.stringMatching(/no crop "Oca"/) }]);
    const kale = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'preview', csv: `${goodLog}\n2025-11-02,Kale,,1,kg,fresh,,` });
    // reference-data/crops.csv row "kale" is a leafy green: the preview offers that kind for the new crop.
    expect(kale.body.unknownCrops).toEqual([{ name: 'Kale', category: 'leafy_green' }]);
    const refused = await upload(t.owner.cookie, hid, {
      kind: 'harvests', mode: 'commit', csv: `${withOca}\nnot-a-date,Potato,Charlotte,1,kg,fresh,,`,
      createCrops: [{ name: 'Oca', category: 'root_tuber', foodId: null }],
    });
    expect(refused.status).toBe(422);
    // A preview that names the crops to create shows the file as it will import, with no crop errors.
    const checked = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'preview', csv: withOca, createCrops: [{ name: 'Oca', category: 'root_tuber', foodId: null }] });
    expect(checked.status).toBe(200);
    expect(checked.body.errors).toEqual([]);
    expect(checked.body.ok).toBe(true);
    const crops = (await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/crops?includeArchived=1`)).body.crops;
    expect(crops.map((c: { name: string }) => c.name)).not.toContain('Oca');

    const ok = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'commit', csv: withOca, createCrops: [{ name: 'Oca', category: 'root_tuber', foodId: null }] });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ ok: true, created: 4 });
    const list = await allHarvests(t.owner.cookie, hid);
    expect(list.total).toBe(4);
    const oca = list.harvests.find((h) => h.cropName === 'Oca');
    expect(oca).toMatchObject({ use: 'stored', grams: 2000, foodId: null });
  });

  it('reads a semicolon file with decimal commas and a byte-order mark', async () => {
    const h = await createHousehold(t.owner.cookie, { name: 'Semicolon plot' });
    await makeCrop(t.owner.cookie, h.id, { name: 'Potato', foodId: potatoFood, category: 'root_tuber' });
    const csv = '\uFEFFdate;crop;quantity;unit;use\n2025-07-01;Potato;1,5;kg;fresh\r\n2025-07-02;Potato;2;kilos;Fresh\r\n';
    const r = await upload(t.owner.cookie, h.id, { kind: 'harvests', mode: 'commit', csv });
    expect(r.status).toBe(201);
    expect((await allHarvests(t.owner.cookie, h.id)).totals.grams).toBeCloseTo(3500, 9);
  });
});

describe('importing bought food', () => {
  it('matches food codes and refuses an unknown code, writing nothing', async () => {
    const h = await createHousehold(t.owner.cookie, { name: 'Shop plot' });
    const csv = 'date,food_code,quantity,unit,price,currency,spread_months\n2025-03-02,20081,25,kg,31.90,EUR,6\n2025-03-03,99999,1,kg,,,\n';
    const bad = await upload(t.owner.cookie, h.id, { kind: 'purchases', mode: 'commit', csv });
    expect(bad.status).toBe(422);
    expect(bad.body.unknownFoodCodes).toEqual(['99999']);
    expect(bad.body.errors).toEqual([{ row: 3, column: 'food_code', message: expect.stringMatching(/99999/) }]);
    expect((await allPurchases(t.owner.cookie, h.id)).total).toBe(0);
    const good = await upload(t.owner.cookie, h.id, { kind: 'purchases', mode: 'commit', csv: csv.split('\n').slice(0, 2).join('\n') });
    expect(good.status).toBe(201);
    const list = await allPurchases(t.owner.cookie, h.id);
    expect(list.purchases[0]).toMatchObject({ foodCode: '20081', grams: 25_000, price: 31.9, currency: 'EUR', spreadMonths: 6 });
  });
});

describe('bad uploads', () => {
  it('refuses a file over 5 MB with 413 before reading it', async () => {
    const big = new Uint8Array(5 * 1024 * 1024 + 10).fill(0x61);
    const r = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'preview', csv: big });
    expect(r.status).toBe(413);
    expect(r.body.error.message).toMatch(/5 MB/);
  });

  it('refuses a spreadsheet workbook, a binary file and a wrong body type with a reason', async () => {
    const xlsx = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3, 4]);
    const a = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'preview', csv: xlsx, fileName: 'log.xlsx', type: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' });
    expect(a.status).toBe(415);
    expect(a.body.error.message).toMatch(/CSV UTF-8/);
    const png = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'preview', csv: 'x', fileName: 'photo.png', type: 'image/png' });
    expect(png.status).toBe(415);
    const latin1 = await upload(t.owner.cookie, hid, { kind: 'harvests', mode: 'preview', csv: new Uint8Array([0x64, 0x61, 0x74, 0x65, 0x0a, 0xe9, 0xff]) });
    expect(latin1.status).toBe(200);
    expect(latin1.body.ok).toBe(false);
    expect(latin1.body.errors[0]).toMatchObject({ row: 0, message: expect.stringMatching(/UTF-8/) });
    const json = await apiAs(t.owner.cookie, 'POST', `/api/households/${hid}/imports`, { kind: 'harvests' });
    expect(json.status).toBe(415);
  });

  it('answers 400 for a missing kind or file, and 403 to a viewer', async () => {
    const noKind = await upload(t.owner.cookie, hid, { mode: 'preview', csv: goodLog });
    expect(noKind.status).toBe(400);
    expect(noKind.body.error.fields.kind).toBeDefined();
    const form = new FormData();
    form.set('kind', 'harvests');
    const noFile = await api(`/api/households/${hid}/imports`, { method: 'POST', headers: { cookie: t.owner.cookie, origin: BASE_URL }, body: form });
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fields.file).toBeDefined();
    expect((await upload(t.viewer.cookie, hid, { kind: 'harvests', mode: 'preview', csv: goodLog })).status).toBe(403);
    expect((await upload(t.outsider.cookie, hid, { kind: 'harvests', mode: 'preview', csv: goodLog })).status).toBe(404);
  });
});

describe('exports', () => {
  it('exports the harvest log so that it re-imports to the same totals', async () => {
    const before = await allHarvests(t.owner.cookie, hid);
    const res = await fetch(`${BASE_URL}/api/households/${hid}/exports/harvests.csv`, { headers: { cookie: t.viewer.cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="[a-z0-9-]+-harvests-\d{4}-\d{2}-\d{2}\.csv"$/);
    const bytes = new Uint8Array(await res.arrayBuffer());
    // A UTF-8 byte-order mark first, so spreadsheet programs read accents right.
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const csv = new TextDecoder('utf-8', { ignoreBOM: true }).decode(bytes);
    expect(csv.startsWith('\uFEFFdate,crop,variety,food_code,dataset,quantity,unit,use,spread_months,preserve_method,trimmed,note\r\n')).toBe(true);

    const copy = await createHousehold(t.owner.cookie, { name: 'Copy plot' });
    const crops = (await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/crops?includeArchived=1`)).body.crops;
    const createCrops = crops.map((c: any) => ({ name: c.name, ...(c.variety ? { variety: c.variety } : {}), category: c.category, foodId: c.foodId }));
    const r = await upload(t.owner.cookie, copy.id, { kind: 'harvests', mode: 'commit', csv, createCrops });
    expect(r.status).toBe(201);
    const after = await allHarvests(t.owner.cookie, copy.id);
    expect(after.total).toBe(before.total);
    expect(after.totals.grams).toBeCloseTo(before.totals.grams, 6);
    expect(after.totals.edibleGrams).toBeCloseTo(before.totals.edibleGrams, 6);
  });

  it('exports bought food (semicolon, decimal commas) that re-imports to the same totals', async () => {
    await apiAs(t.owner.cookie, 'POST', `/api/households/${hid}/purchases`, { date: '2025-05-01', foodId: await foodId('09040'), quantity: 2.5, unit: 'lb', price: 3.49, currency: 'USD' });
    await apiAs(t.owner.cookie, 'POST', `/api/households/${hid}/purchases`, { date: '2025-05-02', foodId: await foodId('20081'), quantity: 16, unit: 'kg', spreadMonths: 4, note: 'sack; "bulk"' });
    const before = await allPurchases(t.owner.cookie, hid);
    const res = await api(`/api/households/${hid}/exports/purchases.csv?delimiter=semicolon`, { headers: { cookie: t.owner.cookie } });
    expect(res.status).toBe(200);
    expect(res.body).toMatch(/;2,5;lb;3,49;USD;/);
    const copy = await createHousehold(t.owner.cookie, { name: 'Copy shop' });
    const r = await upload(t.owner.cookie, copy.id, { kind: 'purchases', mode: 'commit', csv: res.body });
    expect(r.status).toBe(201);
    const after = await allPurchases(t.owner.cookie, copy.id);
    expect(after.total).toBe(before.total);
    expect(after.totals.edibleGrams).toBeCloseTo(before.totals.edibleGrams, 6);
    expect(after.purchases.find((p) => p.unit === 'kg')?.note).toBe('sack; "bulk"');
  });

  it('exports crops and people as CSV and the whole household as JSON', async () => {
    await pool.query('INSERT INTO people (household_id, name, sex, birth_year, activity, at_home_pct) VALUES (?, ?, ?, ?, ?, ?)', [hid, 'Ana', 'female', 1988, 'active', 85]);
    // (api() reads the body with res.text(), which drops the byte-order mark)
    const crops = await api(`/api/households/${hid}/exports/crops.csv`, { headers: { cookie: t.owner.cookie } });
    expect(crops.body.split('\r\n')[0]).toBe('name,variety,category,food_code,edible_fraction,default_use,default_spread_months,not_food');
    expect(crops.body).toContain('Potato,Charlotte,root_tuber,11352,');
    const people = await api(`/api/households/${hid}/exports/people.csv`, { headers: { cookie: t.owner.cookie } });
    expect(people.body.split('\r\n').slice(0, 2)).toEqual([
      'name,sex,age_years,birth_year,height_cm,weight_kg,activity,condition,kcal_per_day,at_home_pct,present_from,present_to,birth_month,pregnancy_due_month,lactation_from,lactation_to,fed_from_household,diet',
      'Ana,female,,1988,,,active,none,,85,,,,,,,false,omnivore',
    ]);
    // The backup holds people's body data: the owner's to download (src/lib/privacy.ts).
    expect((await api(`/api/households/${hid}/exports/backup.json`, { headers: { cookie: t.viewer.cookie } })).status).toBe(403);
    const backup = await api(`/api/households/${hid}/exports/backup.json`, { headers: { cookie: t.owner.cookie } });
    expect(backup.status).toBe(200);
    expect(backup.headers.get('content-disposition')).toMatch(/backup-\d{4}-\d{2}-\d{2}\.json"$/);
    expect(backup.body).toMatchObject({ format: 'selfsown-household-backup', version: 1, household: { id: hid } });
    expect(backup.body.harvests).toHaveLength((await allHarvests(t.owner.cookie, hid)).total);
    expect(backup.body.purchases).toHaveLength((await allPurchases(t.owner.cookie, hid)).total);
    expect(backup.body.people).toEqual([expect.objectContaining({ name: 'Ana', birthYear: 1988 })]);
    expect(backup.body.crops.map((c: { name: string }) => c.name)).toContain('Oca');
  });

  it('answers 404 for an unknown export and to an outsider', async () => {
    expect((await api(`/api/households/${hid}/exports/secrets.csv`, { headers: { cookie: t.owner.cookie } })).status).toBe(404);
    expect((await api(`/api/households/${hid}/exports/harvests.csv`, { headers: { cookie: t.outsider.cookie } })).status).toBe(404);
    expect((await api(`/api/households/${hid}/exports/harvests.csv?delimiter=tab`, { headers: { cookie: t.owner.cookie } })).status).toBe(400);
  });
});
