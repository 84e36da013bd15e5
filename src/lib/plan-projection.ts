/**
 * What a plan the grower has edited would give over the year: the home share of need once each
 * planned crop's area yields its nutrient per m², worked out in the browser so that changing an
 * area or dropping a crop shows its effect at once, without asking the planner again. It counts the
 * year as a whole (the planner's month basis places food in months; ask it again for that).
 */
import type { NutrientKey } from './nutrients';

/** The year's home supply and need of one nutrient (null = unknown). */
export interface YearFigure {
  home: number | null;
  need: number | null;
}

/** A planned crop's area and its nutrient per m². */
export interface PlannedArea {
  areaM2: number;
  perM2: Partial<Record<NutrientKey, number | null>>;
}

/**
 * Home share of need per nutrient with the planned areas added: (home + Σ area × per m²) ÷ need;
 * null when the need is unknown or 0, or home is unknown. A crop with no value for a nutrient adds
 * nothing to it (its share is then a floor, not a guess).
 * Example: projectYearShares({ energy_kcal: { home: 1000, need: 4000 } }, [{ areaM2: 2, perM2: { energy_kcal: 1500 } }]).energy_kcal → 1
 */
export function projectYearShares<K extends NutrientKey>(year: Record<K, YearFigure>, plan: readonly PlannedArea[]): Record<K, number | null> {
  const out = {} as Record<K, number | null>;
  for (const key of Object.keys(year) as K[]) {
    const { home, need } = year[key];
    if (home === null || need === null || need === 0) {
      out[key] = null;
      continue;
    }
    let added = 0;
    for (const p of plan) {
      if (!(p.areaM2 > 0)) continue;
      const perM2 = p.perM2[key];
      if (perM2 != null) added += p.areaM2 * perM2;
    }
    out[key] = (home + added) / need;
  }
  return out;
}
