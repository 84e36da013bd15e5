import { beforeAll, describe, expect, it } from 'vitest';
import { defaultSpreadMonths } from '@/lib/crop-categories';
import { allHarvests, foodId, logHarvest, makeCrop } from '../support/entries';
import { BASE_URL } from '../support/env';
import { apiAs, createHousehold, householdWithRoles, type RoleFixture } from '../support/users';

// 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959)
const LB = 453.59237;
// 1 oz = 1/16 lb = 28.349523125 g exactly (International Yard and Pound Agreement, 1959)
const OZ = 28.349523125;

let t: RoleFixture;
let hid: number;
let potatoFood: number;
let butternutFood: number;
let potato: { id: number };
let butternut: { id: number };
let foxglove: { id: number };
const url = (path = '') => `/api/households/${hid}/harvests${path}`;

beforeAll(async () => {
  t = await householdWithRoles();
  hid = t.household.id;
  potatoFood = await foodId('11352');
  butternutFood = await foodId('11485');
  potato = await makeCrop(t.owner.cookie, hid, { name: 'Potato', variety: 'Charlotte', foodId: potatoFood, category: 'root_tuber' });
  butternut = await makeCrop(t.owner.cookie, hid, { name: 'Butternut squash', foodId: butternutFood, category: 'squash' });
  foxglove = await makeCrop(t.owner.cookie, hid, { name: 'Foxglove', category: 'other', notFood: true });
});

describe('logging a harvest', () => {
  it('converts pounds to grams and takes off the potato refuse', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', url(), { date: '2026-07-14', cropId: potato.id, quantity: 10, unit: 'lb', use: 'fresh' });
    expect(r.status).toBe(201);
    const h = r.body.harvest;
    expect(h.grams).toBeCloseTo(10 * LB, 9); // 4535.9237 g
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse
    expect(h.edibleGrams).toBeCloseTo(10 * LB * 0.75, 9);
    expect(h).toMatchObject({ cropId: potato.id, cropName: 'Potato (Charlotte)', foodId: potatoFood, foodCode: '11352', quantity: 10, unit: 'lb', use: 'fresh', spreadMonths: 1, trimmed: false, splitGroup: null });
  });

  it('converts ounces and takes off the butternut squash refuse', async () => {
    const h = await logHarvest(t.owner.cookie, hid, { date: '2026-09-20', cropId: butternut.id, quantity: 16, unit: 'oz' });
    expect(h.grams).toBeCloseTo(16 * OZ, 9); // = 1 lb = 453.59237 g
    expect(h.grams).toBeCloseTo(LB, 9);
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": 16 % refuse
    expect(h.edibleGrams).toBeCloseTo(LB * 0.84, 9);
  });

  it('counts every gram of a harvest weighed already trimmed', async () => {
    const h = await logHarvest(t.owner.cookie, hid, { date: '2026-07-15', cropId: potato.id, quantity: 2, unit: 'kg', trimmed: true });
    expect(h.grams).toBe(2000);
    expect(h.edibleGrams).toBe(2000);
  });

  it('takes a reference food chosen directly instead of a crop', async () => {
    const h = await logHarvest(t.owner.cookie, hid, { date: '2026-07-16', foodId: potatoFood, quantity: 1, unit: 'kg' });
    expect(h).toMatchObject({ cropId: null, cropName: null, foodId: potatoFood, foodName: 'Potatoes, flesh and skin, raw' });
    // USDA SR28, NDB 11352: 25 % refuse
    expect(h.edibleGrams).toBeCloseTo(750, 9);
  });

  it("uses the crop's own edible fraction over the food's refuse", async () => {
    const peeled = await makeCrop(t.owner.cookie, hid, { name: 'Potato', variety: 'peeled deep', foodId: potatoFood, category: 'root_tuber', edibleFraction: 0.6 });
    const h = await logHarvest(t.owner.cookie, hid, { date: '2026-07-17', cropId: peeled.id, quantity: 1, unit: 'kg' });
    expect(h.edibleGrams).toBeCloseTo(600, 9);
  });

  it('fills the spread of a stored harvest from the crop category when none is given', async () => {
    const h = await logHarvest(t.owner.cookie, hid, { date: '2026-09-01', cropId: potato.id, quantity: 20, unit: 'kg', use: 'stored' });
    expect(h.spreadMonths).toBe(defaultSpreadMonths({ use: 'stored', category: 'root_tuber' }));
    const own = await makeCrop(t.owner.cookie, hid, { name: 'Butternut squash', variety: 'long keeper', foodId: butternutFood, category: 'squash', defaultSpreadMonths: 7 });
    const h2 = await logHarvest(t.owner.cookie, hid, { date: '2026-09-02', cropId: own.id, quantity: 5, unit: 'kg', use: 'stored' });
    expect(h2.spreadMonths).toBe(7);
    const h3 = await logHarvest(t.owner.cookie, hid, { date: '2026-09-03', cropId: own.id, quantity: 5, unit: 'kg', use: 'stored', spreadMonths: 3 });
    expect(h3.spreadMonths).toBe(3);
  });

  it('lets a crop marked not food be logged only as not eaten, with no edible grams', async () => {
    const bad = await apiAs(t.owner.cookie, 'POST', url(), { date: '2026-06-01', cropId: foxglove.id, quantity: 1, unit: 'kg', use: 'fresh' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.use).toMatch(/not food/);
    const ok = await logHarvest(t.owner.cookie, hid, { date: '2026-06-01', cropId: foxglove.id, quantity: 1, unit: 'kg', use: 'given' });
    expect(ok.foodId).toBeNull();
    expect(ok.edibleGrams).toBe(0);
  });
});

