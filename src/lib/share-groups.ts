/**
 * Groups of entries as the share report reads them from the database: harvests or purchases
 * summed by (month, use, spread, crop, food, preserving method), each turned into one FoodEntry
 * for allocate.ts and shares.ts. Grouping by food keeps "unknown" honest: every entry of a group
 * has a value for a nutrient or none does, so a nutrient the food has no amount for stays
 * missing, never zero. A lot eaten over 2 months or more is spread by day from its date, so such
 * lots are grouped by their day, not their month; a preserved lot's vitamins are reduced by the
 * retention factors of its method (retention.ts).
 */
import type { Source, Use } from './allocate';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from './nutrients';
import { applyRetention, type PreserveMethod, type RetentionTable } from './retention';
import type { CropEntry } from './shares';

/** One aggregate row: the entries of a month (or of a day, for lots spread by day), use, spread, crop, food and method, summed. */
export interface GroupRow {
  /** 'YYYY-MM' the entries are dated in. */
  month: string;
  /** 'YYYY-MM-DD' of the entries for a lot spread over 2 months or more; default: the month's first day (the day does not matter). */
  date?: string | null;
  /** How a preserved lot was kept; null or missing = not said (no retention applied). */
  preserveMethod?: PreserveMethod | null;
  /** A part of a lot with larder records: eaten evenly by day over [eatenFrom, until) (see allocate.ts). */
  eatenFrom?: string | null;
  until?: string | null;
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
  /** 'YYYY-MM-DD' the group is eaten from (the month's first day unless spread by day). */
  date: string;
  use: Use;
  spread: number;
  preserveMethod: PreserveMethod | null;
  /** Set for a part of a lot with larder records: eaten evenly by day over [eatenFrom, until). */
  eatenFrom: string | null;
  until: string | null;
  cropId: number | null;
  foodId: number | null;
  name: string;
  grams: number;
  edibleGrams: number;
  entries: number;
  nutrients: Partial<Record<ShareNutrientKey, number>>;
}

/**
 * The groups of home and bought rows with the nutrients of their edible grams, home first; with a
 * retention table, a preserved group naming its method keeps only the retained share of each vitamin,
 * e.g. shareGroups([{ month: '2026-08', use: 'fresh', foodId: 7, edibleGrams: 500, … }], [], new Map([[7, { energy_kcal: 77 }]]))[0].nutrients → { energy_kcal: 385 }.
 */
export function shareGroups(home: readonly GroupRow[], bought: readonly GroupRow[], amounts: FoodAmounts, retention?: RetentionTable): ShareGroup[] {
  const groups = new Map<string, ShareGroup>();
  collect(home, 'home', amounts, groups, retention);
  collect(bought, 'bought', amounts, groups, retention);
  return [...groups.values()];
}

function collect(rows: readonly GroupRow[], source: Source, amounts: FoodAmounts, into: Map<string, ShareGroup>, retention?: RetentionTable): void {
  for (const r of rows) {
    const date = r.date ?? `${r.month}-01`;
    const method = r.use === 'preserved' ? (r.preserveMethod ?? null) : null;
    const eatenFrom = r.until ? (r.eatenFrom ?? date) : null;
    const until = r.until ?? null;
    const key = `${source}|${date}|${r.use}|${r.spread}|${method ?? ''}|${r.cropId ?? ''}|${r.foodId ?? ''}${until ? `|${eatenFrom}|${until}` : ''}`;
    let g = into.get(key);
    if (!g) {
      g = {
        key,
        source,
        month: r.month,
        date,
        use: r.use,
        spread: r.spread,
        preserveMethod: method,
        eatenFrom,
        until,
        cropId: r.cropId,
        foodId: r.foodId,
        name: r.name ?? '',
        grams: r.grams,
        edibleGrams: r.edibleGrams,
        entries: r.entries,
        nutrients: {},
      };
      into.set(key, g);
    } else {
      // Only the parts of lots with larder records can meet an existing group (SQL groups are distinct).
      g.grams += r.grams;
      g.edibleGrams += r.edibleGrams;
      g.entries += r.entries;
    }
    // A nutrient the food has no row for stays missing: unknown, never zero.
    const per100g = r.foodId == null ? undefined : amounts.get(r.foodId);
    const nutrients: Partial<Record<ShareNutrientKey, number>> = {};
    for (const k of SHARE_NUTRIENTS) {
      const a = per100g?.[k];
      if (a !== undefined) nutrients[k] = (g.edibleGrams * a) / 100;
    }
    g.nutrients = retention ? (applyRetention(g, nutrients, retention) as Partial<Record<ShareNutrientKey, number>>) : nutrients;
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

/**
 * A group as one entry of the share code, dated on its day (a lot spread by day) or its month's
 * first day (fresh food and a spread of one month count wholly in their month).
 */
export function groupEntry(g: ShareGroup): CropEntry {
  return {
    date: g.date,
    use: g.use,
    source: g.source,
    spreadMonths: g.spread,
    ...(g.until ? { eatenFrom: g.eatenFrom, until: g.until } : {}),
    edibleGrams: g.edibleGrams,
    nutrients: g.nutrients,
    cropId: contributorId(g),
    name: g.name || 'Unnamed harvest',
  };
}
