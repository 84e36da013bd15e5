/**
 * The crops that gave the household most of its home-grown nutrients over a range: the
 * topContributors() ranking of shares.ts for every share nutrient, joined into one list of crops
 * with each one's amount and share of home for every nutrient, so the dashboard shows one table.
 */
import { fractionEatenBetween, isEaten } from './allocate';
import { monthIndex } from './months';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from './nutrients';
import { contributorId, groupEntry, type ShareGroup } from './share-groups';
import type { TopCrop } from './share-types';
import { topContributors } from './shares';

/** How many crops per nutrient the report names (the union over nutrients is returned). */
export const TOP_CROPS_PER_NUTRIENT = 5;

/**
 * The union of each share nutrient's top TOP_CROPS_PER_NUTRIENT home-grown crops eaten in
 * [from, to], most energy first; a crop eaten in the range whose food has no value for a nutrient
 * shows null there (unknown), not 0,
 * e.g. topCrops(groups, '2026-01', '2026-12')[0].values.energy_kcal.
 */
export function topCrops(groups: readonly ShareGroup[], from: string, to: string): TopCrop[] {
  const home = groups.filter((g) => g.source === 'home');
  const entries = home.map(groupEntry);
  // Each group's share eaten in the range, worked out once for all the nutrients.
  const [start, end] = [monthIndex(from), monthIndex(to)];
  const fractions = entries.map((e) => (isEaten(e.use) ? fractionEatenBetween(e, start, end) : 0));
  const crops = new Map<string | number, TopCrop>();
  const chosen = new Set<string | number>();
  for (const key of SHARE_NUTRIENTS) {
    const ranked = topContributors(entries, key, entries.length, { from, to }, fractions);
    ranked.forEach((c, i) => {
      let crop = crops.get(c.cropId);
      if (!crop) {
        const g = home.find((x) => contributorId(x) === c.cropId)!;
        crop = { cropId: g.cropId, foodId: g.foodId, name: c.name, values: zeroValues(), shareOfHome: zeroValues() };
        crops.set(c.cropId, crop);
      }
      crop.values[key] = c.amount;
      crop.shareOfHome[key] = c.shareOfHome;
      if (i < TOP_CROPS_PER_NUTRIENT) chosen.add(c.cropId);
    });
  }
  // A crop eaten in the range whose food has no value for a nutrient: unknown, not 0.
  entries.forEach((e, i) => {
    const crop = crops.get(e.cropId);
    if (!crop || fractions[i] === 0) return;
    for (const key of SHARE_NUTRIENTS) {
      if (e.nutrients[key] == null && crop.values[key] === 0) {
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
