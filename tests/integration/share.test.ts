/**
 * GET /api/households/{id}/share against the real MariaDB and the built server: a household with
 * people, harvests of every use (fresh, stored across a year end, preserved, seed, sold, given,
 * lost), a not-food crop and bulk purchases. Every expected number is worked out by hand below from
 * the SR28 values the food API returns and DRI values typed with their source — not by the app's
 * own share code. Entries are written straight into the tables so this test rests on nothing but
 * the share endpoint.
 */
import type { Pool } from 'mysql2/promise';
import type { ResultSetHeader } from 'mysql2';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, testPool } from '../support/env';
import { apiAs, createHousehold, householdWithRoles, newVerifiedUser, type RoleFixture, type TestUser } from '../support/users';

interface Food {
  id: number;
  refusePct: number | null;
  per100: Record<string, number | null>;
}

async function food(code: string): Promise<Food> {
  const hit = await api(`/api/foods?code=${code}`);
  const id = hit.body.foods[0].id as number;
  const d = await api(`/api/foods/${id}`);
  return { id, refusePct: d.body.food.refusePct, per100: Object.fromEntries(d.body.food.nutrients.map((n: { key: string; amount: number | null }) => [n.key, n.amount])) };
}

let pool: Pool;
let t: RoleFixture;
let other: { owner: TestUser; householdId: number };
let potato: Food, squash: Food, kale: Food, currant: Food, tomato: Food, flour: Food, milk: Food;
const crop: Record<string, number> = {};

async function insertCrop(householdId: number, name: string, foodId: number, notFood = false): Promise<number> {
  const [r] = await pool.query<ResultSetHeader>('INSERT INTO crops (household_id, name, food_id, not_food) VALUES (?, ?, ?, ?)', [householdId, name, foodId, notFood]);
  return r.insertId;
}

async function insertHarvest(householdId: number, h: { cropId: number | null; foodId: number; date: string; grams: number; edibleGrams: number; use: string; spread?: number }) {
  await pool.query(
    'INSERT INTO harvests (household_id, crop_id, food_id, date, quantity, unit, grams, edible_grams, `use`, spread_months) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)',
    [householdId, h.cropId, h.foodId, h.date, h.grams, 'g', h.grams, h.edibleGrams, h.use, h.spread ?? 1],
  );
}

async function insertPurchase(householdId: number, p: { foodId: number; date: string; grams: number; edibleGrams: number; spread: number }) {
  await pool.query(
    'INSERT INTO purchases (household_id, food_id, date, quantity, unit, grams, edible_grams, spread_months) VALUES (?, ?, ?, ?, ?, ?, ?, ?)',
    [householdId, p.foodId, p.date, p.grams, 'g', p.grams, p.edibleGrams, p.spread],
  );
}

// Edible portion = grams × (1 − refuse/100) (PRODUCT.md "Edible portion"; USDA SR28 refuse definition)
const edible = (grams: number, f: Food) => grams * (1 - (f.refusePct ?? 0) / 100);

// Hand-worked edible grams of household A's entries (weights invented for the test; refuse from SR28).
let E: Record<string, number>;

