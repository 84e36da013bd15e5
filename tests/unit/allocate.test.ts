import { describe, expect, it } from 'vitest';
import { allocate, eatenParts, nutrientsOf, type FoodEntry } from '@/lib/allocate';

// Edible portion as the product brief defines it: grams as harvested × (1 − refuse/100).
const edible = (grams: number, refusePct: number) => grams * (1 - refusePct / 100);

// USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal, 2.05 g protein per 100 g; refuse 25 %
const POTATO = { per100g: { energy_kcal: 77, protein_g: 2.05 }, refuse: 25 };
// USDA SR28, NDB 11485 "Squash, winter, butternut, raw": 45 kcal, 1.00 g protein per 100 g, no choline value; refuse 16 %
const BUTTERNUT = { per100g: { energy_kcal: 45, protein_g: 1, choline_mg: null }, refuse: 16 };

function entry(over: Partial<FoodEntry> & Pick<FoodEntry, 'date'>): FoodEntry {
  return { use: 'fresh', source: 'home', spreadMonths: 1, nutrients: {}, edibleGrams: 0, ...over };
}

function crop(food: typeof POTATO | typeof BUTTERNUT, gramsAsHarvested: number, over: Partial<FoodEntry> & Pick<FoodEntry, 'date'>): FoodEntry {
  const grams = edible(gramsAsHarvested, food.refuse);
  return entry({ edibleGrams: grams, nutrients: nutrientsOf(grams, food.per100g), ...over });
}

describe('nutrients of an entry', () => {
  it('carries SR28 values through edible portion and amounts per 100 g exactly', () => {
    const grams = edible(1000, POTATO.refuse);
    expect(grams).toBe(750); // 1000 g × (1 − 25/100)
    const n = nutrientsOf(grams, POTATO.per100g);
    expect(n.energy_kcal).toBe(577.5); // 750/100 × 77
    expect(n.protein_g).toBeCloseTo(15.375, 10); // 750/100 × 2.05
  });

  it('keeps a missing dataset value as null, not zero', () => {
    const n = nutrientsOf(edible(1000, BUTTERNUT.refuse), BUTTERNUT.per100g);
    expect(n.energy_kcal).toBe(378); // 840/100 × 45
    expect(n.choline_mg).toBeNull();
  });

  it('refuses negative weights and amounts', () => {
    expect(() => nutrientsOf(-1, { energy_kcal: 77 })).toThrow(RangeError);
    expect(() => nutrientsOf(100, { energy_kcal: -77 })).toThrow(RangeError);
  });
});

