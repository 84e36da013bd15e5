/**
 * The crops that gave the household most of its home-grown nutrients over a range: the
 * topContributors() ranking of shares.ts for every share nutrient (worked out here in one pass
 * for all of them, see topCrops), joined into one list of crops
 * with each one's amount and share of home for every nutrient, so the dashboard shows one table.
 */
import { fractionEatenBetween, isEaten } from './allocate';
import { monthIndex } from './months';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from './nutrients';
import { groupEntry, type ShareGroup } from './share-groups';
import type { TopCrop } from './share-types';
import type { CropEntry } from './shares';

/** One 0 per share nutrient, copied for each contributor's sums. */
const ZEROS: readonly number[] = SHARE_NUTRIENTS.map(() => 0);

/** How many crops per nutrient the report names (the union over nutrients is returned). */
export const TOP_CROPS_PER_NUTRIENT = 5;

/** One contributor's sums over a range, one slot per share nutrient (in SHARE_NUTRIENTS order). */
interface Sums {
  /** Index (among the home groups) of the contributor's first group, whose crop and food it shows. */
  group: number;
  name: string;
  /** A plain array (a Float64Array of this size is made outside V8's heap, many times dearer). */
  amounts: number[];
  /** Whether some eaten entry had a value for the nutrient (else the contributor is not ranked on it). */
  ranked: Uint8Array;
  /** Index of the first entry that gave the nutrient: the order topContributors meets contributors in. */
  firstGave: Int32Array;
}

/**
 * The union of each share nutrient's top TOP_CROPS_PER_NUTRIENT home-grown crops eaten in
 * [from, to], most energy first; a crop eaten in the range whose food has no value for a nutrient
 * shows null there (unknown), not 0,
 * e.g. topCrops(groups, '2026-01', '2026-12')[0].values.energy_kcal.
 * Ranks as topContributors() of shares.ts does nutrient by nutrient (same sums, same order, ties
 * kept in the order it meets them), in one pass over the groups instead of one per nutrient.
 * `entries` are groupEntry() of each group when the caller has them already.
 */
export function topCrops(groups: readonly ShareGroup[], from: string, to: string, entries?: readonly CropEntry[]): TopCrop[] {
  const home: ShareGroup[] = [];
  const homeEntries: CropEntry[] = [];
  groups.forEach((g, i) => {
    if (g.source !== 'home') return;
    home.push(g);
    homeEntries.push(entries ? entries[i]! : groupEntry(g));
  });
  // Each group's share eaten in the range, worked out once for all the nutrients.
  const [start, end] = [monthIndex(from), monthIndex(to)];
  const fractions = homeEntries.map((e) => (isEaten(e.use) ? fractionEatenBetween(e, start, end) : 0));
  const count = SHARE_NUTRIENTS.length;
  const sums = new Map<string | number, Sums>();
  const totals = new Float64Array(count);
  homeEntries.forEach((e, i) => {
    let c = sums.get(e.cropId);
    if (!c) sums.set(e.cropId, (c = { group: i, name: e.name, amounts: ZEROS.slice(), ranked: new Uint8Array(count), firstGave: new Int32Array(count) }));
    if (!isEaten(e.use)) return;
    for (let k = 0; k < count; k++) {
      const amount = e.shareAmounts ? e.shareAmounts[k]! : (e.nutrients[SHARE_NUTRIENTS[k]!] ?? NaN);
      if (Number.isNaN(amount)) continue; // unknown: cannot rank
      // By day, like allocate(): a lot stored on 30 November counts one day's share in November.
      const eaten = amount * fractions[i]!;
      if (eaten <= 0) continue;
      if (!c.ranked[k]) {
        c.ranked[k] = 1;
        c.firstGave[k] = i;
      }
      c.amounts[k] = c.amounts[k]! + eaten;
      totals[k] = totals[k]! + eaten;
    }
  });

  const crops = new Map<string | number, TopCrop>();
  const chosen = new Set<string | number>();
  const all = [...sums.entries()];
  SHARE_NUTRIENTS.forEach((key, k) => {
    const ranked = all
      .filter(([, c]) => c.ranked[k])
      .sort(([, a], [, b]) => b.amounts[k]! - a.amounts[k]! || a.name.localeCompare(b.name) || a.firstGave[k]! - b.firstGave[k]!);
    ranked.forEach(([id, c], i) => {
      let crop = crops.get(id);
      if (!crop) {
        const g = home[c.group]!;
        crop = { cropId: g.cropId, foodId: g.foodId, name: c.name, values: zeroValues(), shareOfHome: zeroValues() };
        crops.set(id, crop);
      }
      crop.values[key] = c.amounts[k]!;
      crop.shareOfHome[key] = totals[k] === 0 ? null : c.amounts[k]! / totals[k]!;
      if (i < TOP_CROPS_PER_NUTRIENT) chosen.add(id);
    });
  });
  // A crop eaten in the range whose food has no value for a nutrient: unknown, not 0.
  homeEntries.forEach((e, i) => {
    const crop = crops.get(e.cropId);
    if (!crop || fractions[i] === 0) return;
    // An indexed loop: `for (const [k, key] of ….entries())` makes a pair per nutrient and entry.
    for (let k = 0; k < count; k++) {
      const key = SHARE_NUTRIENTS[k]!;
      const unknown = e.shareAmounts ? Number.isNaN(e.shareAmounts[k]!) : e.nutrients[key] == null;
      if (unknown && crop.values[key] === 0) {
        crop.values[key] = null;
        crop.shareOfHome[key] = null;
      }
    }
  });
  return [...crops.entries()]
    .filter(([id]) => chosen.has(id))
    .map(([, c]) => c)
    .sort((a, b) => (b.values.energy_kcal ?? 0) - (a.values.energy_kcal ?? 0) || a.name.localeCompare(b.name));
}

function zeroValues(): Record<ShareNutrientKey, number | null> {
  const out = {} as Record<ShareNutrientKey, number | null>;
  for (const key of SHARE_NUTRIENTS) out[key] = 0;
  return out;
}
