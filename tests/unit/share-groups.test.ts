import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { nutrientsOf } from '@/lib/allocate';
import { SHARE_NUTRIENTS } from '@/lib/nutrients';
import { applyRetention, parseRetentionCsv, PRESERVE_METHODS, retentionTable } from '@/lib/retention';
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

describe('share groups for issue 9', () => {
  // USDA SR28, NDB 11233 "Kale, raw", per 100 g: 120 mg vitamin C, 49 kcal
  const KALE_ID = 3;
  const withKale: FoodAmounts = new Map([...amounts, [KALE_ID, { energy_kcal: 49, vitamin_c_mg: 120 }]]);
  const table = retentionTable(parseRetentionCsv(readFileSync(resolve(process.cwd(), 'reference-data/retention.csv'), 'utf8')));

  it('keeps the retained share of the vitamins of a preserved group naming its method, and leaves energy alone', () => {
    const [g] = shareGroups([row({ use: 'preserved', spread: 6, foodId: KALE_ID, edibleGrams: 1000, preserveMethod: 'frozen' })], [], withKale, table);
    // frozen vegetables keep 70 % of vitamin C (reference-data/retention.csv; from memory: USDA Retention Factors Release 6, 2007)
    expect(g!.nutrients.vitamin_c_mg).toBeCloseTo(1200 * 0.7, 9);
    expect(g!.nutrients.energy_kcal).toBe(490); // 1000 g × 49 kcal / 100 g (USDA SR28, NDB 11233)
    expect(g!.preserveMethod).toBe('frozen');
  });

  it('gives every method and share nutrient the value applyRetention gives, and a food without a value none', () => {
    // The oracle is applyRetention over reference-data/retention.csv; the per-100 g amounts are
    // only inputs (the same 2 for every nutrient of food 9, none for food 10), not checked values.
    const full: FoodAmounts = new Map([...withKale, [9, Object.fromEntries(SHARE_NUTRIENTS.map((k) => [k, 2]))], [10, {}]]);
    for (const method of PRESERVE_METHODS) {
      for (const foodId of [KALE_ID, 9, 10]) {
        const [g] = shareGroups([row({ use: 'preserved', spread: 6, foodId, edibleGrams: 1234, preserveMethod: method })], [], full, table);
        const expected = applyRetention({ use: 'preserved', preserveMethod: method }, nutrientsOf(1234, full.get(foodId)!), table);
        expect(g!.nutrients).toEqual(expected);
        SHARE_NUTRIENTS.forEach((k, i) => expect(g!.shareAmounts![i]).toBe(expected[k] ?? NaN));
      }
    }
  });

  it('applies no factor without a method, or to a use other than preserved', () => {
    const groups = shareGroups(
      [row({ use: 'preserved', spread: 6, foodId: KALE_ID, edibleGrams: 1000 }), row({ use: 'stored', spread: 6, foodId: KALE_ID, edibleGrams: 1000, preserveMethod: 'dried' })],
      [],
      withKale,
      table,
    );
    expect(groups.map((g) => g.nutrients.vitamin_c_mg)).toEqual([1200, 1200]);
    expect(groups[1]!.preserveMethod).toBeNull();
  });

  it('dates a lot spread by day on its day, and keeps lots of different days or methods apart', () => {
    const groups = shareGroups(
      [
        row({ month: '2026-11', date: '2026-11-30', use: 'stored', spread: 3 }),
        row({ month: '2026-11', date: '2026-11-05', use: 'stored', spread: 3 }),
        row({ month: '2026-11', date: '2026-11-05', use: 'preserved', spread: 3, preserveMethod: 'canned' }),
        row({ month: '2026-11', date: '2026-11-05', use: 'preserved', spread: 3, preserveMethod: 'frozen' }),
      ],
      [],
      amounts,
    );
    expect(groups).toHaveLength(4);
    expect(groupEntry(groups[0]!).date).toBe('2026-11-30');
    expect(groupEntry(shareGroups([row({})], [], amounts)[0]!).date).toBe('2026-08-01'); // fresh: the month is enough
  });
});