beforeAll(async () => {
  pool = testPool();
  const foods = await Promise.all(['11352', '11485', '11233', '09083', '11529', '20080', '01077'].map(food));
  [potato, squash, kale, currant, tomato, flour, milk] = foods as [Food, Food, Food, Food, Food, Food, Food];
  t = await householdWithRoles({ name: 'Share plot', timezone: 'Europe/Berlin' });
  const A = t.household.id;

  crop.potato = await insertCrop(A, 'Potato', potato.id);
  crop.squash = await insertCrop(A, 'Butternut', squash.id);
  crop.kale = await insertCrop(A, 'Kale', kale.id);
  crop.currant = await insertCrop(A, 'Blackcurrant', currant.id);
  // Sweet peas are toxic: a not-food crop. Matched (wrongly) to potatoes here, so that a leak would show.
  crop.sweetPea = await insertCrop(A, 'Sweet pea', potato.id, true);

  E = {
    potStored: edible(40_000, potato), // 2026-11-05, stored over 4 months: per day from 5 Nov to 4 Mar (see DAYS)
    kale: edible(2_000, kale), // 2027-06-10 fresh
    currant: edible(3_000, currant), // 2027-07-15 fresh
    potFresh: edible(5_000, potato), // 2027-08-01 fresh
    tomato: edible(4_000, tomato), // 2027-08-20 fresh, logged against the reference food directly
    squashStored: edible(9_000, squash), // 2027-09-20 stored over 5 months: per day from 20 Sep to 19 Feb 2028
    potSold: edible(10_000, potato), // 2027-09-10 sold
    potSeed: edible(2_000, potato), // 2027-09-15 kept as seed
    potLost: edible(1_000, potato), // 2027-09-15 lost
    squashGiven: edible(3_000, squash), // 2027-10-01 given away
    squashPreserved: edible(4_000, squash), // 2027-10-05 preserved over 2 months: per day from 5 Oct to 4 Dec
    flour: edible(25_000, flour), // bought 2026-12-20, spread over 6 months: per day from 20 Dec to 19 Jun
    milk: edible(30_000, milk), // bought 2027-07-01, one month
  };
  const H = (cropId: number | null, f: Food, date: string, grams: number, use: string, spread = 1) =>
    insertHarvest(A, { cropId, foodId: f.id, date, grams, edibleGrams: edible(grams, f), use, spread });
  await H(crop.potato, potato, '2026-11-05', 40_000, 'stored', 4);
  await H(crop.kale, kale, '2027-06-10', 2_000, 'fresh');
  await H(crop.currant, currant, '2027-07-15', 3_000, 'fresh');
  await H(crop.potato, potato, '2027-08-01', 5_000, 'fresh');
  await H(null, tomato, '2027-08-20', 4_000, 'fresh');
  await H(crop.sweetPea, potato, '2027-08-01', 1_000, 'fresh');
  await H(crop.squash, squash, '2027-09-20', 9_000, 'stored', 5);
  await H(crop.potato, potato, '2027-09-10', 10_000, 'sold');
  await H(crop.potato, potato, '2027-09-15', 2_000, 'seed');
  await H(crop.potato, potato, '2027-09-15', 1_000, 'lost');
  await H(crop.squash, squash, '2027-10-01', 3_000, 'given');
  await H(crop.squash, squash, '2027-10-05', 4_000, 'preserved', 2);
  await insertPurchase(A, { foodId: flour.id, date: '2026-12-20', grams: 25_000, edibleGrams: E.flour!, spread: 6 });
  await insertPurchase(A, { foodId: milk.id, date: '2027-07-01', grams: 30_000, edibleGrams: E.milk!, spread: 1 });

  const people = [
    { name: 'Ada', sex: 'female', ageYears: 34, kcalPerDay: 2000 },
    { name: 'Bram', sex: 'male', birthYear: 1985, heightCm: 180, weightKg: 80, activity: 'active', atHomePct: 50 },
    { name: 'Cleo', sex: 'female', ageYears: 25, kcalPerDay: 1800, presentFrom: '2027-07-10', presentTo: '2027-08-20' },
  ];
  for (const p of people) {
    const r = await apiAs(t.owner.cookie, 'POST', `/api/households/${A}/people`, p);
    expect(r.status).toBe(201);
  }

  // Household B: its own big harvest, purchase and person must never show in A's report.
  const bOwner = await newVerifiedUser({ name: 'Bea Other' });
  const B = (await createHousehold(bOwner.cookie, { name: 'Other plot' })).id;
  other = { owner: bOwner, householdId: B };
  const bPotato = await insertCrop(B, 'Potato', potato.id);
  await insertHarvest(B, { cropId: bPotato, foodId: potato.id, date: '2027-01-10', grams: 100_000, edibleGrams: 75_000, use: 'fresh' });
  await insertHarvest(B, { cropId: bPotato, foodId: potato.id, date: '2027-09-10', grams: 50_000, edibleGrams: 37_500, use: 'sold' });
  await insertPurchase(B, { foodId: flour.id, date: '2027-01-05', grams: 10_000, edibleGrams: 10_000, spread: 1 });
  expect((await apiAs(bOwner.cookie, 'POST', `/api/households/${B}/people`, { name: 'Bo', sex: 'male', ageYears: 30 })).status).toBe(201);
});

