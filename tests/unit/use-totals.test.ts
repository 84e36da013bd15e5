import { describe, expect, it } from 'vitest';
import { USES } from '@/lib/allocate';
import { shareGroups, type FoodAmounts, type GroupRow } from '@/lib/share-groups';
import { useTotals } from '@/lib/use-totals';

// USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal per 100 g
const POTATO = 1;
const NO_VALUES = 2;
const amounts: FoodAmounts = new Map([[POTATO, { energy_kcal: 77 }]]);

function row(over: Partial<GroupRow>): GroupRow {
  return { month: '2026-08', use: 'fresh', spread: 1, cropId: 1, foodId: POTATO, name: 'Potato', grams: 1000, edibleGrams: 750, entries: 3, ...over };
}

const totalOf = (groups: ReturnType<typeof shareGroups>, use: string) => useTotals(groups, '2026-01', '2026-12').find((t) => t.use === use)!;

describe('use totals', () => {
  it('gives every use, in the order of USES, with zeros for the unused', () => {
    const totals = useTotals([], '2026-01', '2026-12');
    expect(totals.map((t) => t.use)).toEqual([...USES]);
    expect(totals.every((t) => t.grams === 0 && t.entries === 0 && t.energyKcal === 0)).toBe(true);
  });

  it('sums weight, edible weight, entries and energy of the harvest by use', () => {
    const groups = shareGroups([row({}), row({ cropId: 2, grams: 500, edibleGrams: 375, entries: 1 }), row({ use: 'stored', spread: 6 })], [], amounts);
    expect(totalOf(groups, 'fresh')).toEqual({ use: 'fresh', grams: 1500, edibleGrams: 1125, entries: 4, energyKcal: 866.25 }); // 1125 g × 77 kcal / 100 g (USDA SR28, NDB 11352)
    expect(totalOf(groups, 'stored').entries).toBe(3);
  });

  it('counts only home harvests dated in the range', () => {
    const groups = shareGroups([row({ month: '2025-12' })], [row({ cropId: null })], amounts);
    expect(totalOf(groups, 'fresh').grams).toBe(0);
  });

  it('gives unknown energy only when none of the edible grams has a value', () => {
    expect(totalOf(shareGroups([row({ foodId: NO_VALUES })], [], amounts), 'fresh').energyKcal).toBeNull();
    const mixed = shareGroups([row({ foodId: NO_VALUES }), row({ cropId: 2 })], [], amounts);
    expect(totalOf(mixed, 'fresh').energyKcal).toBe(577.5); // the known part only: 750 g × 77 kcal / 100 g (USDA SR28, NDB 11352)
  });
});
