import { beforeAll, describe, expect, it } from 'vitest';
import { allHarvests, foodId, logHarvest, makeCrop, upload } from '../support/entries';
import { api } from '../support/env';
import { apiAs, createHousehold, householdWithRoles, type RoleFixture } from '../support/users';

// 1 US cup = 236.5882365 ml exactly (NIST Handbook 44, Appendix C)
const CUP_ML = 236.5882365;
// USDA SR28 01077 "Milk, whole, 3.25% milkfat", Weight file: 1 cup = 244 g (edible portion)
const MILK_CUP_G = 244;

let t: RoleFixture;
let hid: number;
let eggFood: number;
let milkFood: number;
let spinachFood: number;
let radishFood: number;
let eggs: { id: number };
let spinach: { id: number };
let radish: { id: number };
const h = (path = '') => `/api/households/${hid}${path}`;

beforeAll(async () => {
  t = await householdWithRoles();
  hid = t.household.id;
  eggFood = await foodId('01123'); // USDA SR28 01123 "Egg, whole, raw, fresh": 12 % refuse, 1 large = 50 g
  milkFood = await foodId('01077');
  spinachFood = await foodId('11457'); // USDA SR28 11457 "Spinach, raw": 1 bunch = 340 g, no piece or head
  radishFood = await foodId('11429'); // USDA SR28 11429 "Radishes, raw": 10 % refuse, 1 large = 9 g, no bunch
  eggs = await makeCrop(t.owner.cookie, hid, { name: 'Hens eggs', foodId: eggFood, category: 'other' });
  spinach = await makeCrop(t.owner.cookie, hid, { name: 'Spinach', foodId: spinachFood, category: 'leafy_green' });
  radish = await makeCrop(t.owner.cookie, hid, { name: 'Radish', foodId: radishFood, category: 'root_tuber', countGrams: 120 });
});