/** A day two days after today's UTC date: after today in every time zone (UTC−12 to UTC+14). */
function inTwoDays(): string {
  return new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10);
}

describe('preserved harvests', () => {
  it('stores the preserving method of a preserved harvest, lets a PATCH change it, and drops it when the use changes', async () => {
    const h = await logHarvest(t.owner.cookie, hid, { date: '2026-08-02', cropId: butternut.id, quantity: 3, unit: 'kg', use: 'preserved', spreadMonths: 6, preserveMethod: 'canned' });
    expect(h).toMatchObject({ use: 'preserved', preserveMethod: 'canned', spreadMonths: 6 });
    const fresh = await logHarvest(t.owner.cookie, hid, { date: '2026-08-02', cropId: butternut.id, quantity: 1, unit: 'kg' });
    expect(fresh.preserveMethod).toBeNull();
    const path = `/api/households/${hid}/harvests/${h.id}`;
    const dried = await apiAs(t.owner.cookie, 'PATCH', path, { preserveMethod: 'dried' });
    expect(dried.status).toBe(200);
    expect(dried.body.harvest.preserveMethod).toBe('dried');
    expect((await apiAs(t.owner.cookie, 'GET', path)).body.harvest.preserveMethod).toBe('dried');
    const stored = await apiAs(t.owner.cookie, 'PATCH', path, { use: 'stored' });
    expect(stored.body.harvest).toMatchObject({ use: 'stored', preserveMethod: null });
    const refused = await apiAs(t.owner.cookie, 'PATCH', path, { preserveMethod: 'frozen' });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.preserveMethod).toMatch(/Only preserved food/);
    const back = await apiAs(t.owner.cookie, 'PATCH', path, { use: 'preserved', preserveMethod: 'fermented' });
    expect(back.body.harvest).toMatchObject({ use: 'preserved', preserveMethod: 'fermented' });
  });

  it('refuses a date after today on a split weighing and on a change, keeping the entry as it was', async () => {
    const split = await apiAs(t.owner.cookie, 'POST', url(), { date: inTwoDays(), cropId: potato.id, unit: 'kg', parts: [{ quantity: 1, use: 'fresh' }] });
    expect(split.status).toBe(400);
    expect(split.body.error.fields.date).toMatch(/after today/);
    const h = await logHarvest(t.owner.cookie, hid, { date: '2026-08-03', cropId: potato.id, quantity: 1, unit: 'kg' });
    const r = await apiAs(t.owner.cookie, 'PATCH', url(`/${h.id}`), { date: inTwoDays() });
    expect(r.status).toBe(400);
    expect(r.body.error.fields.date).toMatch(/after today/);
    expect((await apiAs(t.owner.cookie, 'GET', url(`/${h.id}`))).body.harvest.date).toBe('2026-08-03');
  });
});

