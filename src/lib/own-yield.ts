/**
 * The household's own measured yield: kg harvested per m² of each crop in each season, from the
 * harvests that name their planting. The planner and the beds page show it beside the reference
 * table's typical yield, and use it instead when there is one, because the household's own ground
 * is the better witness of what it grows.
 *
 * The rule, stated once:
 * - kg are the weights as harvested (every use counts: seed, gifts, sales and losses were grown
 *   too), the same basis as the reference table's yields;
 * - the area is the sum of the plantings of that crop and season that at least one harvest names.
 *   A planting no harvest names is left out: no record is not the same as no crop.
 */

/** A planting as the yield needs it. */
export interface YieldPlanting {
  id: number;
  cropId: number;
  seasonYear: number;
  areaM2: number;
}

/** A harvest (its weight as harvested) naming a planting. */
export interface YieldHarvest {
  plantingId: number;
  grams: number;
}

/** One crop's measured yield in one season. */
export interface OwnYield {
  cropId: number;
  seasonYear: number;
  /** kg harvested from the plantings that have harvests. */
  harvestedKg: number;
  /** m² of those plantings. */
  areaM2: number;
  /** harvestedKg ÷ areaM2. */
  kgPerM2: number;
  /** How many plantings it rests on. */
  plantings: number;
}

/**
 * Own yields per crop and season, sorted by season then crop id. Harvests naming a planting not
 * given are ignored (it belongs to another household or was deleted).
 * Example: 2 plantings of crop 1 in 2026 (4 m² and 2 m²) with 9 kg and 3 kg → { kgPerM2: 12 / 6 = 2 }
 */
export function ownYields(plantings: readonly YieldPlanting[], harvests: readonly YieldHarvest[]): OwnYield[] {
  const byId = new Map(plantings.map((p) => [p.id, p]));
  const gramsOf = new Map<number, number>();
  for (const h of harvests) {
    if (!byId.has(h.plantingId)) continue;
    if (!Number.isFinite(h.grams) || h.grams < 0) throw new Error(`A harvest of planting ${h.plantingId} weighs ${String(h.grams)} g: weights are zero or more.`);
    gramsOf.set(h.plantingId, (gramsOf.get(h.plantingId) ?? 0) + h.grams);
  }
  const groups = new Map<string, OwnYield>();
  for (const [plantingId, grams] of gramsOf) {
    const p = byId.get(plantingId)!;
    if (!(p.areaM2 > 0)) throw new Error(`Planting ${p.id} has an area of ${p.areaM2} m²: an area is more than 0.`);
    const key = `${p.seasonYear}:${p.cropId}`;
    const g = groups.get(key) ?? { cropId: p.cropId, seasonYear: p.seasonYear, harvestedKg: 0, areaM2: 0, kgPerM2: 0, plantings: 0 };
    g.harvestedKg += grams / 1000;
    g.areaM2 += p.areaM2;
    g.plantings += 1;
    groups.set(key, g);
  }
  return [...groups.values()]
    .map((g) => ({ ...g, kgPerM2: g.harvestedKg / g.areaM2 }))
    .sort((a, b) => a.seasonYear - b.seasonYear || a.cropId - b.cropId);
}