describe('harvests by count', () => {
  it("weighs 12 eggs by SR28's 1 large = 50 g, edible as logged, and names the source", async () => {
    const r = await logHarvest(t.grower.cookie, hid, { date: '2026-05-02', cropId: eggs.id, quantity: 12, unit: 'piece' });
    // 12 × 50 g = 600 g; SR28's household weights are edible portion, so the 12 % shell is not taken again
    expect(r).toMatchObject({ unit: 'piece', quantity: 12, grams: 600, edibleGrams: 600, weightSource: 'USDA SR28 01123, 1 large = 50 g' });
    const got = await apiAs(t.viewer.cookie, 'GET', h(`/harvests/${r.id}`));
    expect(got.body.harvest.weightSource).toBe('USDA SR28 01123, 1 large = 50 g');
  });

  it("uses the crop's own weight of one first, and takes the food's refuse off it", async () => {
    const r = await logHarvest(t.grower.cookie, hid, { date: '2026-05-02', cropId: radish.id, quantity: 3, unit: 'bunch' });
    // 3 × 120 g = 360 g; USDA SR28 11429: 10 % refuse → 324 g
    expect(r.grams).toBe(360);
    expect(r.edibleGrams).toBeCloseTo(324, 9);
    expect(r.weightSource).toBe('Your crop Radish: 1 bunch = 120 g');
    // Weighed trimmed, nothing comes off.
    const trimmed = await logHarvest(t.grower.cookie, hid, { date: '2026-05-02', cropId: radish.id, quantity: 1, unit: 'bunch', trimmed: true });
    expect(trimmed.edibleGrams).toBe(120);
  });

  it('answers 422 naming what to do when nothing gives a weight, storing nothing', async () => {
    const before = (await allHarvests(t.owner.cookie, hid)).total;
    const r = await apiAs(t.grower.cookie, 'POST', h('/harvests'), { date: '2026-05-02', cropId: spinach.id, quantity: 2, unit: 'head' });
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('no_unit_weight');
    expect(r.body.error.fields.unit).toBe('There is no weight for one head of Spinach (USDA SR28 11457 has no household measure for one head): weigh it, or set a weight of one on the crop.');
    expect((await allHarvests(t.owner.cookie, hid)).total).toBe(before);
  });

  it('splits a count between uses, each part weighed', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', h('/harvests'), { date: '2026-05-03', cropId: eggs.id, unit: 'piece', parts: [{ quantity: 10, use: 'fresh' }, { quantity: 2, use: 'given' }] });
    expect(r.status).toBe(201);
    // USDA SR28 01123: 1 large = 50 g
    expect(r.body.harvests.map((p: { grams: number }) => p.grams)).toEqual([500, 100]);
    expect(r.body.harvests.every((p: { weightSource: string }) => p.weightSource === 'USDA SR28 01123, 1 large = 50 g')).toBe(true);
  });

  it('weighs again when an edit changes the unit, the amount or the crop', async () => {
    const e = await logHarvest(t.grower.cookie, hid, { date: '2026-05-04', cropId: eggs.id, quantity: 6, unit: 'piece' });
    const toKg = await apiAs(t.grower.cookie, 'PATCH', h(`/harvests/${e.id}`), { quantity: 0.7, unit: 'kg' });
    expect(toKg.status).toBe(200);
    // A weight: 700 g as logged, the 12 % refuse of USDA SR28 01123 taken off, no weight source
    expect(toKg.body.harvest).toMatchObject({ grams: 700, weightSource: null });
    expect(toKg.body.harvest.edibleGrams).toBeCloseTo(616, 9);
    const back = await apiAs(t.grower.cookie, 'PATCH', h(`/harvests/${e.id}`), { quantity: 10, unit: 'piece' });
    expect(back.body.harvest).toMatchObject({ grams: 500, edibleGrams: 500, weightSource: 'USDA SR28 01123, 1 large = 50 g' });
    const toRadish = await apiAs(t.grower.cookie, 'PATCH', h(`/harvests/${e.id}`), { cropId: radish.id });
    expect(toRadish.body.harvest).toMatchObject({ grams: 1200, weightSource: 'Your crop Radish: 1 piece = 120 g' });
    const toSpinach = await apiAs(t.grower.cookie, 'PATCH', h(`/harvests/${e.id}`), { cropId: spinach.id });
    expect(toSpinach.status).toBe(422);
    expect(toSpinach.body.error.code).toBe('no_unit_weight');
  });

  it("weighs the crop's counted harvests again when its weight of one changes, and refuses to leave them without one", async () => {
    const crop = await makeCrop(t.owner.cookie, hid, { name: 'Beetroot bunches', foodId: spinachFood, category: 'other', countGrams: 500 });
    const head = await logHarvest(t.grower.cookie, hid, { date: '2026-05-05', cropId: crop.id, quantity: 2, unit: 'head' });
    expect(head.grams).toBe(1000);
    const changed = await apiAs(t.owner.cookie, 'PATCH', h(`/crops/${crop.id}`), { countGrams: 400 });
    expect(changed.status).toBe(200);
    expect(changed.body.crop.countGrams).toBe(400);
    expect((await apiAs(t.owner.cookie, 'GET', h(`/harvests/${head.id}`))).body.harvest).toMatchObject({ grams: 800, weightSource: 'Your crop Beetroot bunches: 1 head = 400 g' });
    // Spinach has no head measure: clearing the weight of one would leave the harvest unweighable.
    const cleared = await apiAs(t.owner.cookie, 'PATCH', h(`/crops/${crop.id}`), { countGrams: null });
    expect(cleared.status).toBe(422);
    expect(cleared.body.error.fields.countGrams).toMatch(/Beetroot bunches has a harvest logged as 2 heads on 2026-05-05/);
    expect((await apiAs(t.owner.cookie, 'GET', h(`/crops/${crop.id}`))).body.crop.countGrams).toBe(400);
  });

  it('checks the weight of one and answers it with the crop and its food measures', async () => {
    expect((await apiAs(t.owner.cookie, 'POST', h('/crops'), { name: 'Leeks', countGrams: 0 })).body.error.fields.countGrams).toBe('The weight of one must be more than 0 g.');
    const got = await apiAs(t.viewer.cookie, 'GET', h(`/crops/${eggs.id}`));
    expect(got.body.crop.countGrams).toBeNull();
    // USDA SR28 01123 Weight file, in its order
    expect(got.body.crop.food.measures).toEqual([{ description: '1 large', grams: 50 }, { description: '1 extra large', grams: 56 }]);
  });
});

describe('bought food by volume and count', () => {
  it('weighs 2 l of whole milk by SR28 1 cup = 244 g', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', h('/purchases'), { date: '2026-05-02', foodId: milkFood, quantity: 2, unit: 'l' });
    expect(r.status).toBe(201);
    // 2000 ml / 236.5882365 ml × 244 g = 2062.66 g
    expect(r.body.purchase.grams).toBeCloseTo((2000 / CUP_ML) * MILK_CUP_G, 9);
    expect(r.body.purchase.grams).toBeCloseTo(2062.66, 2);
    expect(r.body.purchase.edibleGrams).toBeCloseTo(r.body.purchase.grams, 9);
    expect(r.body.purchase.weightSource).toBe('USDA SR28 01077, 1 cup = 244 g; 1 US cup = 236.5882365 ml');
    // An imperial pint: 568.26125 ml (UK Weights and Measures Act 1985)
    const pint = await apiAs(t.grower.cookie, 'PATCH', h(`/purchases/${r.body.purchase.id}`), { quantity: 1, unit: 'pint_imp' });
    expect(pint.body.purchase.grams).toBeCloseTo((568.26125 / CUP_ML) * MILK_CUP_G, 9);
  });

  it('refuses a count of a food with no count measure', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', h('/purchases'), { date: '2026-05-02', foodId: milkFood, quantity: 2, unit: 'piece' });
    expect(r.status).toBe(422);
    expect(r.body.error.fields.unit).toMatch(/^There is no weight for one piece of .*: weigh it and log the weight\.$/);
  });

  it('keeps a staple by the piece and logs it weighed', async () => {
    const s = await apiAs(t.grower.cookie, 'POST', h('/staples'), { foodId: eggFood, label: 'Box of eggs', quantity: 6, unit: 'piece' });
    expect(s.status).toBe(201);
    expect(s.body.staple.unit).toBe('piece');
    const logged = await apiAs(t.grower.cookie, 'POST', h(`/staples/${s.body.staple.id}/log`), { date: '2026-05-06' });
    expect(logged.status).toBe(201);
    // USDA SR28 01123: 6 × 50 g
    expect(logged.body.purchase).toMatchObject({ unit: 'piece', grams: 300, edibleGrams: 300 });
    expect((await apiAs(t.grower.cookie, 'POST', h('/staples'), { foodId: milkFood, quantity: 1, unit: 'head' })).status).toBe(422);
  });
});