describe('bad harvest input', () => {
  const base = () => ({ date: '2026-07-14', cropId: potato.id, quantity: 1, unit: 'kg' });
  it.each([
    ['a zero weight', { quantity: 0 }, 'quantity'],
    ['a negative weight', { quantity: -2 }, 'quantity'],
    ['an unknown unit', { unit: 'stone' }, 'unit'],
    ['an impossible date', { date: '2026-02-30' }, 'date'],
    ['a spread over 24 months', { use: 'stored', spreadMonths: 25 }, 'spreadMonths'],
    ['a spread of 0 months', { use: 'stored', spreadMonths: 0 }, 'spreadMonths'],
    ['an unknown use', { use: 'eaten' }, 'use'],
    ['a preserving method on fresh food', { preserveMethod: 'frozen' }, 'preserveMethod'],
    ['an unknown preserving method', { use: 'preserved', preserveMethod: 'pickled' }, 'preserveMethod'],
    ['a date after today in the household’s zone', { date: inTwoDays() }, 'date'],
  ])('answers 400 naming the field for %s', async (_what, change, field) => {
    const before = (await allHarvests(t.owner.cookie, hid)).total;
    const r = await apiAs(t.owner.cookie, 'POST', url(), { ...base(), ...change });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect(typeof r.body.error.message).toBe('string');
    expect(Object.keys(r.body.error.fields)).toContain(field);
    expect((await allHarvests(t.owner.cookie, hid)).total).toBe(before);
  });

  it('answers 400, not 500, for a body that is not JSON', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', url(), undefined, { 'content-type': 'application/json' });
    expect(r.status).toBe(400);
    const r2 = await fetch(`${BASE_URL}${url()}`, { method: 'POST', headers: { cookie: t.owner.cookie, origin: BASE_URL, 'content-type': 'application/json' }, body: '{"date":' });
    expect(r2.status).toBe(400);
    expect((await r2.json()).error.code).toBe('invalid_json');
  });

  it("refuses another household's crop as a field error", async () => {
    const other = await createHousehold(t.outsider.cookie, { name: 'Elsewhere' });
    const theirs = await makeCrop(t.outsider.cookie, other.id, { name: 'Kale', category: 'leafy_green', foodId: await foodId('11233') });
    const r = await apiAs(t.owner.cookie, 'POST', url(), { ...base(), cropId: theirs.id });
    expect(r.status).toBe(400);
    expect(r.body.error.fields.cropId).toMatch(/no such crop/i);
  });

  it('refuses both a crop and a food at once', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', url(), { ...base(), foodId: potatoFood });
    expect(r.status).toBe(400);
    expect(r.body.error.fields.foodId).toBeDefined();
  });
});

describe('a split weighing', () => {
  it('stores one weighing split between uses as entries sharing a split group', async () => {
    // 12 lb of potatoes: 3 lb eaten fresh, 9 lb stored
    const r = await apiAs(t.grower.cookie, 'POST', url(), {
      date: '2026-09-10',
      cropId: potato.id,
      unit: 'lb',
      parts: [
        { quantity: 3, use: 'fresh' },
        { quantity: 9, use: 'stored', spreadMonths: 5 },
      ],
    });
    expect(r.status).toBe(201);
    const [fresh, stored] = r.body.harvests;
    expect(r.body.harvests).toHaveLength(2);
    expect(fresh.splitGroup).toMatch(/^[0-9a-f-]{36}$/);
    expect(stored.splitGroup).toBe(fresh.splitGroup);
    expect(fresh).toMatchObject({ use: 'fresh', spreadMonths: 1, quantity: 3 });
    expect(stored).toMatchObject({ use: 'stored', spreadMonths: 5, quantity: 9 });
    expect(fresh.grams + stored.grams).toBeCloseTo(12 * LB, 9);
    // USDA SR28, NDB 11352: 25 % refuse
    expect(fresh.edibleGrams + stored.edibleGrams).toBeCloseTo(12 * LB * 0.75, 9);
    const listed = await allHarvests(t.owner.cookie, hid, 'from=2026-09-10&to=2026-09-10');
    expect(listed.harvests.map((h: { id: number }) => h.id).sort()).toEqual([fresh.id, stored.id].sort());
  });

  it('stores nothing when one part is invalid', async () => {
    const before = await allHarvests(t.owner.cookie, hid);
    const badPart = await apiAs(t.owner.cookie, 'POST', url(), {
      date: '2026-09-11', cropId: potato.id, unit: 'kg',
      parts: [{ quantity: 4, use: 'stored' }, { quantity: -1, use: 'fresh' }],
    });
    expect(badPart.status).toBe(400);
    expect(Object.keys(badPart.body.error.fields)).toContain('parts.1.quantity');
    const badUse = await apiAs(t.owner.cookie, 'POST', url(), {
      date: '2026-09-11', cropId: foxglove.id, unit: 'kg',
      parts: [{ quantity: 1, use: 'given' }, { quantity: 1, use: 'fresh' }],
    });
    expect(badUse.status).toBe(400);
    expect(badUse.body.error.fields['parts.1.use']).toMatch(/not food/);
    const after = await allHarvests(t.owner.cookie, hid);
    expect(after.total).toBe(before.total);
    expect(after.totals.grams).toBeCloseTo(before.totals.grams, 6);
  });
});

