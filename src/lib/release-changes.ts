/**
 * What a new release of a dataset would do to households' figures before it is applied: for each
 * household with entries on the dataset's foods, energy and protein of those entries now and
 * after, and the foods the new release drops (their entries would lose every value).
 */

/** Edible grams a household logged against one food code of the dataset (harvests + bought food). */
export interface HouseholdFoodGrams {
  householdId: number;
  householdName: string;
  code: string;
  edibleGrams: number;
  entries: number;
}

/** Energy and protein per 100 g of one code; a missing key is unknown. */
export type EnergyProtein = { energy_kcal?: number; protein_g?: number };

export interface HouseholdChange {
  householdId: number;
  householdName: string;
  entries: number;
  kcalBefore: number;
  kcalAfter: number;
  proteinBefore: number;
  proteinAfter: number;
  /** Codes whose energy or protein changes (or becomes unknown). */
  foodsChanged: string[];
  /** Codes the new release no longer has. */
  foodsDropped: string[];
}

const per = (grams: number, amount: number | undefined) => (amount === undefined ? 0 : (grams / 100) * amount);

/**
 * Households whose energy or protein would move, largest energy change first. Unknown counts as
 * nothing in either sum, so a value that becomes unknown shows as a fall.
 * Example: 1,000 g of a code going from 77 to 80 kcal/100 g → kcalBefore 770, kcalAfter 800.
 */
export function releaseChanges(
  rows: readonly HouseholdFoodGrams[],
  before: ReadonlyMap<string, EnergyProtein>,
  after: ReadonlyMap<string, EnergyProtein>,
): HouseholdChange[] {
  const byHousehold = new Map<number, HouseholdChange>();
  for (const r of rows) {
    const old = before.get(r.code) ?? {};
    const now = after.get(r.code);
    const next = now ?? {};
    const changed = old.energy_kcal !== next.energy_kcal || old.protein_g !== next.protein_g;
    if (!changed && now) continue;
    let h = byHousehold.get(r.householdId);
    if (!h) {
      h = { householdId: r.householdId, householdName: r.householdName, entries: 0, kcalBefore: 0, kcalAfter: 0, proteinBefore: 0, proteinAfter: 0, foodsChanged: [], foodsDropped: [] };
      byHousehold.set(r.householdId, h);
    }
    h.entries += r.entries;
    h.kcalBefore += per(r.edibleGrams, old.energy_kcal);
    h.kcalAfter += per(r.edibleGrams, next.energy_kcal);
    h.proteinBefore += per(r.edibleGrams, old.protein_g);
    h.proteinAfter += per(r.edibleGrams, next.protein_g);
    (now ? h.foodsChanged : h.foodsDropped).push(r.code);
  }
  return [...byHousehold.values()].sort((a, b) => Math.abs(b.kcalAfter - b.kcalBefore) - Math.abs(a.kcalAfter - a.kcalBefore));
}
