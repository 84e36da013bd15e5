import { beforeAll, describe, expect, it } from 'vitest';
import { allPurchases, foodId } from '../support/entries';
import { apiAs, householdWithRoles, type RoleFixture } from '../support/users';

// 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959)
const LB = 453.59237;

let t: RoleFixture;
let hid: number;
let flour: number;
let bananas: number;
let potatoes: number;
const url = (path = '') => `/api/households/${hid}/purchases${path}`;

beforeAll(async () => {
  t = await householdWithRoles();
  hid = t.household.id;
  flour = await foodId('20081');
  bananas = await foodId('09040');
  potatoes = await foodId('11352');
});

describe('bought food', () => {
  it('stores a bulk sack spread over months, with price and currency', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', url(), { date: '2026-03-02', foodId: flour, quantity: 25, unit: 'kg', spreadMonths: 6, price: 31.9, currency: 'eur' });
    expect(r.status).toBe(201);
    // USDA SR28, NDB 20081 "Wheat flour, white, all-purpose, enriched, bleached": 0 % refuse
    expect(r.body.purchase).toMatchObject({ foodId: flour, foodCode: '20081', grams: 25_000, edibleGrams: 25_000, spreadMonths: 6, price: 31.9, currency: 'EUR', trimmed: false });
  });

  it('takes the refuse off bought food too', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', url(), { date: '2026-03-05', foodId: bananas, quantity: 3, unit: 'lb' });
    expect(r.status).toBe(201);
    expect(r.body.purchase.grams).toBeCloseTo(3 * LB, 9);
    // USDA SR28, NDB 09040 "Bananas, raw": 36 % refuse
    expect(r.body.purchase.edibleGrams).toBeCloseTo(3 * LB * 0.64, 9);
    expect(r.body.purchase.spreadMonths).toBe(1);
  });

  it('answers 400 naming the field for bad input', async () => {
    for (const [change, field] of [
      [{ quantity: 0 }, 'quantity'],
      [{ unit: 'sack' }, 'unit'],
      [{ date: '2026-02-30' }, 'date'],
      [{ spreadMonths: 25 }, 'spreadMonths'],
      [{ price: -1 }, 'price'],
      [{ currency: 'euro' }, 'currency'],
      [{ foodId: 99_999_999 }, 'foodId'],
    ] as const) {
      const r = await apiAs(t.owner.cookie, 'POST', url(), { date: '2026-03-02', foodId: flour, quantity: 1, unit: 'kg', ...(change as Record<string, unknown>) });
      expect(r.status, JSON.stringify(change)).toBe(400);
      expect(Object.keys(r.body.error.fields)).toContain(field);
    }
  });

  it('lists with a food filter and totals, and edits with grams worked out again', async () => {
    const list = await allPurchases(t.owner.cookie, hid);
    expect(list.total).toBe(2);
    expect(list.purchases[0].date).toBe('2026-03-05');
    const onlyFlour = await apiAs(t.owner.cookie, 'GET', url(`?foodId=${flour}`));
    expect(onlyFlour.body.total).toBe(1);
    expect(onlyFlour.body.totals.grams).toBe(25_000);
    const id = onlyFlour.body.purchases[0].id;
    const p = await apiAs(t.owner.cookie, 'PATCH', url(`/${id}`), { foodId: potatoes, quantity: 10, unit: 'lb', price: null });
    expect(p.status).toBe(200);
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse
    expect(p.body.purchase).toMatchObject({ foodCode: '11352', price: null, currency: 'EUR', spreadMonths: 6 });
    expect(p.body.purchase.edibleGrams).toBeCloseTo(10 * LB * 0.75, 9);
    const trimmed = await apiAs(t.owner.cookie, 'PATCH', url(`/${id}`), { trimmed: true });
    expect(trimmed.body.purchase.edibleGrams).toBeCloseTo(10 * LB, 9);
  });

  it('deletes, and keeps roles and households apart', async () => {
    const c = await apiAs(t.owner.cookie, 'POST', url(), { date: '2026-04-01', foodId: flour, quantity: 1, unit: 'kg' });
    const id = c.body.purchase.id;
    expect((await apiAs(t.viewer.cookie, 'GET', url(`/${id}`))).status).toBe(200);
    expect((await apiAs(t.viewer.cookie, 'POST', url(), { date: '2026-04-01', foodId: flour, quantity: 1, unit: 'kg' })).status).toBe(403);
    expect((await apiAs(t.viewer.cookie, 'PATCH', url(`/${id}`), { quantity: 2 })).status).toBe(403);
    expect((await apiAs(t.viewer.cookie, 'DELETE', url(`/${id}`))).status).toBe(403);
    expect((await apiAs(t.outsider.cookie, 'GET', url())).status).toBe(404);
    expect((await apiAs(t.outsider.cookie, 'DELETE', url(`/${id}`))).status).toBe(404);
    expect((await apiAs('', 'GET', url())).status).toBe(401);
    expect((await apiAs(t.grower.cookie, 'DELETE', url(`/${id}`))).status).toBe(204);
    expect((await apiAs(t.owner.cookie, 'GET', url(`/${id}`))).status).toBe(404);
  });
});