describe('listing, editing and deleting harvests', () => {
  let hh: number;
  let crop: { id: number };
  let ids: number[] = [];
  beforeAll(async () => {
    const h = await createHousehold(t.owner.cookie, { name: 'List plot' });
    hh = h.id;
    crop = await makeCrop(t.owner.cookie, hh, { name: 'Potato', foodId: potatoFood, category: 'root_tuber' });
    const sq = await makeCrop(t.owner.cookie, hh, { name: 'Squash', foodId: butternutFood, category: 'squash' });
    ids = [];
    for (const [date, q, use, c] of [
      ['2026-06-01', 1, 'fresh', crop.id],
      ['2026-07-01', 3, 'stored', crop.id],
      ['2026-08-01', 2, 'fresh', sq.id],
      ['2026-09-01', 4, 'sold', crop.id],
    ] as const) {
      ids.push((await logHarvest(t.owner.cookie, hh, { date, cropId: c, quantity: q, unit: 'kg', use })).id);
    }
  });

  it('filters by date range, crop and use, with totals over the whole filter', async () => {
    const all = await allHarvests(t.owner.cookie, hh);
    expect(all.total).toBe(4);
    expect(all.totals.grams).toBeCloseTo(10_000, 6);
    expect(all.harvests.map((h) => h.date)).toEqual(['2026-09-01', '2026-08-01', '2026-07-01', '2026-06-01']);
    const summer = await allHarvests(t.owner.cookie, hh, 'from=2026-07-01&to=2026-08-31');
    expect(summer.total).toBe(2);
    const potatoes = await allHarvests(t.owner.cookie, hh, `cropId=${crop.id}`);
    expect(potatoes.total).toBe(3);
    // USDA SR28, NDB 11352: 25 % refuse → (1 + 3 + 4) kg × 0.75
    expect(potatoes.totals.edibleGrams).toBeCloseTo(6000, 6);
    const fresh = await allHarvests(t.owner.cookie, hh, 'use=fresh');
    expect(fresh.total).toBe(2);
  });

  it('pages the list while the totals still cover every entry', async () => {
    const r = await apiAs(t.viewer.cookie, 'GET', `/api/households/${hh}/harvests?pageSize=1&page=2&sort=grams`);
    expect(r.status).toBe(404); // the viewer is not a member of this household
    const p = await apiAs(t.owner.cookie, 'GET', `/api/households/${hh}/harvests?pageSize=1&page=2&sort=grams`);
    expect(p.status).toBe(200);
    expect(p.body).toMatchObject({ page: 2, pageSize: 1, total: 4 });
    expect(p.body.harvests).toHaveLength(1);
    expect(p.body.harvests[0].grams).toBe(2000);
    expect(p.body.totals.grams).toBeCloseTo(10_000, 6);
  });

  it('sorts by crop name, then newest first', async () => {
    const r = await apiAs(t.owner.cookie, 'GET', `/api/households/${hh}/harvests?sort=crop`);
    expect(r.body.harvests.map((h: { cropName: string; date: string }) => `${h.cropName} ${h.date}`)).toEqual([
      'Potato 2026-09-01',
      'Potato 2026-07-01',
      'Potato 2026-06-01',
      'Squash 2026-08-01',
    ]);
  });

  it('answers 400 for a bad filter', async () => {
    for (const q of ['from=2026-02-30', 'use=eaten', 'sort=weight', 'pageSize=500', 'from=2026-05-01&to=2026-04-01']) {
      const r = await apiAs(t.owner.cookie, 'GET', `/api/households/${hh}/harvests?${q}`);
      expect(r.status, q).toBe(400);
      expect(r.body.error.code).toBe('invalid_input');
    }
  });

  it('works grams and edible grams out again on a change', async () => {
    const r = await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hh}/harvests/${ids[0]}`, { quantity: 2, unit: 'lb' });
    expect(r.status).toBe(200);
    expect(r.body.harvest.grams).toBeCloseTo(2 * LB, 9);
    // USDA SR28, NDB 11352: 25 % refuse
    expect(r.body.harvest.edibleGrams).toBeCloseTo(2 * LB * 0.75, 9);
    const trimmed = await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hh}/harvests/${ids[0]}`, { trimmed: true });
    expect(trimmed.body.harvest.edibleGrams).toBeCloseTo(2 * LB, 9);
    const got = await apiAs(t.owner.cookie, 'GET', `/api/households/${hh}/harvests/${ids[0]}`);
    expect(got.body.harvest).toMatchObject({ quantity: 2, unit: 'lb', trimmed: true });
  });

  it('drops the spread when the use changes to fresh, and refills it for stored', async () => {
    const toFresh = await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hh}/harvests/${ids[1]}`, { use: 'fresh' });
    expect(toFresh.body.harvest.spreadMonths).toBe(1);
    const toStored = await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hh}/harvests/${ids[1]}`, { use: 'stored' });
    expect(toStored.body.harvest.spreadMonths).toBe(defaultSpreadMonths({ use: 'stored', category: 'root_tuber' }));
    const bad = await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hh}/harvests/${ids[1]}`, { use: 'fresh', spreadMonths: 4 });
    expect(bad.status).toBe(400);
    const empty = await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hh}/harvests/${ids[1]}`, {});
    expect(empty.status).toBe(400);
  });

  it('deletes a harvest', async () => {
    const d = await apiAs(t.owner.cookie, 'DELETE', `/api/households/${hh}/harvests/${ids[3]}`);
    expect(d.status).toBe(204);
    expect((await apiAs(t.owner.cookie, 'GET', `/api/households/${hh}/harvests/${ids[3]}`)).status).toBe(404);
    expect((await apiAs(t.owner.cookie, 'DELETE', `/api/households/${hh}/harvests/${ids[3]}`)).status).toBe(404);
  });

  it("does not reach another household's harvest through this household's URL", async () => {
    // ids[2] belongs to household hh; ask for it under the fixture household
    expect((await apiAs(t.owner.cookie, 'GET', url(`/${ids[2]}`))).status).toBe(404);
    expect((await apiAs(t.owner.cookie, 'PATCH', url(`/${ids[2]}`), { quantity: 9 })).status).toBe(404);
    expect((await apiAs(t.owner.cookie, 'DELETE', url(`/${ids[2]}`))).status).toBe(404);
    const still = await apiAs(t.owner.cookie, 'GET', `/api/households/${hh}/harvests/${ids[2]}`);
    expect(still.body.harvest.quantity).toBe(2);
  });

  it('answers 404 for an id that is not a number', async () => {
    expect((await apiAs(t.owner.cookie, 'GET', url('/abc'))).status).toBe(404);
  });
});

