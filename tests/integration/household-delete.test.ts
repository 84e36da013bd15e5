import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Pool } from 'mysql2/promise';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { testPool } from '../support/env';
import { apiAs, createHousehold, householdWithRoles, newVerifiedUser, type TestUser } from '../support/users';

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

  it('also removes beds, plantings, larder outcomes, letters, memberships and open invitations', async () => {
    const h = await createHousehold(owner.cookie, { name: 'Plot with everything' });
    const base = `/api/households/${h.id}`;
    const potato = await foodId('11352'); // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
    const crop = await makeCrop(owner.cookie, h.id, { name: 'Potato', category: 'root_tuber', foodId: potato });
    await logHarvest(owner.cookie, h.id, { date: '2026-09-01', cropId: crop.id, quantity: 20, unit: 'kg', use: 'stored', spreadMonths: 6 });
    const bed = await apiAs(owner.cookie, 'POST', `${base}/beds`, { name: 'Tattie bed', area: 10 });
    expect(bed.status).toBe(201);
    const planting = await apiAs(owner.cookie, 'POST', `${base}/plantings`, { cropId: crop.id, bedId: bed.body.bed.id, area: 10, seasonYear: 2026 });
    expect(planting.status).toBe(201);
    const invited = await apiAs(owner.cookie, 'POST', `${base}/invitations`, { email: `later-${h.id}@test.selfsown.invalid`, role: 'viewer' });
    expect(invited.status).toBe(201);
    // Rows written straight into the tables, as the larder and the letter run would write them.
    const [harvestRows] = await pool.query('SELECT id FROM harvests WHERE household_id = ?', [h.id]);
    const harvestId = (harvestRows as { id: number }[])[0]!.id;
    await pool.query(
      "INSERT INTO larder_outcomes (household_id, harvest_id, kind, date, lost_fraction) VALUES (?, ?, 'spoiled', '2026-11-01', 0.25)",
      [h.id, harvestId],
    );
    await pool.query("INSERT INTO letters (household_id, user_id, month, status, claimed_by) VALUES (?, ?, '2026-10', 'sent', 'test-run')", [h.id, owner.id]);
    for (const t of ['beds', 'plantings', 'larder_outcomes', 'letters', 'invitations', 'memberships']) expect(await count(t, h.id), t).toBe(1);

    const del = await apiAs(owner.cookie, 'DELETE', base);
    expect(del.status).toBe(204);
    for (const t of ['crops', 'harvests', 'beds', 'plantings', 'larder_outcomes', 'letters', 'invitations', 'memberships']) expect(await count(t, h.id), t).toBe(0);
    const [households] = await pool.query('SELECT id FROM households WHERE id = ?', [h.id]);
    expect(households).toEqual([]);
    // The owner's own account stays: they can still list (now none of) their households.
    const list = await apiAs(owner.cookie, 'GET', '/api/households');
    expect(list.status).toBe(200);
    expect(list.body.households.map((x: { id: number }) => x.id)).not.toContain(h.id);
  });

  it('refuses deletion to a grower and a viewer (403) and leaves everything in place', async () => {
    const t = await householdWithRoles({ name: 'Not yours to close' });
    for (const who of [t.grower, t.viewer]) {
      const r = await apiAs(who.cookie, 'DELETE', `/api/households/${t.household.id}`);
      expect(r.status).toBe(403);
      expect(r.body.error.code).toBe('forbidden');
    }
    expect((await apiAs(t.outsider.cookie, 'DELETE', `/api/households/${t.household.id}`)).status).toBe(404);
    expect(await count('memberships', t.household.id)).toBe(3);
    expect((await apiAs(t.owner.cookie, 'GET', `/api/households/${t.household.id}`)).body.household.name).toBe('Not yours to close');
  });
});