describe('staples', () => {
  const surl = (path = '') => `/api/households/${hid}/staples${path}`;
  let stapleId: number;

  it('keeps a staples list, labelled by the food unless told', async () => {
    const a = await apiAs(t.owner.cookie, 'POST', surl(), { foodId: flour, label: 'Flour, 25 kg sack', quantity: 25, unit: 'kg', spreadMonths: 6 });
    expect(a.status).toBe(201);
    stapleId = a.body.staple.id;
    const b = await apiAs(t.grower.cookie, 'POST', surl(), { foodId: bananas, quantity: 1, unit: 'kg' });
    expect(b.status).toBe(201);
    expect(b.body.staple).toMatchObject({ label: 'Bananas, raw', spreadMonths: 1, foodCode: '09040' });
    const list = await apiAs(t.viewer.cookie, 'GET', surl());
    expect(list.status).toBe(200);
    expect(list.body.staples.map((s: { label: string }) => s.label)).toEqual(['Bananas, raw', 'Flour, 25 kg sack']);
  });

  it('refuses the same food and amount twice, and bad input', async () => {
    const dup = await apiAs(t.owner.cookie, 'POST', surl(), { foodId: flour, quantity: 25, unit: 'kg' });
    expect(dup.status).toBe(409);
    expect((await apiAs(t.owner.cookie, 'POST', surl(), { foodId: flour, quantity: -3, unit: 'kg' })).status).toBe(400);
    expect((await apiAs(t.viewer.cookie, 'POST', surl(), { foodId: flour, quantity: 3, unit: 'kg' })).status).toBe(403);
  });

  it('logs a staple as bought in one tap, today in the household by default', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', surl(`/${stapleId}/log`));
    expect(r.status).toBe(201);
    const today = new Intl.DateTimeFormat('en-CA', { timeZone: t.household.timezone }).format(new Date());
    expect(r.body.purchase).toMatchObject({ date: today, foodId: flour, quantity: 25, unit: 'kg', grams: 25_000, spreadMonths: 6, note: 'Flour, 25 kg sack' });
    const dated = await apiAs(t.grower.cookie, 'POST', surl(`/${stapleId}/log`), { date: '2026-01-15' });
    expect(dated.body.purchase.date).toBe('2026-01-15');
    expect((await apiAs(t.grower.cookie, 'POST', surl(`/${stapleId}/log`), { date: '2026-13-01' })).status).toBe(400);
    expect((await apiAs(t.viewer.cookie, 'POST', surl(`/${stapleId}/log`))).status).toBe(403);
  });

  it('removes a staple and keeps what was logged from it', async () => {
    const before = (await allPurchases(t.owner.cookie, hid)).total;
    expect((await apiAs(t.viewer.cookie, 'DELETE', surl(`/${stapleId}`))).status).toBe(403);
    expect((await apiAs(t.owner.cookie, 'DELETE', surl(`/${stapleId}`))).status).toBe(204);
    expect((await apiAs(t.owner.cookie, 'GET', surl(`/${stapleId}`))).status).toBe(404);
    expect((await apiAs(t.owner.cookie, 'POST', surl(`/${stapleId}/log`))).status).toBe(404);
    expect((await allPurchases(t.owner.cookie, hid)).total).toBe(before);
  });
});
