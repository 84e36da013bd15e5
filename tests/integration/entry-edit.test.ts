import { beforeAll, describe, expect, it } from 'vitest';
import { allHarvests, foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, householdWithRoles, type RoleFixture } from '../support/users';

// 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959)
const LB = 453.59237;

let t: RoleFixture;
let hid: number;
let potatoFood: number;
let butternutFood: number;
let flour: number;
let bananas: number;
let potato: { id: number };
let butternut: { id: number };
let foxglove: { id: number };
const harvest = (id: number | string = '') => `/api/households/${hid}/harvests${id === '' ? '' : `/${id}`}`;
const purchase = (id: number | string = '') => `/api/households/${hid}/purchases${id === '' ? '' : `/${id}`}`;

beforeAll(async () => {
  t = await householdWithRoles();
  hid = t.household.id;
  potatoFood = await foodId('11352');
  butternutFood = await foodId('11485');
  flour = await foodId('20081');
  bananas = await foodId('09040');
  potato = await makeCrop(t.owner.cookie, hid, { name: 'Potato', foodId: potatoFood, category: 'root_tuber' });
  butternut = await makeCrop(t.owner.cookie, hid, { name: 'Butternut squash', foodId: butternutFood, category: 'squash' });
  foxglove = await makeCrop(t.owner.cookie, hid, { name: 'Foxglove', category: 'other', notFood: true });
});

describe('mending a harvest', () => {
  it('takes a new crop, and its food and refuse with it', async () => {
    const h = await logHarvest(t.grower.cookie, hid, { date: '2026-08-01', cropId: potato.id, quantity: 2, unit: 'kg' });
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse
    expect(h.edibleGrams).toBeCloseTo(1500, 9);
    const r = await apiAs(t.grower.cookie, 'PATCH', harvest(h.id), { cropId: butternut.id });
    expect(r.status).toBe(200);
    expect(r.body.harvest).toMatchObject({ cropId: butternut.id, foodId: butternutFood, foodCode: '11485', grams: 2000 });
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": 16 % refuse
    expect(r.body.harvest.edibleGrams).toBeCloseTo(2000 * 0.84, 9);
  });

  it('counts every gram once marked as weighed trimmed, and the refuse again when unmarked', async () => {
    const h = await logHarvest(t.grower.cookie, hid, { date: '2026-08-02', cropId: potato.id, quantity: 4, unit: 'lb' });
    const on = await apiAs(t.grower.cookie, 'PATCH', harvest(h.id), { trimmed: true });
    expect(on.body.harvest).toMatchObject({ trimmed: true });
    expect(on.body.harvest.edibleGrams).toBeCloseTo(4 * LB, 9);
    const off = await apiAs(t.grower.cookie, 'PATCH', harvest(h.id), { trimmed: false });
    // USDA SR28, NDB 11352: 25 % refuse
    expect(off.body.harvest.edibleGrams).toBeCloseTo(4 * LB * 0.75, 9);
  });

  it('changes the months in store and the preserving method of the uses that have them', async () => {
    const h = await logHarvest(t.grower.cookie, hid, { date: '2026-08-03', cropId: potato.id, quantity: 10, unit: 'kg', use: 'stored', spreadMonths: 4 });
    const months = await apiAs(t.grower.cookie, 'PATCH', harvest(h.id), { spreadMonths: 6 });
    expect(months.body.harvest).toMatchObject({ spreadMonths: 6, use: 'stored' });
    const kept = await apiAs(t.grower.cookie, 'PATCH', harvest(h.id), { use: 'preserved', preserveMethod: 'frozen', spreadMonths: 8 });
    expect(kept.body.harvest).toMatchObject({ use: 'preserved', preserveMethod: 'frozen', spreadMonths: 8 });
    const fresh = await apiAs(t.grower.cookie, 'PATCH', harvest(h.id), { use: 'fresh', spreadMonths: 3 });
    expect(fresh.status).toBe(400);
    expect(fresh.body.error.fields.spreadMonths).toMatch(/Only stored or preserved/);
  });

  it('refuses a crop marked not food for a harvest that is eaten', async () => {
    const h = await logHarvest(t.grower.cookie, hid, { date: '2026-08-04', cropId: potato.id, quantity: 1, unit: 'kg' });
    const r = await apiAs(t.grower.cookie, 'PATCH', harvest(h.id), { cropId: foxglove.id });
    expect(r.status).toBe(400);
    expect(r.body.error.fields.use).toMatch(/not food/);
  });
});