afterAll(async () => {
  await pool?.end();
});

const share = (cookie: string, id: number, q = '') => apiAs(cookie, 'GET', `/api/households/${id}/share${q}`);

// Issue 9: a lot kept 2 months or more is eaten evenly per day from its date (included) to the same
// date n months later (excluded), date-fns addMonths; days counted by hand from the calendar.
const DAYS = {
  // potatoes stored 5 Nov 2026 for 4 months, to 5 Mar 2027: Nov 5–30 = 26, Dec 31, Jan 31, Feb 28, Mar 1–4 = 4
  potStored: { total: 120, nov: 26, dec: 31, jan: 31, feb: 28, mar: 4 },
  // flour bought 20 Dec 2026 for 6 months, to 20 Jun 2027: Dec 20–31 = 12, Jan 31, Feb 28, Mar 31, Apr 30, May 31, Jun 1–19 = 19
  flour: { total: 182, dec: 12, jan: 31, may: 31, jun: 19, in2027: 31 + 28 + 31 + 30 + 31 + 19 },
  // squash stored 20 Sep 2027 for 5 months, to 20 Feb 2028: Sep 20–30 = 11, Oct 31, Nov 30, Dec 31, Jan 31, Feb 1–19 = 19
  squashStored: { total: 153, sep: 11, oct: 31, nov: 30, dec: 31 },
  // squash preserved 5 Oct 2027 for 2 months, to 5 Dec 2027: Oct 5–31 = 27, Nov 30, Dec 1–4 = 4
  squashPreserved: { total: 61, oct: 27, nov: 30, dec: 4 },
};

describe('reference values the hand calculation rests on', () => {
  it('reads the SR28 foods as published', () => {
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal, 2.05 g protein, 19.7 mg vitamin C, 25 % refuse per 100 g
    expect([potato.per100.energy_kcal, potato.per100.protein_g, potato.per100.vitamin_c_mg, potato.refusePct]).toEqual([77, 2.05, 19.7, 25]);
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": 45 kcal, 1.00 g protein, 21 mg vitamin C, 16 % refuse
    expect([squash.per100.energy_kcal, squash.per100.protein_g, squash.per100.vitamin_c_mg, squash.refusePct]).toEqual([45, 1, 21, 16]);
    // USDA SR28, NDB 11233 "Kale, raw": 49 kcal, 4.28 g protein, 120 mg vitamin C, 28 % refuse
    expect([kale.per100.energy_kcal, kale.per100.protein_g, kale.per100.vitamin_c_mg, kale.refusePct]).toEqual([49, 4.28, 120, 28]);
    // USDA SR28, NDB 09083 "Currants, European black, raw": 63 kcal, 1.40 g protein, 181 mg vitamin C, 2 % refuse; no vitamin K value
    expect([currant.per100.energy_kcal, currant.per100.protein_g, currant.per100.vitamin_c_mg, currant.refusePct]).toEqual([63, 1.4, 181, 2]);
    expect(currant.per100.vitamin_k_ug).toBeNull();
    // USDA SR28, NDB 11529 "Tomatoes, red, ripe, raw, year round average": 18 kcal, 0.88 g protein, 9 % refuse
    expect([tomato.per100.energy_kcal, tomato.per100.protein_g, tomato.refusePct]).toEqual([18, 0.88, 9]);
    // USDA SR28, NDB 20080 "Wheat flour, whole-grain": 340 kcal, 13.21 g protein, no refuse
    expect([flour.per100.energy_kcal, flour.per100.protein_g, flour.refusePct]).toEqual([340, 13.21, 0]);
    // USDA SR28, NDB 01077 "Milk, whole, 3.25% milkfat, with added vitamin D": 61 kcal, 3.15 g protein
    expect([milk.per100.energy_kcal, milk.per100.protein_g]).toEqual([61, 3.15]);
  });
});