describe('when food is eaten', () => {
  it('puts fresh food in the month of the entry', () => {
    const e = crop(POTATO, 1000, { date: '2026-07-14' });
    const [jun, jul, aug] = allocate([e], { from: '2026-06', to: '2026-08', keys: ['energy_kcal'] });
    expect(jun!.sums.energy_kcal.home).toBe(0);
    expect(jul!.sums.energy_kcal.home).toBe(577.5);
    expect(aug!.sums.energy_kcal.home).toBe(0);
  });

  it('spreads a stored harvest evenly per day over its months, across the year end', () => {
    const e = crop(BUTTERNUT, 1000, { date: '2026-11-20', use: 'stored', spreadMonths: 4 });
    const months = allocate([e], { from: '2026-10', to: '2027-03', keys: ['energy_kcal'] });
    expect(months.map((m) => m.month)).toEqual(['2026-10', '2026-11', '2026-12', '2027-01', '2027-02', '2027-03']);
    // 378 kcal (840 g edible × 45 kcal/100 g) over 20 Nov 2026 – 19 Mar 2027: 11 + 31 + 31 + 28 + 19 = 120 days (Gregorian calendar)
    const expected = [0, 11, 31, 31, 28, 19].map((days) => (378 * days) / 120);
    months.forEach((m, i) => expect(m.sums.energy_kcal.home).toBeCloseTo(expected[i]!, 9));
  });

  it('gives February its 28 days, not a whole month\u2019s share', () => {
    const parts = eatenParts({ date: '2027-01-03', use: 'preserved', source: 'home', spreadMonths: 2 });
    // 3 Jan – 2 Mar 2027: 29 + 28 + 2 = 59 days (Gregorian calendar)
    expect(parts.map((p) => p.month)).toEqual(['2027-01', '2027-02', '2027-03']);
    expect(parts.map((p) => p.fraction * 59)).toEqual([29, 28, 2].map((d) => expect.closeTo(d, 9)));
  });

  it('spreads a bulk purchase over its months and keeps it apart from home food', () => {
    const bought = crop(POTATO, 1000, { date: '2026-01-01', source: 'bought', spreadMonths: 3 });
    const home = crop(POTATO, 1000, { date: '2026-02-01' });
    const months = allocate([bought, home], { from: '2026-01', to: '2026-03', keys: ['energy_kcal'] });
    // 577.5 kcal over 1 Jan – 31 Mar 2026: 31 + 28 + 31 = 90 days (Gregorian calendar)
    const expected = [31, 28, 31].map((days) => (577.5 * days) / 90);
    months.forEach((m, i) => expect(m.sums.energy_kcal.bought).toBeCloseTo(expected[i]!, 9));
    expect(months.map((m) => m.sums.energy_kcal.home)).toEqual([0, 577.5, 0]);
  });

  it('puts a purchase with a spread of 1 in its own month', () => {
    const bought = crop(POTATO, 1000, { date: '2026-05-31', source: 'bought', spreadMonths: 1 });
    const months = allocate([bought], { from: '2026-05', to: '2026-06', keys: ['energy_kcal'] });
    expect(months.map((m) => m.sums.energy_kcal.bought)).toEqual([577.5, 0]);
  });

  it('eats fresh home food in its month even if a spread is set', () => {
    expect(eatenParts({ date: '2026-05-02', use: 'fresh', source: 'home', spreadMonths: 3 })).toEqual([
      { month: '2026-05', fraction: 1 },
    ]);
  });

  it('allocates nothing for seed, gifts, sales and losses', () => {
    const entries = (['seed', 'given', 'sold', 'lost'] as const).map((use) => crop(POTATO, 1000, { date: '2026-09-01', use }));
    const [sep] = allocate(entries, { from: '2026-09', to: '2026-09', keys: ['energy_kcal'] });
    expect(sep!.sums.energy_kcal).toEqual({
      home: 0,
      bought: 0,
      homeKnownGrams: 0,
      homeUnknownGrams: 0,
      boughtKnownGrams: 0,
      boughtUnknownGrams: 0,
    });
  });

  it('counts food stored before the range in the months of the range it is eaten in', () => {
    const e = crop(BUTTERNUT, 1000, { date: '2025-10-10', use: 'stored', spreadMonths: 6 });
    const months = allocate([e], { from: '2026-01', to: '2026-06', keys: ['energy_kcal'] });
    // 10 Oct 2025 – 9 Apr 2026: 22 + 30 + 31 + 31 + 28 + 31 + 9 = 182 days; Jan–Apr fall in the range (Gregorian calendar)
    const expected = [31, 28, 31, 9, 0, 0].map((days) => (378 * days) / 182);
    months.forEach((m, i) => expect(m.sums.energy_kcal.home).toBeCloseTo(expected[i]!, 9));
  });

  it('tracks the weight whose nutrient value is unknown instead of counting it as zero', () => {
    const squash = crop(BUTTERNUT, 1000, { date: '2026-10-01' }); // 840 g, no choline value in SR28
    const potato = entry({ date: '2026-10-02', edibleGrams: 750, nutrients: { choline_mg: 90.75 } }); // 750/100 × 12.1 mg (SR28 NDB 11352)
    const [oct] = allocate([squash, potato], { from: '2026-10', to: '2026-10', keys: ['choline_mg'] });
    expect(oct!.sums.choline_mg.home).toBe(90.75);
    expect(oct!.sums.choline_mg.homeKnownGrams).toBe(750);
    expect(oct!.sums.choline_mg.homeUnknownGrams).toBe(840);
  });

  it('treats a nutrient the entry does not mention as unknown', () => {
    const e = entry({ date: '2026-10-01', source: 'bought', edibleGrams: 500, nutrients: { energy_kcal: 100 } });
    const [oct] = allocate([e], { from: '2026-10', to: '2026-10', keys: ['iron_mg'] });
    expect(oct!.sums.iron_mg.bought).toBe(0);
    expect(oct!.sums.iron_mg.boughtUnknownGrams).toBe(500);
  });

  it('spreads the unknown weight with the food', () => {
    const e = crop(BUTTERNUT, 1000, { date: '2026-11-01', use: 'stored', spreadMonths: 4 });
    const months = allocate([e], { from: '2026-11', to: '2027-02', keys: ['choline_mg'] });
    // 840 g over 1 Nov 2026 – 28 Feb 2027: 30 + 31 + 31 + 28 = 120 days (Gregorian calendar)
    const expected = [30, 31, 31, 28].map((days) => (840 * days) / 120);
    months.forEach((m, i) => expect(m.sums.choline_mg.homeUnknownGrams).toBeCloseTo(expected[i]!, 9));
  });

  it('refuses a spread that is not a whole number of months from 1', () => {
    for (const spreadMonths of [0, -2, 1.5]) {
      expect(() => eatenParts({ date: '2026-01-01', use: 'stored', source: 'home', spreadMonths })).toThrow(RangeError);
    }
  });

  it('refuses an impossible date and a negative weight', () => {
    expect(() => allocate([entry({ date: '2026-02-30' })], { from: '2026-01', to: '2026-03', keys: ['energy_kcal'] })).toThrow(
      RangeError,
    );
    expect(() =>
      allocate([entry({ date: '2026-02-01', edibleGrams: -5 })], { from: '2026-01', to: '2026-03', keys: ['energy_kcal'] }),
    ).toThrow(RangeError);
  });
});