describe('mending bought food', () => {
  it('takes a new food and its refuse', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', purchase(), { date: '2026-03-02', foodId: flour, quantity: 3, unit: 'kg' });
    // USDA SR28, NDB 20081 "Wheat flour, white, all-purpose, enriched, bleached": 0 % refuse
    expect(r.body.purchase.edibleGrams).toBe(3000);
    const p = await apiAs(t.grower.cookie, 'PATCH', purchase(r.body.purchase.id), { foodId: bananas });
    expect(p.status).toBe(200);
    expect(p.body.purchase).toMatchObject({ foodId: bananas, foodCode: '09040', grams: 3000 });
    // USDA SR28, NDB 09040 "Bananas, raw": 36 % refuse
    expect(p.body.purchase.edibleGrams).toBeCloseTo(3000 * 0.64, 9);
    const trimmed = await apiAs(t.grower.cookie, 'PATCH', purchase(r.body.purchase.id), { trimmed: true });
    expect(trimmed.body.purchase.edibleGrams).toBe(3000);
  });

  it('changes and clears price and currency, and the months a bulk buy lasts', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', purchase(), { date: '2026-03-03', foodId: flour, quantity: 25, unit: 'kg' });
    const id = r.body.purchase.id;
    const priced = await apiAs(t.grower.cookie, 'PATCH', purchase(id), { price: 31.9, currency: 'eur', spreadMonths: 6 });
    expect(priced.body.purchase).toMatchObject({ price: 31.9, currency: 'EUR', spreadMonths: 6 });
    const cleared = await apiAs(t.grower.cookie, 'PATCH', purchase(id), { price: null, currency: null });
    expect(cleared.body.purchase).toMatchObject({ price: null, currency: null, spreadMonths: 6 });
    const bad = await apiAs(t.grower.cookie, 'PATCH', purchase(id), { currency: 'euro', price: -1 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['currency', 'price']);
  });
});

describe('mending a split weighing', () => {
  async function split(date: string) {
    // 12 kg of potatoes: 2 kg eaten fresh, 10 kg stored
    const r = await apiAs(t.grower.cookie, 'POST', harvest(), {
      date,
      cropId: potato.id,
      unit: 'kg',
      parts: [
        { quantity: 2, use: 'fresh' },
        { quantity: 10, use: 'stored', spreadMonths: 5 },
      ],
    });
    expect(r.status).toBe(201);
    return r.body.harvests as { id: number; splitGroup: string }[];
  }
  const part = async (id: number) => (await apiAs(t.owner.cookie, 'GET', harvest(id))).body.harvest;

  it("moves every part to a part's new date and crop", async () => {
    const [fresh, stored] = await split('2026-09-10');
    expect((await apiAs(t.grower.cookie, 'PATCH', harvest(fresh!.id), { date: '2026-09-12' })).status).toBe(200);
    expect((await part(stored!.id)).date).toBe('2026-09-12');
    expect((await apiAs(t.grower.cookie, 'PATCH', harvest(stored!.id), { cropId: butternut.id })).status).toBe(200);
    const after = await part(fresh!.id);
    expect(after).toMatchObject({ cropId: butternut.id, foodId: butternutFood, use: 'fresh', quantity: 2 });
    // USDA SR28, NDB 11485: 16 % refuse
    expect(after.edibleGrams).toBeCloseTo(2000 * 0.84, 9);
  });

  it("changes a part's amount and use for that part only", async () => {
    const [fresh, stored] = await split('2026-09-13');
    const r = await apiAs(t.grower.cookie, 'PATCH', harvest(fresh!.id), { quantity: 3, use: 'given' });
    expect(r.body.harvest).toMatchObject({ quantity: 3, use: 'given', grams: 3000 });
    expect(await part(stored!.id)).toMatchObject({ quantity: 10, use: 'stored', spreadMonths: 5, date: '2026-09-13' });
  });

  it('changes no part when the new crop does not suit one of them', async () => {
    const [fresh, stored] = await split('2026-09-14');
    // The edited part is not eaten, but its fresh sibling would be: one transaction, nothing kept.
    await apiAs(t.grower.cookie, 'PATCH', harvest(stored!.id), { use: 'given' });
    const r = await apiAs(t.grower.cookie, 'PATCH', harvest(stored!.id), { cropId: foxglove.id });
    expect(r.status).toBe(400);
    expect((await part(stored!.id)).cropId).toBe(potato.id);
    expect((await part(fresh!.id)).cropId).toBe(potato.id);
  });

  it('keeps the other parts when one is deleted, and makes a lone part an ordinary harvest', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', harvest(), {
      date: '2026-09-15',
      cropId: potato.id,
      unit: 'kg',
      parts: [
        { quantity: 1, use: 'fresh' },
        { quantity: 2, use: 'given' },
        { quantity: 3, use: 'stored' },
      ],
    });
    const [a, b, c] = r.body.harvests as { id: number; splitGroup: string }[];
    expect((await apiAs(t.grower.cookie, 'DELETE', harvest(a!.id))).status).toBe(204);
    expect((await part(b!.id)).splitGroup).toBe(a!.splitGroup);
    expect((await part(c!.id)).splitGroup).toBe(a!.splitGroup);
    expect((await apiAs(t.grower.cookie, 'DELETE', harvest(b!.id))).status).toBe(204);
    expect(await part(c!.id)).toMatchObject({ splitGroup: null, quantity: 3, use: 'stored' });
    const day = await allHarvests(t.owner.cookie, hid, 'from=2026-09-15&to=2026-09-15');
    expect(day.harvests.map((h: { id: number }) => h.id)).toEqual([c!.id]);
    expect((await apiAs(t.grower.cookie, 'DELETE', harvest(b!.id))).status).toBe(404);
  });
});
