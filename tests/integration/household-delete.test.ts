import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Pool } from 'mysql2/promise';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { testPool } from '../support/env';
import { apiAs, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

let pool: Pool;
let owner: TestUser;
beforeAll(async () => {
  pool = testPool();
  owner = await newVerifiedUser({ name: 'Deleting owner' });
});
afterAll(async () => {
  await pool.end();
});

async function count(table: string, householdId: number): Promise<number> {
  const [rows] = await pool.query(`SELECT COUNT(*) AS n FROM ${table} WHERE household_id = ?`, [householdId]);
  return Number((rows as { n: number }[])[0]!.n);
}

describe('deleting a household', () => {
  it('removes the household with its crops, harvests, bought food, staples and people, in one go', async () => {
    const h = await createHousehold(owner.cookie, { name: 'Plot to close' });
    const potato = await foodId('11352'); // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
    const crop = await makeCrop(owner.cookie, h.id, { name: 'Potato', category: 'root_tuber', foodId: potato });
    await logHarvest(owner.cookie, h.id, { date: '2026-09-01', cropId: crop.id, quantity: 3, unit: 'kg', use: 'stored' });
    const bought = await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/purchases`, { date: '2026-09-02', foodId: potato, quantity: 1, unit: 'kg' });
    expect(bought.status).toBe(201);
    const staple = await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/staples`, { foodId: potato, label: 'Potatoes', quantity: 5, unit: 'kg' });
    expect(staple.status).toBe(201);
    const person = await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/people`, { name: 'Eater', sex: 'female', ageYears: 30 });
    expect(person.status).toBe(201);
    for (const t of ['crops', 'harvests', 'purchases', 'staples', 'people']) expect(await count(t, h.id)).toBe(1);

    const del = await apiAs(owner.cookie, 'DELETE', `/api/households/${h.id}`);
    expect(del.status).toBe(204);
    expect((await apiAs(owner.cookie, 'GET', `/api/households/${h.id}`)).status).toBe(404);
    for (const t of ['crops', 'harvests', 'purchases', 'staples', 'people', 'memberships']) expect(await count(t, h.id)).toBe(0);
  });
});
