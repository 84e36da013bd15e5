import { describe, expect, it } from 'vitest';
import { shareGroups, type FoodAmounts, type GroupRow } from '@/lib/share-groups';
import { TOP_CROPS_PER_NUTRIENT, topCrops } from '@/lib/top-crops';

// USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw", per 100 g: 77 kcal, 2.05 g protein, 19.7 mg vitamin C
const POTATO = 1;
// USDA SR28, NDB 11485 "Squash, winter, butternut, raw", per 100 g: 45 kcal, 1.00 g protein, 21 mg vitamin C
const BUTTERNUT = 2;
// A food with only an energy value: the other nutrients are unknown.
const ENERGY_ONLY = 3;
const amounts: FoodAmounts = new Map([
  [POTATO, { energy_kcal: 77, protein_g: 2.05, vitamin_c_mg: 19.7 }],
  [BUTTERNUT, { energy_kcal: 45, protein_g: 1, vitamin_c_mg: 21 }],
  [ENERGY_ONLY, { energy_kcal: 100 }],
]);

function row(over: Partial<GroupRow>): GroupRow {
  return { month: '2026-08', use: 'fresh', spread: 1, cropId: 1, foodId: POTATO, name: 'Potato', grams: 1000, edibleGrams: 1000, entries: 1, ...over };
}

describe('top crops', () => {
  it('ranks crops by energy eaten and gives each its share of home food', () => {
    const groups = shareGroups(
      [row({}), row({ cropId: 2, foodId: BUTTERNUT, name: 'Butternut' })],
      [row({ cropId: null, foodId: POTATO, edibleGrams: 5000 })],
      amounts,
    );
    const top = topCrops(groups, '2026-01', '2026-12');
    expect(top.map((c) => c.name)).toEqual(['Potato', 'Butternut']);
    expect(top[0]!.values.energy_kcal).toBe(770); // 1000 g × 77 kcal / 100 g (USDA SR28, NDB 11352); bought food not counted
    expect(top[0]!.shareOfHome.energy_kcal).toBeCloseTo(770 / (770 + 450), 12); // butternut 1000 g × 45 kcal / 100 g (USDA SR28, NDB 11485)
    expect(top[1]!.values.vitamin_c_mg).toBe(210); // 1000 g × 21 mg / 100 g (USDA SR28, NDB 11485)
  });

  it('counts stored food only in the months of the range it is eaten in', () => {
    const groups = shareGroups([row({ month: '2026-11', use: 'stored', spread: 4 })], [], amounts);
    // Eaten per day from 1 Nov 2026 to 1 Mar 2027 (120 days); Nov + Dec 2026 are 30 + 31 = 61 of them.
    expect(topCrops(groups, '2026-01', '2026-12')[0]!.values.energy_kcal).toBeCloseTo((770 * 61) / 120, 9); // 1000 g × 77 kcal/100 g (USDA SR28, NDB 11352)
  });

  it('shows unknown, not 0, for a nutrient the food has no value for', () => {
    const groups = shareGroups([row({ cropId: 5, foodId: ENERGY_ONLY, name: 'Oca' })], [], amounts);
    const [oca] = topCrops(groups, '2026-01', '2026-12');
    expect(oca!.values.energy_kcal).toBe(1000);
    expect(oca!.values.protein_g).toBeNull();
    expect(oca!.shareOfHome.vitamin_c_mg).toBeNull();
  });

  it('leaves out crops given away, sold or eaten outside the range', () => {
    const groups = shareGroups([row({ use: 'given' }), row({ cropId: 2, foodId: BUTTERNUT, name: 'Butternut', month: '2025-08' })], [], amounts);
    expect(topCrops(groups, '2026-01', '2026-12')).toEqual([]);
  });

  it(`names at most ${TOP_CROPS_PER_NUTRIENT} crops per nutrient`, () => {
    const rows = Array.from({ length: TOP_CROPS_PER_NUTRIENT + 2 }, (_, i) => row({ cropId: i + 1, name: `Crop ${i + 1}`, edibleGrams: 100 * (i + 1) }));
    const top = topCrops(shareGroups(rows, [], amounts), '2026-01', '2026-12');
    expect(top).toHaveLength(TOP_CROPS_PER_NUTRIENT);
    expect(top.map((c) => c.cropId)).toEqual([7, 6, 5, 4, 3]);
  });
});
