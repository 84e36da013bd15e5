/**
 * What became of the harvest dated in a range: weight, edible weight, entries and energy by use
 * (fresh, stored, … lost), so the dashboard can show how much was eaten, kept, given or lost.
 * Energy follows the share code's rule for unknown values (knownSum in shares.ts).
 */
import { addAmount, amountAt, emptySums, shareIndexes, USES, type NutrientSums, type Use } from './allocate';
import type { NutrientKey } from './nutrients';
import type { ShareGroup } from './share-groups';
import type { UseTotal } from './share-types';
import { knownSum } from './shares';

/** Energy, read from a group's shareAmounts where it has them (no object of its nutrients made). */
const ENERGY: readonly NutrientKey[] = ['energy_kcal'];
const ENERGY_PLACE = shareIndexes(ENERGY);

/**
 * Totals by use, in the order of USES, of the home-grown groups dated in [from, to] ('YYYY-MM');
 * energyKcal is null when none of a use's edible grams has a known value,
 * e.g. useTotals(groups, '2026-01', '2026-12').find((t) => t.use === 'stored').edibleGrams.
 */
export function useTotals(groups: readonly ShareGroup[], from: string, to: string): UseTotal[] {
  const totals = new Map<Use, { total: UseTotal; energy: NutrientSums }>();
  for (const use of USES) totals.set(use, { total: { use, grams: 0, edibleGrams: 0, entries: 0, energyKcal: 0 }, energy: emptySums() });
  for (const g of groups) {
    if (g.source !== 'home' || g.month < from || g.month > to) continue;
    const t = totals.get(g.use)!;
    t.total.grams += g.grams;
    t.total.edibleGrams += g.edibleGrams;
    t.total.entries += g.entries;
    addAmount(t.energy, 'home', amountAt(g, ENERGY, ENERGY_PLACE, 0), g.edibleGrams);
  }
  return [...totals.values()].map(({ total, energy }) => ({
    ...total,
    energyKcal: knownSum(energy.home, energy.homeKnownGrams, energy.homeUnknownGrams),
  }));
}
