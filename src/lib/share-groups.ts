/**
 * Groups of entries as the share report reads them from the database: harvests or purchases
 * summed by (month, use, spread, crop, food), each turned into one FoodEntry for allocate.ts and
 * shares.ts. Grouping by food keeps "unknown" honest: every entry of a group has a value for a
 * nutrient or none does, so a nutrient the food has no amount for stays missing, never zero.
 */
import type { Source, Use } from './allocate';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from './nutrients';
import type { CropEntry } from './shares';

/** One aggregate row: the entries of a month, use, spread, crop and food, summed. */
export interface GroupRow {
  /** 'YYYY-MM' the entries are dated in. */
  month: string;
  use: Use;
  /** Months the food is eaten over (≥ 1). */
  spread: number;
  cropId: number | null;
  foodId: number | null;
  /** The crop's name and variety, else the food's name; null when neither is known. */
  name: string | null;
  grams: number;
  edibleGrams: number;
  entries: number;
}

/** Amount per 100 g of each share nutrient, by food id; a missing key is unknown, never zero. */
export type FoodAmounts = Map<number, Partial<Record<ShareNutrientKey, number>>>;

/** A group with its source and the nutrients of its edible grams. */
export interface ShareGroup {
  key: string;
  source: Source;
  month: string;
  use: Use;
  spread: number;
  cropId: number | null;
  foodId: number | null;
  name: string;
  grams: number;
  edibleGrams: number;
  entries: number;
  nutrients: Partial<Record<ShareNutrientKey, number>>;
}

/**
 * The groups of home and bought rows with the nutrients of their edible grams, home first,
 * e.g. shareGroups([{ month: '2026-08', use: 'fresh', foodId: 7, edibleGrams: 500, … }], [], new Map([[7, { energy_kcal: 77 }]]))[0].nutrients → { energy_kcal: 385 }.
 */
export function shareGroups(home: readonly GroupRow[], bought: readonly GroupRow[], amounts: FoodAmounts): ShareGroup[] {
  const groups = new Map<string, ShareGroup>();
  collect(home, 'home', amounts, groups);
  collect(bought, 'bought', amounts, groups);
  return [...groups.values()];
}

function collect(rows: readonly GroupRow[], source: Source, amounts: FoodAmounts, into: Map<string, ShareGroup>): void {
  for (const r of rows) {
    const key = `${source}|${r.month}|${r.use}|${r.spread}|${r.cropId ?? ''}|${r.foodId ?? ''}`;
    let g = into.get(key);
    if (!g) {
      g = {
        key,
        source,
        month: r.month,
        use: r.use,
        spread: r.spread,
        cropId: r.cropId,
        foodId: r.foodId,
        name: r.name ?? '',
        grams: r.grams,
        edibleGrams: r.edibleGrams,
        entries: r.entries,
        nutrients: {},
      };
      into.set(key, g);
    }
    // A nutrient the food has no row for stays missing: unknown, never zero.
    const per100g = r.foodId == null ? undefined : amounts.get(r.foodId);
    for (const k of SHARE_NUTRIENTS) {
      const a = per100g?.[k];
      if (a !== undefined) g.nutrients[k] = (g.edibleGrams * a) / 100;
    }
  }
}

/** The distinct reference foods behind some rows or groups, e.g. [{ foodId: 3 }, { foodId: 3 }, { foodId: null }] → [3]. */
export function foodIdsOf(rows: readonly { foodId: number | null }[]): number[] {
  return [...new Set(rows.map((r) => r.foodId).filter((id): id is number => id != null))];
}

/**
 * Who a group's food came from, as the top-crop ranking counts it: the crop, else the reference
 * food the harvest was logged against, e.g. { cropId: null, foodId: 12 } → 'food:12'.
 */
export function contributorId(g: Pick<ShareGroup, 'cropId' | 'foodId'>): string | number {
  return g.cropId ?? `food:${g.foodId ?? 'none'}`;
}

/** A group as one entry of the share code; only its month matters (eating and the ratio go by month). */
export function groupEntry(g: ShareGroup): CropEntry {
  return {
    date: `${g.month}-01`,
    use: g.use,
    source: g.source,
    spreadMonths: g.spread,
    edibleGrams: g.edibleGrams,
    nutrients: g.nutrients,
    cropId: contributorId(g),
    name: g.name || 'Unnamed harvest',
  };
}
