import { describe, expect, it } from 'vitest';
import { contributorId, foodIdsOf, groupEntry, shareGroups, type FoodAmounts, type GroupRow } from '@/lib/share-groups';

// USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw", per 100 g: 77 kcal, 2.05 g protein (no other share nutrients given here)
const POTATO_ID = 1;
// A food with no amounts at all: every nutrient unknown.
const UNKNOWN_ID = 2;
const amounts: FoodAmounts = new Map([[POTATO_ID, { energy_kcal: 77, protein_g: 2.05 }]]);

function row(over: Partial<GroupRow>): GroupRow {
  return { month: '2026-08', use: 'fresh', spread: 1, cropId: 10, foodId: POTATO_ID, name: 'Potato', grams: 1000, edibleGrams: 750, entries: 2, ...over };
}

describe('share groups', () => {
  it('works out the nutrients of the edible grams from the amounts per 100 g', () => {
    const [g] = shareGroups([row({})], [], amounts);
    expect(g!.nutrients.energy_kcal).toBe(577.5); // 750 g × 77 kcal / 100 g (USDA SR28, NDB 11352)
    expect(g!.nutrients.protein_g).toBeCloseTo(15.375, 12); // 750 g × 2.05 g / 100 g (USDA SR28, NDB 11352)
  });

  it('leaves a nutrient the food has no amount for missing, never zero', () => {
    const [g] = shareGroups([row({ foodId: UNKNOWN_ID })], [], amounts);
    expect(g!.nutrients).toEqual({});
    const [noFood] = shareGroups([row({ foodId: null })], [], amounts);
    expect('energy_kcal' in noFood!.nutrients).toBe(false);
  });

  it('keeps home and bought rows apart, home first', () => {
    const groups = shareGroups([row({})], [row({ cropId: null, name: null })], amounts);
    expect(groups.map((g) => g.source)).toEqual(['home', 'bought']);
    expect(groups[0]!.key).not.toBe(groups[1]!.key);
    expect(groups[1]!.name).toBe('');
  });

  it('lists each reference food once and skips entries without one', () => {
    expect(foodIdsOf([{ foodId: 3 }, { foodId: null }, { foodId: 3 }, { foodId: 5 }])).toEqual([3, 5]);
  });

  it('names the contributor by crop, else by the food it was logged against', () => {
    expect(contributorId({ cropId: 10, foodId: 1 })).toBe(10);
    expect(contributorId({ cropId: null, foodId: 12 })).toBe('food:12');
    expect(contributorId({ cropId: null, foodId: null })).toBe('food:none');
  });

  it('turns a group into an entry dated on the first of its month', () => {
    const [g] = shareGroups([row({ use: 'stored', spread: 4, name: null, cropId: null })], [], amounts);
    const e = groupEntry(g!);
    expect(e).toMatchObject({ date: '2026-08-01', use: 'stored', source: 'home', spreadMonths: 4, edibleGrams: 750, cropId: 'food:1' });
    expect(e.name).toBe('Unnamed harvest');
  });
});
