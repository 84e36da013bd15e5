/**
 * GET /api/households/{id}/gaps against the real MariaDB and the built server: a household whose
 * crops, harvests and people are all set up through the API. The year's supply is worked out by
 * hand from USDA SR28 values; the need is read from the share endpoint (tested on its own in
 * share.test.ts), so this test checks what the gap finder adds: sums, shortfall, lean months and
 * the crops it points at.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, householdWithRoles, type RoleFixture } from '../support/users';

let t: RoleFixture;
let gaps: any;
let share: any;

beforeAll(async () => {
  t = await householdWithRoles({ name: 'Gap plot', timezone: 'Europe/Berlin' });
  const hid = t.household.id;
  const potato = await makeCrop(t.owner.cookie, hid, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  const kale = await makeCrop(t.owner.cookie, hid, { name: 'Kale', foodId: await foodId('11233'), category: 'leafy_green' });
  await logHarvest(t.grower.cookie, hid, { date: '2026-08-10', cropId: potato.id, quantity: 10, unit: 'kg', use: 'fresh' });
  await logHarvest(t.grower.cookie, hid, { date: '2026-09-05', cropId: kale.id, quantity: 2, unit: 'kg', use: 'fresh' });
  const person = await apiAs(t.owner.cookie, 'POST', `/api/households/${hid}/people`, { name: 'Ada', sex: 'female', ageYears: 34, kcalPerDay: 2000 });
  expect(person.status).toBe(201);
  const g = await apiAs(t.viewer.cookie, 'GET', `/api/households/${hid}/gaps?year=2026`);
  expect(g.status).toBe(200);
  gaps = g.body;
  const s = await apiAs(t.viewer.cookie, 'GET', `/api/households/${hid}/share?from=2026-01&to=2026-12`);
  expect(s.status).toBe(200);
  share = s.body;
});

const nutrient = (key: string) => gaps.nutrients.find((n: { key: string }) => n.key === key);
const counted = () => share.months.filter((m: any) => !m.beforeRecords && !m.future);

describe('GET /api/households/{id}/gaps', () => {
  it('covers the growing year asked for, with every key nutrient', () => {
    expect(gaps).toMatchObject({ year: 2026, from: '2026-01', to: '2026-12', label: '2026', peopleCount: 1 });
    expect(gaps.nutrients.map((n: { key: string }) => n.key)).toEqual(share.nutrients.map((n: { key: string }) => n.key));
    expect(gaps.countedMonths).toEqual(counted().map((m: any) => m.month));
    expect(gaps.cropCount).toBeGreaterThanOrEqual(50);
    // Europe/Berlin is north of the equator: the default frost dates are the northern ones.
    expect(gaps.frostDates).toEqual({ lastSpringFrost: '05-01', firstAutumnFrost: '10-01', defaulted: true });
  });

  it('sums the year’s supply by hand from SR28 and the need from the share report', () => {
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal per 100 g, 25 % refuse → 10 kg × 0.75 × 7.7 kcal/g
    const potatoKcal = 10_000 * 0.75 * 0.77; // 5,775 kcal
    // USDA SR28, NDB 11233 "Kale, raw": 49 kcal and 120 mg vitamin C per 100 g, 28 % refuse
    const kaleKcal = 2_000 * 0.72 * 0.49; // 705.6 kcal
    const kaleC = 2_000 * 0.72 * 1.2; // 1,728 mg
    const energy = nutrient('energy_kcal');
    expect(energy.home).toBeCloseTo(potatoKcal + kaleKcal, 6);
    const need = counted().reduce((s: number, m: any) => s + m.values.energy_kcal.need, 0);
    // Ada states 2,000 kcal a day: the need is 2,000 × the days of the counted months.
    expect(need).toBeCloseTo(2_000 * counted().reduce((s: number, m: any) => s + m.days, 0), 6);
    expect(energy.need).toBeCloseTo(need, 6);
    expect(energy.shortfall).toBeCloseTo(need - potatoKcal - kaleKcal, 6);
    expect(energy.shareOfNeed).toBeCloseTo((potatoKcal + kaleKcal) / need, 10);
    const vitC = nutrient('vitamin_c_mg');
    // USDA SR28 potatoes 19.7 mg vitamin C per 100 g: 7,500 g edible × 0.197 = 1,477.5 mg
    expect(vitC.home).toBeCloseTo(kaleC + 7_500 * 0.197, 6);
  });

  it('names the lean months: none are months the garden fed', () => {
    const energy = nutrient('energy_kcal');
    expect(energy.leanMonths.length).toBeGreaterThan(0);
    expect(energy.leanMonths).not.toContain('2026-08');
    expect(energy.leanMonths).not.toContain('2026-09');
    for (const m of energy.leanMonths) expect(gaps.countedMonths).toContain(m);
  });

  it('ranks crops by the area that closes the shortfall, and potatoes by the table and SR28', () => {
    const energy = nutrient('energy_kcal');
    expect(energy.leastAreaCrops.length).toBe(5);
    const areas = energy.leastAreaCrops.map((c: any) => c.m2PerUnit);
    expect([...areas].sort((a, b) => a - b)).toEqual(areas);
    for (const c of energy.leastAreaCrops) expect(c.areaToCloseM2).toBeCloseTo(energy.shortfall / c.perM2, 6);
    const vitC = nutrient('vitamin_c_mg');
    for (const c of vitC.carryCrops) {
      expect(c.covers.length).toBeGreaterThan(0);
      for (const m of c.covers) expect(vitC.leanMonths).toContain(m);
    }
  });

  it('refuses a year that is not one, naming the field', async () => {
    for (const year of ['26', 'next', '1800']) {
      const r = await apiAs(t.viewer.cookie, 'GET', `/api/households/${t.household.id}/gaps?year=${year}`);
      expect(r.status).toBe(400);
      expect(r.body.error.code).toBe('invalid_input');
      expect(r.body.error.fields.year).toMatch(/year/);
    }
  });

  it('answers the growing year containing today without a year', async () => {
    const r = await apiAs(t.owner.cookie, 'GET', `/api/households/${t.household.id}/gaps`);
    expect(r.status).toBe(200);
    expect(r.body.to).toBe(`${r.body.year}-12`);
  });
});

describe('own measured yield', () => {
  it('weighs a crop by the household’s own kg per m² once a harvest names its planting', async () => {
    const f = await householdWithRoles({ name: 'Own yield plot', timezone: 'Europe/Berlin' });
    const hid = f.household.id;
    const p = await apiAs(f.grower.cookie, 'POST', `/api/households/${hid}/plantings`, { referenceKey: 'carrots', area: 2, seasonYear: 2026 });
    expect(p.status).toBe(201);
    const planting = p.body.planting;
    await logHarvest(f.grower.cookie, hid, { date: '2026-07-20', cropId: planting.cropId, plantingId: planting.id, quantity: 8, unit: 'kg', use: 'fresh' });
    const r = await apiAs(f.viewer.cookie, 'GET', `/api/households/${hid}/gaps?year=2026`);
    expect(r.status).toBe(200);
    expect(r.body.ownYieldCrops).toEqual(['carrots']);
    const carrots = r.body.crops.find((c: { key: string }) => c.key === 'carrots');
    expect(carrots).toMatchObject({ yieldSource: 'own', yieldKgM2: 4 }); // 8 kg from 2 m²
    // USDA SR28, NDB 11124 "Carrots, raw": 41 kcal per 100 g, 11 % refuse → 4 kg × 0.89 × 410 kcal/kg
    expect(carrots.perM2.energy_kcal).toBeCloseTo(4 * 0.89 * 410, 6);
    const potatoes = r.body.crops.find((c: { key: string }) => c.key === 'potatoes');
    // crops.csv potatoes: typical 3 kg/m² (no planting of its own here)
    expect(potatoes).toMatchObject({ yieldSource: 'reference', yieldKgM2: 3 });
  });
});