describe('GET /api/households/{id}/share', () => {
  // Daily needs (National Academies DRI; IOM 2005 EER). Bram eats half his meals at home (× 0.5).
  // EER men ≥19 y = 662 − 9.53 × age + PA × (15.91 × kg + 539.6 × m), PA "active" = 1.25 (IOM 2005, ch. 5)
  const bramEer = 662 - 9.53 * 42 + 1.25 * (15.91 * 80 + 539.6 * 1.8); // age 2027 − 1985 = 42; = 3066.84 kcal
  const kcalDay = 2000 + bramEer * 0.5; // Ada stated 2000; Cleo (1800 stated) only when present
  // RDA protein: women 19–30 and 31–50 y 46 g (National Academies DRI, Macronutrients table; Ada and Cleo give no weight);
  // Bram gives 80 kg: 0.80 g/kg/day from 19 y × 80 kg = 64 g (IOM 2005 DRI for macronutrients, ch. 10), half at home
  const proteinDay = 46 + 0.8 * 80 * 0.5;
  // RDA vitamin C: women ≥19 y 75 mg, men ≥19 y 90 mg (National Academies DRI, Vitamins table)
  const vitCDay = 75 + 90 * 0.5;
  // AI vitamin K: women ≥19 y 90 µg, men ≥19 y 120 µg (National Academies DRI, Vitamins table)
  const vitKDay = 90 + 120 * 0.5;

  let body: any;
  const month = (m: string) => body.months.find((x: { month: string }) => x.month === m).values;

  beforeAll(async () => {
    const r = await share(t.owner.cookie, t.household.id, '?from=2027-01&to=2027-12');
    expect(r.status).toBe(200);
    body = r.body;
  });

  it('answers the documented shape with every key nutrient', () => {
    expect(body.from).toBe('2027-01');
    expect(body.to).toBe('2027-12');
    const keys = body.nutrients.map((n: { key: string }) => n.key);
    for (const k of ['energy_kcal', 'protein_g', 'fat_g', 'carbohydrate_g', 'fiber_g', 'vitamin_a_rae_ug', 'vitamin_c_mg', 'folate_dfe_ug', 'vitamin_k_ug', 'vitamin_b12_ug', 'calcium_mg', 'iron_mg', 'magnesium_mg', 'potassium_mg', 'zinc_mg']) {
      expect(keys).toContain(k);
    }
    expect(body.nutrients[0]).toEqual({ key: 'energy_kcal', name: 'Energy', unit: 'kcal' });
    expect(body.months).toHaveLength(12);
    expect(body.months[1]).toMatchObject({ month: '2027-02', days: 28 });
    expect(Object.keys(body.months[0].values.energy_kcal).sort()).toEqual(expect.arrayContaining(['bought', 'home', 'need', 'shareOfIntake', 'shareOfNeed']));
    expect(body.peopleCount).toBe(3);
    // The household was made after its first entry (5 Nov 2026): its records start in that month
    expect(body.recordsSince).toBe('2026-11');
    expect(body.months.every((m: { beforeRecords: boolean }) => !m.beforeRecords)).toBe(true);
  });

  it('counts potatoes stored in November per day into January, February and early March, beside the bulk flour of December', () => {
    const jan = month('2027-01');
    const D = DAYS.potStored;
    const homeKcal = ((E.potStored! * D.jan) / D.total / 100) * 77; // 31 of the lot's 120 days
    const boughtKcal = ((E.flour! * DAYS.flour.jan) / DAYS.flour.total / 100) * 340; // 31 of the flour's 182 days
    expect(jan.energy_kcal.home).toBeCloseTo(homeKcal, 6);
    // 30,000 g edible (40 kg × 0.75) × 31/120 = 7750 g × 77 kcal/100 g (USDA SR28, NDB 11352) = 5967.5 kcal
    expect(jan.energy_kcal.home).toBeCloseTo(5967.5, 6);
    expect(jan.energy_kcal.bought).toBeCloseTo(boughtKcal, 6);
    expect(jan.energy_kcal.need).toBeCloseTo(31 * kcalDay, 6);
    expect(jan.energy_kcal.shareOfIntake).toBeCloseTo(homeKcal / (homeKcal + boughtKcal), 10);
    expect(jan.energy_kcal.shareOfNeed).toBeCloseTo(homeKcal / (31 * kcalDay), 10);
    expect(jan.protein_g.home).toBeCloseTo(((E.potStored! * D.jan) / D.total / 100) * 2.05, 6);
    expect(jan.protein_g.need).toBeCloseTo(31 * proteinDay, 6);
    expect(month('2027-02').energy_kcal.need).toBeCloseTo(28 * kcalDay, 6);
    // 30,000 g × 28/120 = 7000 g × 0.77 kcal/g (USDA SR28, NDB 11352) = 5390 kcal
    expect(month('2027-02').energy_kcal.home).toBeCloseTo(5390, 6);
    // The potatoes' last days are 1–4 March: 30,000 g × 4/120 = 1000 g × 0.77 = 770 kcal; none in April.
    expect(month('2027-03').energy_kcal.home).toBeCloseTo(770, 6);
    expect(month('2027-04').energy_kcal.home).toBe(0);
    // Flour runs to 19 June.
    expect(month('2027-05').energy_kcal.bought).toBeCloseTo(((E.flour! * DAYS.flour.may) / DAYS.flour.total / 100) * 340, 6);
    expect(month('2027-06').energy_kcal.bought).toBeCloseTo(((E.flour! * DAYS.flour.jun) / DAYS.flour.total / 100) * 340, 6);
    expect(month('2027-07').energy_kcal.bought).toBeCloseTo((E.milk! / 100) * 61, 6); // the milk only (USDA SR28, NDB 01077)
  });

  it('gives a known zero share when nothing home-grown was eaten, and a full share when nothing was bought', () => {
    const apr = month('2027-04').energy_kcal; // only flour in April
    expect(apr.shareOfIntake).toBe(0);
    expect(apr.shareOfNeed).toBe(0);
    const jun = month('2027-06');
    const kaleKcal = (E.kale! / 100) * 49; // USDA SR28, NDB 11233: 49 kcal/100 g
    const flourKcal = ((E.flour! * DAYS.flour.jun) / DAYS.flour.total / 100) * 340; // USDA SR28, NDB 20080: 340 kcal/100 g
    expect(jun.energy_kcal.home).toBeCloseTo(kaleKcal, 6);
    expect(jun.energy_kcal.shareOfIntake).toBeCloseTo(kaleKcal / (kaleKcal + flourKcal), 10);
    expect(jun.vitamin_c_mg.home).toBeCloseTo((E.kale! / 100) * 120, 6);
    expect(jun.vitamin_c_mg.shareOfNeed).toBeCloseTo(((E.kale! / 100) * 120) / (30 * vitCDay), 10);
    expect(month('2027-09').energy_kcal.shareOfIntake).toBe(1); // stored squash, nothing bought
  });

  it('counts a guest only on the days present, and leaves an unknown value unknown, never zero', () => {
    const jul = month('2027-07');
    // Cleo: 10–31 July = 22 days; 1–20 August = 20 days
    expect(jul.energy_kcal.need).toBeCloseTo(31 * kcalDay + 22 * 1800, 6);
    expect(month('2027-08').energy_kcal.need).toBeCloseTo(31 * kcalDay + 20 * 1800, 6);
    expect(jul.protein_g.need).toBeCloseTo(31 * proteinDay + 22 * 46, 6);
    expect(jul.energy_kcal.home).toBeCloseTo((E.currant! / 100) * 63, 6);
    expect(jul.energy_kcal.bought).toBeCloseTo((E.milk! / 100) * 61, 6);
    // Blackcurrants have no vitamin K value in SR28: the home amount is unknown, not 0.
    expect(jul.vitamin_k_ug.home).toBeNull();
    expect(jul.vitamin_k_ug.shareOfNeed).toBeNull();
    expect(jul.vitamin_k_ug.need).toBeCloseTo(31 * vitKDay + 22 * 90, 6);
    expect(jul.vitamin_k_ug.unknownGrams).toBeCloseTo(E.currant!, 6);
  });

  it('never counts a not-food crop, and counts a harvest logged against a reference food', () => {
    const aug = month('2027-08').energy_kcal;
    // potatoes 3750 g × 0.77 + tomatoes 3640 g × 0.18; the sweet peas (not food) add nothing
    expect(aug.home).toBeCloseTo((E.potFresh! / 100) * 77 + (E.tomato! / 100) * 18, 6);
    expect(aug.shareOfIntake).toBe(1);
  });

  it('spreads stored and preserved squash over their days and never eats seed, sales, gifts or losses', () => {
    const S = DAYS.squashStored;
    const P = DAYS.squashPreserved;
    const stored = (days: number) => (E.squashStored! * days) / S.total;
    const preserved = (days: number) => (E.squashPreserved! * days) / P.total;
    // USDA SR28, NDB 11485 butternut: 45 kcal and 21 mg vitamin C per 100 g
    expect(month('2027-09').energy_kcal.home).toBeCloseTo((stored(S.sep) / 100) * 45, 6);
    expect(month('2027-10').energy_kcal.home).toBeCloseTo(((stored(S.oct) + preserved(P.oct)) / 100) * 45, 6);
    expect(month('2027-11').energy_kcal.home).toBeCloseTo(((stored(S.nov) + preserved(P.nov)) / 100) * 45, 6);
    expect(month('2027-12').energy_kcal.home).toBeCloseTo(((stored(S.dec) + preserved(P.dec)) / 100) * 45, 6);
    expect(month('2027-12').vitamin_c_mg.home).toBeCloseTo(((stored(S.dec) + preserved(P.dec)) / 100) * 21, 6);
  });

  it('totals the year and gives the FAO self-sufficiency ratio of the year’s flows', () => {
    const k = (grams: number, per100: number) => (grams / 100) * per100;
    const P = DAYS.potStored;
    const S = DAYS.squashStored;
    // 2027's days of each lot: potatoes Jan–4 Mar (31 + 28 + 4 of 120), squash 20 Sep–31 Dec (103 of 153), the preserved squash all 61, flour to 19 Jun (170 of 182)
    const homeKcal =
      k((E.potStored! * (P.jan + P.feb + P.mar)) / P.total, 77) +
      k(E.kale!, 49) +
      k(E.currant!, 63) +
      k(E.potFresh!, 77) +
      k(E.tomato!, 18) +
      k((E.squashStored! * (S.sep + S.oct + S.nov + S.dec)) / S.total + E.squashPreserved!, 45);
    const boughtKcal = k((E.flour! * DAYS.flour.in2027) / DAYS.flour.total, 340) + k(E.milk!, 61);
    const needKcal = 365 * kcalDay + 42 * 1800;
    const tot = body.total.values.energy_kcal;
    expect(tot.home).toBeCloseTo(homeKcal, 5);
    expect(tot.bought).toBeCloseTo(boughtKcal, 5);
    expect(tot.need).toBeCloseTo(needKcal, 5);
    expect(tot.shareOfIntake).toBeCloseTo(homeKcal / (homeKcal + boughtKcal), 10);
    expect(tot.shareOfNeed).toBeCloseTo(homeKcal / needKcal, 10);

    // Self-sufficiency ratio = production × 100 / (production + imports − exports) (FAO, Food Balance Sheets handbook)
    // production: every harvest dated in 2027 (all uses); imports: food bought in 2027 (the flour was bought in 2026); exports: sold + given
    const production =
      k(E.potFresh! + E.potSold! + E.potSeed! + E.potLost!, 77) + k(E.kale!, 49) + k(E.currant!, 63) + k(E.tomato!, 18) + k(E.squashStored! + E.squashGiven! + E.squashPreserved!, 45);
    const imports = k(E.milk!, 61);
    const exports = k(E.potSold!, 77) + k(E.squashGiven!, 45);
    expect(body.ratio.energy_kcal).toBeCloseTo(production / (production + imports - exports), 10);
  });

  it('names the crops that gave the most of each nutrient', () => {
    const byName = Object.fromEntries(body.topCrops.map((c: { name: string }) => [c.name, c]));
    expect(body.topCrops[0].name).toBe('Potato');
    expect(byName.Potato.cropId).toBe(crop.potato);
    // the stored lot's 63 days of 2027 (Jan 31 + Feb 28 + Mar 4 of 120) and the fresh potatoes; USDA SR28, NDB 11352: 77 kcal/100 g
    const potDays = DAYS.potStored.jan + DAYS.potStored.feb + DAYS.potStored.mar;
    expect(byName.Potato.values.energy_kcal).toBeCloseTo(((E.potStored! * potDays) / DAYS.potStored.total / 100) * 77 + (E.potFresh! / 100) * 77, 6);
    // Vitamin C: 2940 g of blackcurrants × 181 mg beat 18,750 g of potatoes × 19.7 mg
    const vitC = [...body.topCrops].sort((a: any, b: any) => (b.values.vitamin_c_mg ?? 0) - (a.values.vitamin_c_mg ?? 0));
    expect(vitC[0].name).toBe('Blackcurrant');
    expect(vitC[0].values.vitamin_c_mg).toBeCloseTo((E.currant! / 100) * 181, 6);
    expect(byName.Blackcurrant.values.vitamin_k_ug).toBeNull();
    expect(byName['Sweet pea']).toBeUndefined();
    const tomatoEntry = body.topCrops.find((c: { foodId: number; cropId: number | null }) => c.foodId === tomato.id && c.cropId === null);
    expect(tomatoEntry?.name).toBe('Tomatoes, red, ripe, raw, year round average');
  });

  it('breaks the year’s harvest down by use (weight as harvested and edible portion)', () => {
    const uses = Object.fromEntries(body.uses.map((u: { use: string }) => [u.use, u]));
    expect(uses.fresh.grams).toBe(2_000 + 3_000 + 5_000 + 4_000); // kale, currants, potatoes, tomatoes; not the sweet peas
    expect(uses.stored.grams).toBe(9_000); // the November potatoes belong to 2026
    expect(uses.preserved.grams).toBe(4_000);
    expect(uses.seed.grams).toBe(2_000);
    expect(uses.given.grams).toBe(3_000);
    expect(uses.sold.grams).toBe(10_000);
    expect(uses.lost.grams).toBe(1_000);
    expect(uses.sold.edibleGrams).toBeCloseTo(E.potSold!, 6);
    expect(uses.sold.energyKcal).toBeCloseTo((E.potSold! / 100) * 77, 6);
  });

  it('counts stored food in the months of an earlier range too', () => {
    return share(t.owner.cookie, t.household.id, '?from=2026-11&to=2026-12').then((r) => {
      expect(r.status).toBe(200);
      const dec = r.body.months[1].values.energy_kcal;
      expect(dec.home).toBeCloseTo(((E.potStored! * DAYS.potStored.dec) / DAYS.potStored.total / 100) * 77, 6); // 31 of 120 days
      expect(dec.bought).toBeCloseTo(((E.flour! * DAYS.flour.dec) / DAYS.flour.total / 100) * 340, 6); // 20–31 Dec: 12 of 182 days
      // Only Ada and Bram; Cleo comes in 2027. December 2026: Bram is 2026 − 1985 = 41
      const bram41 = 662 - 9.53 * 41 + 1.25 * (15.91 * 80 + 539.6 * 1.8); // IOM 2005 EER, men ≥19 y, PA 1.25
      expect(dec.need).toBeCloseTo(31 * (2000 + bram41 * 0.5), 6);
    });
  });
});