describe('CSV with counts and volumes', () => {
  it('imports counts and volumes in common spellings, naming the source in the preview, and exports the unit codes', async () => {
    const home = await createHousehold(t.owner.cookie, { name: 'Counting plot', timezone: 'Europe/London' });
    await makeCrop(t.owner.cookie, home.id, { name: 'Hens eggs', foodId: eggFood, category: 'other' });
    const csv = 'date,crop,food_code,quantity,unit\n2026-05-01,Hens eggs,,12,pcs\n2026-05-02,,01077,1,pt\n';
    const preview = await upload(t.owner.cookie, home.id, { kind: 'harvests', mode: 'preview', csv });
    expect(preview.status).toBe(200);
    expect(preview.body.errors).toEqual([]);
    expect(preview.body.rows[0]).toMatchObject({ unit: 'piece', grams: 600, edibleGrams: 600, weightSource: 'USDA SR28 01123, 1 large = 50 g' });
    // A bare "pt" in a household outside US units is the imperial pint, 568.26125 ml (UK Weights and Measures Act 1985)
    expect(preview.body.rows[1].unit).toBe('pint_imp');
    expect(preview.body.rows[1].grams).toBeCloseTo((568.26125 / CUP_ML) * MILK_CUP_G, 9);
    const commit = await upload(t.owner.cookie, home.id, { kind: 'harvests', mode: 'commit', csv });
    expect(commit.status).toBe(201);
    const exported = await api(`/api/households/${home.id}/exports/harvests.csv`, { headers: { cookie: t.owner.cookie } });
    const lines = String(exported.body).split('\r\n');
    expect(lines[1]).toMatch(/^2026-05-01,Hens eggs,,,,12,piece,/);
    expect(lines[2]).toMatch(/^2026-05-02,,,01077,usda-sr28,1,pint_imp,/);
  });

  it('refuses the whole file when a row has no weight, naming the row and unit', async () => {
    const csv = 'date,food_code,quantity,unit\n2026-05-01,01077,2,litres\n2026-05-01,01077,3,heads\n';
    const r = await upload(t.owner.cookie, hid, { kind: 'purchases', mode: 'commit', csv });
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([{ row: 3, column: 'unit', message: expect.stringMatching(/^There is no weight for one head of /) }]);
  });
});

describe('the household currency', () => {
  it('is guessed from the time zone for a new household, and left empty where the zone says too little', async () => {
    // from memory: Europe/London uses GBP, Europe/Berlin EUR (ISO 4217)
    expect((await createHousehold(t.owner.cookie, { name: 'London plot', timezone: 'Europe/London' })).currency).toBe('GBP');
    expect((await createHousehold(t.owner.cookie, { name: 'Somewhere', timezone: 'UTC' })).currency).toBeNull();
    const chosen = await apiAs(t.owner.cookie, 'POST', '/api/households', { name: 'Chosen', timezone: 'Europe/London', currency: 'eur' });
    expect(chosen.body.household.currency).toBe('EUR');
  });

  it('is set by the owner, checked against ISO 4217, and read by every member', async () => {
    const r = await apiAs(t.owner.cookie, 'PATCH', h(), { currency: 'gbp' });
    expect(r.status).toBe(200);
    expect(r.body.household.currency).toBe('GBP');
    expect((await apiAs(t.viewer.cookie, 'GET', h())).body.household.currency).toBe('GBP');
    const bad = await apiAs(t.owner.cookie, 'PATCH', h(), { currency: 'XYZ' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.currency).toMatch(/ISO 4217/);
    expect((await apiAs(t.grower.cookie, 'PATCH', h(), { currency: 'USD' })).status).toBe(403);
  });

  it('comes from the first purchase with a currency when the household has none, and stays', async () => {
    const plain = await createHousehold(t.owner.cookie, { name: 'No currency yet', timezone: 'UTC' });
    const buy = (currency: string) => apiAs(t.owner.cookie, 'POST', `/api/households/${plain.id}/purchases`, { date: '2026-05-02', foodId: milkFood, quantity: 1, unit: 'l', price: 1.2, currency });
    expect((await buy('chf')).status).toBe(201);
    expect((await apiAs(t.owner.cookie, 'GET', `/api/households/${plain.id}`)).body.household.currency).toBe('CHF');
    expect((await buy('EUR')).status).toBe(201);
    expect((await apiAs(t.owner.cookie, 'GET', `/api/households/${plain.id}`)).body.household.currency).toBe('CHF');
  });
});
