import { describe, expect, it } from 'vitest';
import { selfSufficiency, ssrFraction, ssrPercent } from '@/lib/ratio';
import type { FoodEntry } from '@/lib/allocate';

// USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal per 100 g; refuse 25 %
const potato = (edibleGrams: number, over: Partial<FoodEntry>): FoodEntry => ({
  date: '2026-09-10',
  use: 'stored',
  source: 'home',
  spreadMonths: 6,
  edibleGrams,
  nutrients: { energy_kcal: (edibleGrams / 100) * 77 },
  ...over,
});

describe('FAO self-sufficiency ratio', () => {
  it('is production × 100 / (production + imports − exports)', () => {
    // SSR = production × 100 / (production + imports − exports) (FAO, Food Balance Sheets: A Handbook, 2001)
    // 600 × 100 / (600 + 500 − 100) = 60000 / 1000 = 60 %
    expect(ssrPercent(600, 500, 100)).toBe(60);
    expect(ssrFraction(600, 500, 100)).toBe(0.6);
  });

  it('passes 100 % when a surplus is sold', () => {
    // hand-worked with the FAO formula (FAO, Food Balance Sheets: A Handbook, 2001): 1000 × 100 / (1000 + 0 − 200) = 125 %
    expect(ssrPercent(1000, 0, 200)).toBe(125);
  });

  it('is 0 with purchases only and null when nothing is supplied', () => {
    expect(ssrPercent(0, 500, 0)).toBe(0);
    expect(ssrPercent(0, 0, 0)).toBeNull();
    expect(ssrPercent(100, 0, 100)).toBeNull();
    expect(ssrPercent(null, 100, 0)).toBeNull();
  });

  it('counts every harvest as production, purchases as imports and sales and gifts as exports', () => {
    // edible grams of potatoes at 77 kcal/100 g (USDA SR28, NDB 11352)
    const entries = [
      potato(750, { use: 'stored' }), // 577.5 kcal
      potato(250, { use: 'sold' }), // 192.5 kcal
      potato(100, { use: 'seed' }), // 77 kcal
      potato(500, { source: 'bought', use: 'fresh', spreadMonths: 1 }), // 385 kcal
    ];
    const { energy_kcal: r } = selfSufficiency(entries, { from: '2026-01', to: '2026-12', keys: ['energy_kcal'] });
    expect(r.production).toBeCloseTo(847, 9); // 577.5 + 192.5 + 77
    expect(r.imports).toBeCloseTo(385, 9);
    expect(r.exports).toBeCloseTo(192.5, 9);
    // 847 × 100 / (847 + 385 − 192.5) = 84700 / 1039.5 = 81.481… % (FAO, Food Balance Sheets: A Handbook, 2001)
    expect(r.percent).toBeCloseTo(84700 / 1039.5, 9);
    expect(r.fraction).toBeCloseTo(847 / 1039.5, 9);
  });

  it('counts flows in the month of the entry, not spread over the months eaten', () => {
    const entries = [potato(750, { date: '2025-12-20', spreadMonths: 6 }), potato(500, { source: 'bought', date: '2026-02-01' })];
    const { energy_kcal: r } = selfSufficiency(entries, { from: '2026-01', to: '2026-12', keys: ['energy_kcal'] });
    expect(r.production).toBe(0);
    expect(r.percent).toBe(0);
  });

  it('is unknown when no production weight has a value', () => {
    const entries = [{ ...potato(750, {}), nutrients: { energy_kcal: null } }];
    const { energy_kcal: r } = selfSufficiency(entries, { from: '2026-01', to: '2026-12', keys: ['energy_kcal'] });
    expect(r.production).toBeNull();
    expect(r.percent).toBeNull();
    expect(r.unknownGrams).toBe(750);
  });
});