describe('share: isolation, roles and bad input', () => {
  it('never lets another household’s entries or people into the report', async () => {
    const r = await share(t.owner.cookie, t.household.id, '?from=2027-01&to=2027-01');
    expect(r.body.months[0].values.energy_kcal.home).toBeCloseTo(5967.5, 6); // 31/120 of A's stored potatoes, not + 75,000 g of B's potatoes
    expect(r.body.months[0].values.energy_kcal.bought).toBeCloseTo(((25_000 * 31) / 182 / 100) * 340, 6); // not + B's 10 kg of flour
    expect(r.body.peopleCount).toBe(3);
    const b = await share(other.owner.cookie, other.householdId, '?from=2027-01&to=2027-01');
    expect(b.body.months[0].values.energy_kcal.home).toBeCloseTo((75_000 / 100) * 77, 6);
    expect(b.body.peopleCount).toBe(1);
  });

  it('lets a viewer read and hides the household from a non-member', async () => {
    expect((await share(t.viewer.cookie, t.household.id, '?from=2027-01&to=2027-12')).status).toBe(200);
    expect((await share(t.outsider.cookie, t.household.id, '?from=2027-01&to=2027-12')).status).toBe(404);
    expect((await share(other.owner.cookie, t.household.id)).status).toBe(404);
    expect((await share('', t.household.id)).status).toBe(401);
  });

  it('answers 400 with the error shape for impossible months and ranges', async () => {
    for (const q of ['?from=2027-13&to=2027-12', '?from=2027-05&to=2027-04', '?from=2020-01&to=2030-01', '?from=spring&to=2027-12']) {
      const r = await share(t.owner.cookie, t.household.id, q);
      expect(r.status, q).toBe(400);
      expect(r.body.error.code).toBe('invalid_input');
      expect(Object.keys(r.body.error.fields).length).toBeGreaterThan(0);
    }
  });

  it('covers up to ten years (120 months)', async () => {
    const r = await share(t.owner.cookie, t.household.id, '?from=2018-01&to=2027-12');
    expect(r.status).toBe(200);
    expect(r.body.months).toHaveLength(120);
  });

  it('defaults to the growing year containing today in the household’s time zone', async () => {
    const r = await share(t.owner.cookie, t.household.id);
    expect(r.status).toBe(200);
    const today = new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/Berlin', year: 'numeric', month: '2-digit' }).format(new Date()).slice(0, 7);
    expect(r.body.from).toBe(`${today.slice(0, 4)}-01`); // yearStartMonth 1: the calendar year
    expect(r.body.to).toBe(`${today.slice(0, 4)}-12`);
    await apiAs(t.owner.cookie, 'PATCH', `/api/households/${t.household.id}`, { yearStartMonth: 10 });
    const oct = await share(t.owner.cookie, t.household.id);
    const y = Number(today.slice(0, 4));
    const startYear = Number(today.slice(5, 7)) >= 10 ? y : y - 1;
    expect(oct.body.from).toBe(`${startYear}-10`);
    expect(oct.body.to).toBe(`${startYear + 1}-09`);
    await apiAs(t.owner.cookie, 'PATCH', `/api/households/${t.household.id}`, { yearStartMonth: 1 });
  });
});
