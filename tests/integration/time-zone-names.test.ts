import { afterAll, describe, expect, it } from 'vitest';
import { testPool } from '../support/env';
import { allHarvests, foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, householdWithRoles } from '../support/users';

const pool = testPool();
afterAll(() => pool.end());

describe('time-zone names', () => {
  it('stores an old spelling under its current name', async () => {
    const f = await householdWithRoles({ name: 'Kolkata plot', timezone: 'Asia/Calcutta' });
    // from memory: IANA tzdb backward file — Link Asia/Kolkata Asia/Calcutta
    expect(f.household.timezone).toBe('Asia/Kolkata');
    const [rows] = await pool.query('SELECT timezone FROM households WHERE id = ?', [f.household.id]);
    expect((rows as { timezone: string }[])[0]!.timezone).toBe('Asia/Kolkata');
  });

  it('keeps a household stored with an old name working, and shows it under the current one', async () => {
    const f = await householdWithRoles({ name: 'Kyiv plot', timezone: 'Europe/Berlin' });
    const hid = f.household.id;
    // A household saved before the names were mapped.
    await pool.query('UPDATE households SET timezone = ? WHERE id = ?', ['Europe/Kiev', hid]);
    const shown = await apiAs(f.owner.cookie, 'GET', `/api/households/${hid}`);
    // from memory: IANA tzdb backward file — Link Europe/Kyiv Europe/Kiev
    expect(shown.body.household.timezone).toBe('Europe/Kyiv');
    const potato = await makeCrop(f.owner.cookie, hid, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
    await logHarvest(f.grower.cookie, hid, { date: '2026-07-01', cropId: potato.id, quantity: 1, unit: 'kg' });
    expect((await allHarvests(f.owner.cookie, hid)).total).toBe(1);
    const renamed = await apiAs(f.owner.cookie, 'PATCH', `/api/households/${hid}`, { name: 'Kyiv garden' });
    expect(renamed.status).toBe(200);
  });
});
