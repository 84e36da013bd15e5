import { beforeAll, describe, expect, it } from 'vitest';
import { allHarvests, foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, householdWithRoles, type RoleFixture } from '../support/users';

let t: RoleFixture;
let hid: number;
let potatoFood: number;
let butternutFood: number;
const url = (path = '') => `/api/households/${hid}/crops${path}`;

beforeAll(async () => {
  t = await householdWithRoles();
  hid = t.household.id;
  potatoFood = await foodId('11352');
  butternutFood = await foodId('11485');
});

describe('the crop catalogue', () => {
  it('shows the matched food with its refuse, energy and protein', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', url(), { name: ' Potato ', variety: 'Charlotte', foodId: potatoFood, category: 'root_tuber', defaultUse: 'stored', defaultSpreadMonths: 6 });
    expect(r.status).toBe(201);
    expect(r.body.crop).toMatchObject({ name: 'Potato', variety: 'Charlotte', displayName: 'Potato (Charlotte)', category: 'root_tuber', defaultUse: 'stored', defaultSpreadMonths: 6, notFood: false, archived: false, harvestCount: 0, lastHarvestDate: null, edibleFraction: null });
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse, 77 kcal and 2.05 g protein per 100 g
    expect(r.body.crop.food).toEqual({
      id: potatoFood,
      dataset: 'usda-sr28',
      code: '11352',
      name: 'Potatoes, flesh and skin, raw',
      refusePct: 25,
      kcalPer100g: 77,
      proteinPer100g: 2.05,
      // USDA SR28 11352, Weight file (household measures, in its order)
      measures: [
        { description: '0.5 cup, diced', grams: 75 },
        { description: '1 Potato, large (3" to 4-1/4" dia)', grams: 369 },
      ],
    });
  });

  it('refuses a second crop of the same name and variety (409) and bad input (400)', async () => {
    const dup = await apiAs(t.owner.cookie, 'POST', url(), { name: 'potato', variety: 'charlotte', foodId: potatoFood, category: 'root_tuber' });
    expect(dup.status).toBe(409);
    expect(dup.body.error.code).toBe('duplicate');
    for (const [body, field] of [
      [{ name: '', category: 'grain' }, 'name'],
      [{ name: 'Oats', category: 'cereal' }, 'category'],
      [{ name: 'Oats', category: 'grain', edibleFraction: 1.5 }, 'edibleFraction'],
      [{ name: 'Foxglove', category: 'other', notFood: true, foodId: potatoFood }, 'foodId'],
      [{ name: 'Oats', category: 'grain', foodId: 99_999_999 }, 'foodId'],
    ] as const) {
      const r = await apiAs(t.owner.cookie, 'POST', url(), body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(r.body.error.fields)).toContain(field);
    }
  });

  it('lists recently harvested crops first, then by name', async () => {
    const kale = await makeCrop(t.owner.cookie, hid, { name: 'Kale', foodId: await foodId('11233'), category: 'leafy_green' });
    await makeCrop(t.owner.cookie, hid, { name: 'Apples', foodId: await foodId('09003'), category: 'fruit' });
    await logHarvest(t.owner.cookie, hid, { date: '2026-08-01', cropId: kale.id, quantity: 400, unit: 'g' });
    const r = await apiAs(t.viewer.cookie, 'GET', url());
    expect(r.status).toBe(200);
    expect(r.body.crops.map((c: { displayName: string }) => c.displayName)).toEqual(['Kale', 'Apples', 'Potato (Charlotte)']);
    expect(r.body.crops[0]).toMatchObject({ harvestCount: 1, lastHarvestDate: '2026-08-01' });
  });

  it('hides an archived crop unless asked, and keeps its harvests', async () => {
    const kale = (await apiAs(t.owner.cookie, 'GET', url())).body.crops.find((c: { name: string }) => c.name === 'Kale');
    const a = await apiAs(t.grower.cookie, 'PATCH', url(`/${kale.id}`), { archived: true });
    expect(a.status).toBe(200);
    expect(a.body.crop.archived).toBe(true);
    expect((await apiAs(t.owner.cookie, 'GET', url())).body.crops.map((c: { name: string }) => c.name)).not.toContain('Kale');
    expect((await apiAs(t.owner.cookie, 'GET', url('?includeArchived=1'))).body.crops.map((c: { name: string }) => c.name)).toContain('Kale');
    expect((await allHarvests(t.owner.cookie, hid, `cropId=${kale.id}`)).total).toBe(1);
  });

  it('refuses to delete a crop with harvests (409 in_use) and deletes one without', async () => {
    const kale = (await apiAs(t.owner.cookie, 'GET', url('?includeArchived=1'))).body.crops.find((c: { name: string }) => c.name === 'Kale');
    const d = await apiAs(t.owner.cookie, 'DELETE', url(`/${kale.id}`));
    expect(d.status).toBe(409);
    expect(d.body.error.code).toBe('in_use');
    const spare = await makeCrop(t.owner.cookie, hid, { name: 'Spare', category: 'other' });
    expect((await apiAs(t.viewer.cookie, 'DELETE', url(`/${spare.id}`))).status).toBe(403);
    expect((await apiAs(t.grower.cookie, 'DELETE', url(`/${spare.id}`))).status).toBe(204);
    expect((await apiAs(t.owner.cookie, 'GET', url(`/${spare.id}`))).status).toBe(404);
  });

  it('names plantings, or harvests and plantings, when a crop in use cannot be deleted', async () => {
    const onlyPlanted = await makeCrop(t.owner.cookie, hid, { name: 'Leek', category: 'other' });
    const planted = await apiAs(t.grower.cookie, 'POST', `/api/households/${hid}/plantings`, { cropId: onlyPlanted.id, area: 2, seasonYear: 2026 });
    expect(planted.status).toBe(201);
    const d = await apiAs(t.owner.cookie, 'DELETE', url(`/${onlyPlanted.id}`));
    expect(d.status).toBe(409);
    expect(d.body.error.code).toBe('in_use');
    expect(d.body.error.message).toMatch(/has plantings/);
    expect(d.body.error.message).not.toMatch(/harvest/);

    await logHarvest(t.owner.cookie, hid, { date: '2026-10-02', cropId: onlyPlanted.id, quantity: 1, unit: 'kg', use: 'fresh' });
    const both = await apiAs(t.owner.cookie, 'DELETE', url(`/${onlyPlanted.id}`));
    expect(both.status).toBe(409);
    expect(both.body.error.message).toMatch(/has harvests logged and plantings/);
    expect((await apiAs(t.owner.cookie, 'GET', url(`/${onlyPlanted.id}`))).status).toBe(200);
  });

  it('gives a crop added without a category the kind of the reference crop its name matches, singular or plural', async () => {
    // reference-data/crops.csv rows "potatoes" (root_tuber), "onions" ("Onions, storage": other), "dry-peas" (legume)
    const cases: [string, string][] = [
      ['Potatoes', 'root_tuber'],
      ['Carrot', 'root_tuber'],
      ['butternut squash', 'squash'],
      ['Dry peas', 'legume'],
      ['Dahlia tubers', 'other'],
    ];
    for (const [name, category] of cases) {
      const r = await apiAs(t.grower.cookie, 'POST', url(), { name, variety: 'category test' });
      expect(r.status, name).toBe(201);
      expect(r.body.crop.category, name).toBe(category);
    }
    // A category given by the grower always wins over the name.
    const own = await apiAs(t.grower.cookie, 'POST', url(), { name: 'Potatoes', variety: 'for flowers', category: 'other' });
    expect(own.body.crop.category).toBe('other');
  });

  it("carries a new food match into the crop's harvests", async () => {
    const squash = await makeCrop(t.owner.cookie, hid, { name: 'Winter squash', foodId: potatoFood, category: 'squash' });
    const h = await logHarvest(t.owner.cookie, hid, { date: '2026-09-30', cropId: squash.id, quantity: 10, unit: 'kg', use: 'stored' });
    const trimmed = await logHarvest(t.owner.cookie, hid, { date: '2026-09-30', cropId: squash.id, quantity: 1, unit: 'kg', trimmed: true });
    // USDA SR28, NDB 11352: 25 % refuse (the wrong match)
    expect(h.edibleGrams).toBeCloseTo(7500, 9);
    const p = await apiAs(t.owner.cookie, 'PATCH', url(`/${squash.id}`), { foodId: butternutFood });
    expect(p.status).toBe(200);
    expect(p.body.crop.food.code).toBe('11485');
    const after = (await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/harvests/${h.id}`)).body.harvest;
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": 16 % refuse
    expect(after).toMatchObject({ foodId: butternutFood, foodCode: '11485' });
    expect(after.edibleGrams).toBeCloseTo(8400, 9);
    expect((await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/harvests/${trimmed.id}`)).body.harvest.edibleGrams).toBeCloseTo(1000, 9);
    const own = await apiAs(t.owner.cookie, 'PATCH', url(`/${squash.id}`), { edibleFraction: 0.5 });
    expect(own.body.crop.edibleFraction).toBe(0.5);
    expect((await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/harvests/${h.id}`)).body.harvest.edibleGrams).toBeCloseTo(5000, 9);
  });

  it('refuses to mark a crop not food while its harvests are logged as eaten', async () => {
    const potato = (await apiAs(t.owner.cookie, 'GET', url())).body.crops.find((c: { name: string }) => c.name === 'Potato');
    await logHarvest(t.owner.cookie, hid, { date: '2026-07-01', cropId: potato.id, quantity: 1, unit: 'kg' });
    const r = await apiAs(t.owner.cookie, 'PATCH', url(`/${potato.id}`), { notFood: true, foodId: null, defaultUse: null });
    expect(r.status).toBe(409);
    const stillFood = await apiAs(t.owner.cookie, 'PATCH', url(`/${potato.id}`), { notFood: true });
    expect(stillFood.status).toBe(400); // still matched to a food
  });

  it('keeps crops to their household and roles', async () => {
    const mine = (await apiAs(t.owner.cookie, 'GET', url())).body.crops[0];
    expect((await apiAs(t.outsider.cookie, 'GET', url())).status).toBe(404);
    expect((await apiAs(t.outsider.cookie, 'GET', url(`/${mine.id}`))).status).toBe(404);
    expect((await apiAs(t.viewer.cookie, 'POST', url(), { name: 'Oats', category: 'grain' })).status).toBe(403);
    expect((await apiAs(t.viewer.cookie, 'PATCH', url(`/${mine.id}`), { name: 'Renamed' })).status).toBe(403);
    expect((await apiAs('', 'GET', url())).status).toBe(401);
    // an outsider's own household cannot reach this crop by id
    const other = await apiAs(t.outsider.cookie, 'POST', '/api/households', { name: 'Theirs', timezone: 'UTC', units: 'metric', yearStartMonth: 1 });
    expect((await apiAs(t.outsider.cookie, 'GET', `/api/households/${other.body.household.id}/crops/${mine.id}`)).status).toBe(404);
    expect((await apiAs(t.outsider.cookie, 'PATCH', `/api/households/${other.body.household.id}/crops/${mine.id}`, { name: 'X' })).status).toBe(404);
  });
});
