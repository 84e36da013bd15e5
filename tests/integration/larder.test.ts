/**
 * The larder against the real MariaDB and the built server: recording what happened to a stored
 * lot (who may, what is refused), the larder read, and the share report following the records.
 * Expected numbers are worked out by hand from SR28 values and calendar days, not by the app's code.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Pool } from 'mysql2/promise';
import { testPool } from '../support/env';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, householdWithRoles, type RoleFixture } from '../support/users';

// USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse, 77 kcal and 2.05 g protein per 100 g
const KCAL = 77;
const PROTEIN = 2.05;
// 24 kg stored on 1 Oct 2025 over 6 months → 18 000 g edible, eaten 1 Oct 2025 – 31 Mar 2026:
// 31 + 30 + 31 + 31 + 28 + 31 = 182 days (Gregorian calendar)
const G = 18000;
const DAYS = 182;
const kcal = (edibleGrams: number) => (edibleGrams / 100) * KCAL;

let t: RoleFixture;
let hid: number;
let lotId: number;
let pool: Pool;

const url = (path = '') => `/api/households/${hid}/larder${path}`;
const share = async () => (await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/share?from=2025-10&to=2026-09`)).body;
const home = (body: any, month: string) => body.months.find((m: any) => m.month === month).values.energy_kcal.home as number;
const useOf = (body: any, use: string) => body.uses.find((u: any) => u.use === use);

beforeAll(async () => {
  pool = testPool();
  t = await householdWithRoles({ name: 'Larder plot', timezone: 'Europe/Berlin' });
  hid = t.household.id;
  const crop = await makeCrop(t.owner.cookie, hid, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  const lot = await logHarvest(t.owner.cookie, hid, { cropId: crop.id, date: '2025-10-01', quantity: 24, unit: 'kg', use: 'stored', spreadMonths: 6 });
  lotId = lot.id;
  await logHarvest(t.owner.cookie, hid, { cropId: crop.id, date: '2025-10-02', quantity: 2, unit: 'kg', use: 'fresh' });
});

afterAll(async () => {
  await pool.end();
});

describe('recording outcomes', () => {
  it('lets owner and grower record, not the viewer', async () => {
    const body = { harvestId: lotId, kind: 'spoiled', date: '2025-12-01', lostFraction: 0.25 };
    expect((await apiAs(t.viewer.cookie, 'POST', url('/outcomes'), body)).status).toBe(403);
    expect((await apiAs(t.outsider.cookie, 'POST', url('/outcomes'), body)).status).toBe(404);
  });

  it('refuses bad input with field messages, and outcomes that cannot apply with the day', async () => {
    const bad = await apiAs(t.grower.cookie, 'POST', url('/outcomes'), { harvestId: lotId, kind: 'lasted_longer', date: '2025-12-01' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.until).toMatch(/expected to last until/);
    const before = await apiAs(t.grower.cookie, 'POST', url('/outcomes'), { harvestId: lotId, kind: 'used_up', date: '2025-09-30' });
    expect(before.status).toBe(422);
    expect(before.body.error.message).toMatch(/went into store on 2025-10-01/);
    const after = await apiAs(t.grower.cookie, 'POST', url('/outcomes'), { harvestId: lotId, kind: 'spoiled', date: '2026-04-02' });
    expect(after.status).toBe(422);
    expect(after.body.error.message).toMatch(/last of it was eaten on 2026-03-31/);
    const future = await apiAs(t.grower.cookie, 'POST', url('/outcomes'), { harvestId: lotId, kind: 'used_up', date: '2099-01-01' });
    expect(future.status).toBe(422);
  });

  it('answers 404 for a harvest that is not a stored lot', async () => {
    const [fresh] = (await pool.query<any[]>('SELECT id FROM harvests WHERE household_id = ? AND `use` = ?', [hid, 'fresh']))[0];
    const r = await apiAs(t.owner.cookie, 'POST', url('/outcomes'), { harvestId: fresh.id, kind: 'used_up', date: '2025-10-05' });
    expect(r.status).toBe(404);
    expect(r.body.error.message).toMatch(/not a stored or preserved lot/);
  });
});

describe('the share report follows the records', () => {
  let original: any;
  beforeAll(async () => {
    original = await share();
  });

  it('starts from the even spread', () => {
    expect(home(original, '2025-10')).toBeCloseTo(kcal((G * 31) / DAYS) + kcal(1500), 6); // + the fresh 2 kg (1500 g edible)
    expect(home(original, '2025-12')).toBeCloseTo(kcal((G * 31) / DAYS), 6);
    expect(useOf(original, 'lost').edibleGrams).toBe(0);
  });

  it('a spoiled lot lowers the months after the spoilage and shows as lost', async () => {
    const r = await apiAs(t.grower.cookie, 'POST', url('/outcomes'), { harvestId: lotId, kind: 'spoiled', date: '2025-12-01', lostFraction: 0.25, note: 'frost in the clamp' });
    expect(r.status).toBe(201);
    expect(r.body.outcome).toMatchObject({ kind: 'spoiled', date: '2025-12-01', lostFraction: 0.25, note: 'frost in the clamp' });
    // 1 Dec 2025 is 61 days in: 121 of 182 days' worth left, a quarter of it lost
    const left = (G * 121) / DAYS;
    const after = await share();
    expect(home(after, '2025-11')).toBeCloseTo(kcal((G * 30) / DAYS), 6);
    expect(home(after, '2025-12')).toBeCloseTo(kcal((0.75 * left * 31) / 121), 6);
    expect(home(after, '2026-03')).toBeCloseTo(kcal((0.75 * left * 31) / 121), 6);
    expect(useOf(after, 'lost').edibleGrams).toBeCloseTo(0.25 * left, 6);
    expect(useOf(after, 'lost').energyKcal).toBeCloseTo(kcal(0.25 * left), 6);
    expect(useOf(after, 'stored').edibleGrams).toBeCloseTo(G - 0.25 * left, 6);
    // Deleting the record restores the original numbers
    const del = await apiAs(t.owner.cookie, 'DELETE', url(`/outcomes/${r.body.outcome.id}`));
    expect(del.status).toBe(204);
    const back = await share();
    expect(back.months.map((m: any) => m.values.energy_kcal.home)).toEqual(original.months.map((m: any) => m.values.energy_kcal.home));
    expect(back.uses).toEqual(original.uses);
  });

  it('an early use-up moves the remainder into the month of that day', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', url('/outcomes'), { harvestId: lotId, kind: 'used_up', date: '2026-01-15' });
    expect(r.status).toBe(201);
    // 15 Jan 2026 is 106 days in (31 + 30 + 31 + 14): January gets 14 days + the 76 days' worth left
    const after = await share();
    expect(home(after, '2026-01')).toBeCloseTo(kcal((G * (14 + 76)) / DAYS), 6);
    expect(home(after, '2026-02')).toBe(0);
    expect(useOf(after, 'stored').edibleGrams).toBeCloseTo(G, 6);
    // Protein follows too: USDA SR28, NDB 11352, 2.05 g per 100 g
    const jan = after.months.find((m: any) => m.month === '2026-01').values.protein_g.home;
    expect(jan).toBeCloseTo(((G * 90) / DAYS / 100) * PROTEIN, 6);
    await apiAs(t.owner.cookie, 'DELETE', url(`/outcomes/${r.body.outcome.id}`));
    expect(home(await share(), '2026-02')).toBeCloseTo(kcal((G * 28) / DAYS), 6);
  });

  it('a lot that lasted longer moves energy into later months', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', url('/outcomes'), { harvestId: lotId, kind: 'lasted_longer', date: '2026-03-01', until: '2026-05-01' });
    expect(r.status).toBe(201);
    // 1 Mar 2026 is 151 days in: 31 days' worth left, re-spread over 1 Mar – 30 Apr (61 days)
    const left = (G * 31) / DAYS;
    const after = await share();
    expect(home(after, '2026-03')).toBeCloseTo(kcal((left * 31) / 61), 6);
    expect(home(after, '2026-04')).toBeCloseTo(kcal((left * 30) / 61), 6);
    expect(home(after, '2026-05')).toBe(0);
    // A record after it that no longer fits its lot blocks deleting it: 409 names it
    const late = await apiAs(t.owner.cookie, 'POST', url('/outcomes'), { harvestId: lotId, kind: 'spoiled', date: '2026-04-10', lostFraction: 0.5 });
    expect(late.status).toBe(201);
    const backup = await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/exports/backup.json`);
    expect(backup.body.larderOutcomes.map((o: any) => [o.harvestId, o.kind, o.date])).toEqual([
      [lotId, 'lasted_longer', '2026-03-01'],
      [lotId, 'spoiled', '2026-04-10'],
    ]);
    const blocked = await apiAs(t.owner.cookie, 'DELETE', url(`/outcomes/${r.body.outcome.id}`));
    expect(blocked.status).toBe(409);
    expect(blocked.body.error.message).toMatch(/2026-04-10/);
  });

  it('an edit that would break a record is refused with 409; a change of use drops the records', async () => {
    const moved = await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hid}/harvests/${lotId}`, { date: '2026-04-01' });
    expect(moved.status).toBe(409);
    expect(moved.body.error.message).toMatch(/2026-03-01/);
    const sold = await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hid}/harvests/${lotId}`, { use: 'sold' });
    expect(sold.status).toBe(200);
    const [rows] = await pool.query<any[]>('SELECT COUNT(*) AS n FROM larder_outcomes WHERE harvest_id = ?', [lotId]);
    expect(Number(rows[0].n)).toBe(0);
  });
});

describe('the larder read', () => {
  it('shows a lot stored since the 1st of last month with what is left, for every member', async () => {
    const today = new Date(new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/Berlin' }).format(new Date()) + 'T00:00:00Z');
    const day = (d: Date) => d.toISOString().slice(0, 10);
    const start = new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth() - 1, 1)); // the 1st of last month
    const crop = await makeCrop(t.owner.cookie, hid, { name: 'Onion', foodId: await foodId('11282'), category: 'other' });
    const lot = await logHarvest(t.grower.cookie, hid, { cropId: crop.id, date: day(start), quantity: 10, unit: 'kg', use: 'stored', spreadMonths: 3 });
    const r = await apiAs(t.viewer.cookie, 'GET', url());
    expect(r.status).toBe(200);
    const got = r.body.lots.find((l: any) => l.harvestId === lot.id);
    const end = new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth() + 3, start.getUTCDate()));
    const total = (end.getTime() - start.getTime()) / 86400000;
    const left = (end.getTime() - today.getTime()) / 86400000;
    expect(got.runsOut).toBe(day(end));
    expect(got.remainingQuantity).toBeCloseTo((10 * left) / total, 3);
    // USDA SR28, NDB 11282 "Onions, raw": 10 % refuse, 40 kcal per 100 g
    expect(got.energyKcal).toBeCloseTo((((9000 * left) / total) / 100) * 40, 1);
    // common practice (no published source): the crop table's typical winter loss is only shown
    expect(r.body.emptyMonths.length).toBeGreaterThan(0);
    expect(r.body.today).toBe(day(today));
  });
});
