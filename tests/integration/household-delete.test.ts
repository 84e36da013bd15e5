import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Pool } from 'mysql2/promise';
import { foodId, logHarvest, makeCrop, upload } from '../support/entries';
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

  it('answers writes racing the deletion with 2xx, 404 or 409 — never a 500 — and leaves nothing behind', async () => {
    const potato = await foodId('11352'); // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
    const TABLES = ['crops', 'harvests', 'purchases', 'staples', 'people', 'beds', 'plantings', 'idempotency_keys', 'memberships'];
    const statuses: number[] = [];
    for (let round = 0; round < 4; round++) {
      const h = await createHousehold(owner.cookie, { name: `Busy plot ${round}` });
      const base = `/api/households/${h.id}`;
      const crop = await makeCrop(owner.cookie, h.id, { name: 'Potato', category: 'root_tuber', foodId: potato });
      const harvest = await logHarvest(owner.cookie, h.id, { date: '2026-09-01', cropId: crop.id, quantity: 3, unit: 'kg', use: 'stored' });
      const staple = (await apiAs(owner.cookie, 'POST', `${base}/staples`, { foodId: potato, label: 'Sack', quantity: 5, unit: 'kg' })).body.staple;
      const bed = (await apiAs(owner.cookie, 'POST', `${base}/beds`, { name: 'Bed', area: 4 })).body.bed;
      const day = (i: number) => `2026-08-${String((i % 28) + 1).padStart(2, '0')}`;
      const writes = [
        ...Array.from({ length: 6 }, (_, i) => () => apiAs(owner.cookie, 'POST', `${base}/harvests`, { date: day(i), cropId: crop.id, quantity: 1 + i, unit: 'kg' }, i % 2 ? { 'Idempotency-Key': `race-${round}-${i}` } : {})),
        ...Array.from({ length: 3 }, (_, i) => () => apiAs(owner.cookie, 'POST', `${base}/purchases`, { date: day(i), foodId: potato, quantity: 2, unit: 'kg' })),
        () => apiAs(owner.cookie, 'POST', `${base}/harvests`, { date: day(9), cropId: crop.id, unit: 'kg', parts: [{ quantity: 2, use: 'stored' }, { quantity: 1, use: 'fresh' }] }),
        () => apiAs(owner.cookie, 'POST', `${base}/staples/${staple.id}/log`, {}),
        () => apiAs(owner.cookie, 'PATCH', `${base}/harvests/${harvest.id}`, { quantity: 4 }),
        () => apiAs(owner.cookie, 'DELETE', `${base}/harvests/${harvest.id}`),
        () => apiAs(owner.cookie, 'POST', `${base}/crops`, { name: `Kale ${round}`, category: 'leafy_green' }),
        () => apiAs(owner.cookie, 'POST', `${base}/people`, { name: 'Eater', sex: 'female', ageYears: 30 }),
        () => apiAs(owner.cookie, 'POST', `${base}/beds`, { name: `Bed ${round}`, area: 2 }),
        () => apiAs(owner.cookie, 'POST', `${base}/plantings`, { cropId: crop.id, bedId: bed.id, area: 2, seasonYear: 2026 }),
        () => upload(owner.cookie, h.id, { kind: 'harvests', mode: 'commit', csv: `date,crop,quantity,unit\n${day(3)},Potato,2,kg\n` }),
      ];
      // The deletion goes out in the middle of the writes (half before it, half after).
      const half = Math.floor(writes.length / 2);
      const pending = writes.slice(0, half).map((w) => w());
      const del = apiAs(owner.cookie, 'DELETE', base);
      pending.push(...writes.slice(half).map((w) => w()));
      const answers = await Promise.all(pending);
      const deleted = await del;
      expect(deleted.status, JSON.stringify(deleted.body)).toBe(204);
      for (const a of answers) {
        expect([200, 201, 204, 404, 409], JSON.stringify(a.body)).toContain(a.status);
        if (a.status >= 400) expect(a.body.error.code).toMatch(/^(not_found|conflict|in_use)$/);
      }
      statuses.push(...answers.map((a) => a.status));
      for (const t of TABLES) expect(await count(t, h.id), t).toBe(0);
    }
    // Both outcomes were seen: writes that got in before the deletion and writes that found it gone.
    expect(statuses.some((s) => s < 300)).toBe(true);
    expect(statuses.some((s) => s === 404)).toBe(true);
  });

  it('answers a second deletion of the same household 404, also when both race', async () => {
    const h = await createHousehold(owner.cookie, { name: 'Twice closed' });
    const [a, b] = await Promise.all([apiAs(owner.cookie, 'DELETE', `/api/households/${h.id}`), apiAs(owner.cookie, 'DELETE', `/api/households/${h.id}`)]);
    expect([a.status, b.status].sort()).toEqual([204, 404]);
  });
});