describe('who may do what with harvests', () => {
  let entryId: number;
  beforeAll(async () => {
    entryId = (await logHarvest(t.owner.cookie, hid, { date: '2026-05-05', cropId: potato.id, quantity: 1, unit: 'kg' })).id;
  });

  it('lets the owner and a grower create, change and delete', async () => {
    for (const who of [t.owner, t.grower]) {
      const c = await apiAs(who.cookie, 'POST', url(), { date: '2026-05-06', cropId: potato.id, quantity: 1, unit: 'kg' });
      expect(c.status).toBe(201);
      expect((await apiAs(who.cookie, 'PATCH', url(`/${c.body.harvest.id}`), { quantity: 2 })).status).toBe(200);
      expect((await apiAs(who.cookie, 'DELETE', url(`/${c.body.harvest.id}`))).status).toBe(204);
    }
  });

  it('lets a viewer read but not change (403)', async () => {
    expect((await apiAs(t.viewer.cookie, 'GET', url())).status).toBe(200);
    expect((await apiAs(t.viewer.cookie, 'GET', url(`/${entryId}`))).status).toBe(200);
    expect((await apiAs(t.viewer.cookie, 'POST', url(), { date: '2026-05-06', cropId: potato.id, quantity: 1, unit: 'kg' })).status).toBe(403);
    expect((await apiAs(t.viewer.cookie, 'PATCH', url(`/${entryId}`), { quantity: 2 })).status).toBe(403);
    expect((await apiAs(t.viewer.cookie, 'DELETE', url(`/${entryId}`))).status).toBe(403);
    expect((await apiAs(t.owner.cookie, 'GET', url(`/${entryId}`))).body.harvest.quantity).toBe(1);
  });

  it('answers 404 to someone outside the household and 401 when signed out', async () => {
    expect((await apiAs(t.outsider.cookie, 'GET', url())).status).toBe(404);
    expect((await apiAs(t.outsider.cookie, 'POST', url(), { date: '2026-05-06', cropId: potato.id, quantity: 1, unit: 'kg' })).status).toBe(404);
    expect((await apiAs(t.outsider.cookie, 'GET', url(`/${entryId}`))).status).toBe(404);
    expect((await apiAs('', 'GET', url())).status).toBe(401);
    expect((await apiAs('', 'POST', url(), { date: '2026-05-06', cropId: potato.id, quantity: 1, unit: 'kg' })).status).toBe(401);
  });
});
