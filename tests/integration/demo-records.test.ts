import { drizzle } from 'drizzle-orm/mysql2';
import { afterAll, describe, expect, it } from 'vitest';
import * as schema from '@/db/schema';
import { demoSeasonYear, seedDemoRecords } from '@/cli/seed-demo-records';
import { allHarvests, allPurchases } from '../support/entries';
import { testPool } from '../support/env';
import { apiAs, createHousehold, newVerifiedUser } from '../support/users';

// The demo data is invented: these tests check that it loads and reads back through the API,
// never the numbers themselves.
const pool = testPool();
afterAll(async () => {
  await pool.end();
});

describe('the demo records', () => {
  it('seed crops matched to reference foods, a season of harvests and bought staples', async () => {
    const owner = await newVerifiedUser({ name: 'Demo Check' });
    const h = await createHousehold(owner.cookie, { name: 'Demo check plot' });
    const db = drizzle(pool, { schema, mode: 'default' });
    const today = '2026-12-02';
    const wrote = await db.transaction((tx) => seedDemoRecords(tx, h.id, owner.id, { today, log: () => {} }));
    expect(wrote.crops).toBeGreaterThan(0);

    const crops = (await apiAs(owner.cookie, 'GET', `/api/households/${h.id}/crops`)).body.crops;
    expect(crops).toHaveLength(wrote.crops);
    expect(crops.filter((c: { notFood: boolean; food: unknown }) => !c.notFood).every((c: { food: unknown }) => c.food !== null)).toBe(true);

    const harvests = await allHarvests(owner.cookie, h.id);
    expect(harvests.total).toBe(wrote.harvests);
    const all = (await apiAs(owner.cookie, 'GET', `/api/households/${h.id}/harvests?pageSize=200&page=1&sort=date`)).body.harvests;
    expect(all.every((x: { date: string }) => x.date <= today && x.date >= `${demoSeasonYear(today)}-03-01`)).toBe(true);
    expect(all.some((x: { splitGroup: string | null }) => x.splitGroup !== null)).toBe(true);
    expect((await allPurchases(owner.cookie, h.id)).total).toBe(wrote.purchases);
    expect((await apiAs(owner.cookie, 'GET', `/api/households/${h.id}/staples`)).body.staples).toHaveLength(wrote.staples);
  });

  it('never dates an entry after the seeding day', async () => {
    const owner = await newVerifiedUser({ name: 'Demo Spring' });
    const h = await createHousehold(owner.cookie, { name: 'Demo spring plot' });
    const db = drizzle(pool, { schema, mode: 'default' });
    const wrote = await db.transaction((tx) => seedDemoRecords(tx, h.id, owner.id, { today: '2026-04-10', log: () => {} }));
    const list = await allHarvests(owner.cookie, h.id, 'sort=-date');
    expect(list.total).toBe(wrote.harvests);
    expect(list.harvests[0]!.date <= '2026-04-10').toBe(true);
  });
});
