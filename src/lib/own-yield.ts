/**
 * The household's own measured yield: what its plantings of a reference crop gave, in kg per m²,
 * from the harvests that name their planting. The gap finder and the planner use it instead of the
 * reference table's typical yield, so a plan rests on this ground's own results when there are any.
 */

/** One planting with the weight harvested from it (as harvested, before trimming). */
export interface PlantingHarvest {
  referenceKey: string;
  areaM2: number;
  grams: number;
}

/**
 * kg per m² per reference crop over all its plantings with harvests: Σ kg ÷ Σ m² (a big bed counts
 * for more than a trial row), e.g. ownYields([{ referenceKey: 'potatoes', areaM2: 10, grams: 32_000 }]).get('potatoes') → 3.2.
 * Plantings with no area are left out.
 */
export function ownYields(rows: readonly PlantingHarvest[]): Map<string, number> {
  const sums = new Map<string, { kg: number; m2: number }>();
  for (const r of rows) {
    if (!(r.areaM2 > 0) || !(r.grams >= 0)) continue;
    const s = sums.get(r.referenceKey) ?? { kg: 0, m2: 0 };
    s.kg += r.grams / 1000;
    s.m2 += r.areaM2;
    sums.set(r.referenceKey, s);
  }
  return new Map([...sums].map(([key, s]) => [key, s.kg / s.m2]));
}
