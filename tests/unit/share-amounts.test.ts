/**
 * The share report reads a group's nutrients as numbers in share-nutrient order
 * (FoodEntry.shareAmounts, made by share-groups.ts) instead of by key. These hold the two to one
 * another: the numbers say what the nutrients say (unknown as NaN, retention applied), and
 * allocate, the FAO ratio and the top crops answer the same with and without them.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { allocate, type FoodEntry } from '@/lib/allocate';
import { SHARE_NUTRIENTS } from '@/lib/nutrients';
import { selfSufficiency } from '@/lib/ratio';
import { parseRetentionCsv, retentionTable } from '@/lib/retention';
import { groupEntry, shareGroups, type FoodAmounts, type GroupRow } from '@/lib/share-groups';
import { topCrops } from '@/lib/top-crops';

// USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw", per 100 g: 77 kcal, 2.05 g protein, 19.7 mg vitamin C
// USDA SR28, NDB 11233 "Kale, raw", per 100 g: 49 kcal, 120 mg vitamin C
const amounts: FoodAmounts = new Map([
  [1, { energy_kcal: 77, protein_g: 2.05, vitamin_c_mg: 19.7 }],
  [2, { energy_kcal: 49, vitamin_c_mg: 120 }],
  [3, {}],
]);
const table = retentionTable(parseRetentionCsv(readFileSync(resolve(process.cwd(), 'reference-data/retention.csv'), 'utf8')));

function row(over: Partial<GroupRow>): GroupRow {
  return { month: '2026-08', use: 'fresh', spread: 1, cropId: 10, foodId: 1, name: 'Potato', grams: 1000, edibleGrams: 750, entries: 2, ...over };
}

const home = [
  row({}),
  row({ cropId: 11, foodId: 2, name: 'Kale', month: '2026-09', date: '2026-09-14', use: 'preserved', preserveMethod: 'frozen', spread: 5 }),
  row({ cropId: 12, foodId: 3, name: 'Oca', use: 'stored', spread: 3, date: '2026-10-30', month: '2026-10' }),
  row({ cropId: null, foodId: null, name: null, use: 'given' }),
  row({ month: '2026-11', date: '2026-11-02', use: 'stored', spread: 4 }),
];
const bought = [row({ cropId: null, foodId: 2, name: null, spread: 2, date: '2026-08-20' })];
const groups = shareGroups(home, bought, amounts, table);
const entries = groups.map(groupEntry);
/**
 * The same entries without the numbers: read by key, as every other caller's. An entry's
 * nutrients are read through its group (an accessor, which a spread does not copy): copied here.
 */
const byKey = entries.map(({ shareAmounts: _, ...e }, i) => ({ ...e, nutrients: entries[i]!.nutrients }));

describe('share amounts beside the nutrients', () => {
  it('say what the nutrients say, unknown as NaN, retention applied', () => {
    expect(groups.every((g) => Array.isArray(g.shareAmounts) && g.shareAmounts.length === SHARE_NUTRIENTS.length)).toBe(true);
    for (const g of groups) {
      SHARE_NUTRIENTS.forEach((key, i) => {
        const v = g.nutrients[key];
        if (v === undefined) expect(g.shareAmounts![i]).toBeNaN();
        else expect(g.shareAmounts![i]).toBe(v);
      });
    }
    // Frozen kale keeps only part of its vitamin C (reference-data/retention.csv), in both forms.
    const kale = groups.find((g) => g.foodId === 2 && g.source === 'home')!;
    expect(kale.nutrients.vitamin_c_mg).toBeLessThan((750 * 120) / 100);
    expect(kale.shareAmounts![SHARE_NUTRIENTS.indexOf('vitamin_c_mg')]).toBe(kale.nutrients.vitamin_c_mg);
  });

  it('give allocate, the FAO ratio and the top crops the same answers as the nutrients by key', () => {
    const range = { from: '2026-06', to: '2027-05', keys: SHARE_NUTRIENTS };
    expect(allocate(entries, range)).toEqual(allocate(byKey, range));
    expect(selfSufficiency(entries, range)).toEqual(selfSufficiency(byKey, range));
    expect(topCrops(groups, '2026-06', '2027-05', entries)).toEqual(topCrops(groups, '2026-06', '2027-05', byKey));
    // A part of the range only, and keys that are not all share nutrients (read by key then).
    expect(allocate(entries, { from: '2026-10', to: '2026-12', keys: ['energy_kcal', 'vitamin_d_ug'] })).toEqual(
      allocate(byKey, { from: '2026-10', to: '2026-12', keys: ['energy_kcal', 'vitamin_d_ug'] }),
    );
  });

  it('are refused like the nutrients when an amount is negative', () => {
    const bad: FoodEntry = { ...entries[0]!, shareAmounts: entries[0]!.shareAmounts!.map((v, i) => (i === 0 ? -1 : v)) };
    expect(() => allocate([bad], { from: '2026-08', to: '2026-08', keys: SHARE_NUTRIENTS })).toThrow(/energy_kcal of an entry dated 2026-08-01 must be a number ≥ 0, got -1/);
  });
});
