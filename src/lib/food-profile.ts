/**
 * What a grower asks of a reference food, worked out from its amounts per 100 g edible portion:
 * how much energy and protein a kilogram *as harvested* brings once the refuse is taken off, and
 * which nutrients it is rich in against an adult's recommended intake. The reference-food page
 * shows these first and the full per-100 g table below; the sums live here so they are tested.
 */
import { dailyNeed } from './requirements';
import { edibleFactor } from './edible';
import { nutrientDef, type NutrientKey } from './nutrients';

/** One nutrient of a food as the food look-up gives it: amount per 100 g edible portion, null = unknown. */
export interface FoodNutrient {
  key: string;
  name: string;
  unit: string;
  amount: number | null;
}

/**
 * Amount per kilogram as harvested or bought: per 100 g edible × 10 × (1 − refuse/100).
 * No refuse given counts as none, as elsewhere in Selfsown (`edibleFactor`).
 * Example: perKgHarvested(77, 25) === 577.5 (potatoes: 77 kcal per 100 g, 25 % refuse)
 */
export function perKgHarvested(per100gEdible: number, refusePct: number | null): number {
  if (!Number.isFinite(per100gEdible) || per100gEdible < 0) {
    throw new Error(`The amount per 100 g must be zero or more, got ${String(per100gEdible)}.`);
  }
  return per100gEdible * 10 * edibleFactor({ refusePercent: refusePct });
}

/** The adults a "rich in" share is measured against: both sexes at 31–50 years, the larger need of the two. */
export const ADULT_REFERENCE = {
  label: 'an adult aged 31–50 (the larger of the women’s and men’s RDA or AI)',
  people: [
    { sex: 'female', ageYears: 40 },
    { sex: 'male', ageYears: 40 },
  ],
} as const;

/** The share of the recommended intake in 100 g from which a food is called rich in a nutrient. */
export const RICH_SHARE = 0.2;

// Nutrients where "rich in" is no praise or has no recommended intake to measure against.
const NOT_PRAISED: ReadonlySet<string> = new Set(['energy_kcal', 'sodium_mg', 'fat_g', 'sugars_g', 'cholesterol_mg', 'water_g']);

export interface RichNutrient {
  key: string;
  name: string;
  unit: string;
  /** Per 100 g edible portion. */
  amount: number;
  /** The adult reference intake per day (the larger of women's and men's 31–50 y). */
  need: number;
  basis: 'RDA' | 'AI';
  /** amount ÷ need, e.g. 0.22 for 22 %. */
  share: number;
}

/** The adult reference daily intake of a nutrient, or null when the DRI set none. */
export function adultReferenceIntake(key: NutrientKey): { value: number; basis: 'RDA' | 'AI' } | null {
  let best: { value: number; basis: 'RDA' | 'AI' } | null = null;
  for (const person of ADULT_REFERENCE.people) {
    const need = dailyNeed(person, key);
    if (!need || (need.basis !== 'RDA' && need.basis !== 'AI')) continue;
    if (!best || need.value > best.value) best = { value: need.value, basis: need.basis };
  }
  return best;
}

/**
 * The nutrients of which 100 g edible portion gives at least `RICH_SHARE` (20 %) of the adult
 * reference intake, largest share first. Unknown amounts are never counted as rich or poor.
 * Example: richIn(kale).map((n) => n.key) starts ['vitamin_k_ug', 'vitamin_c_mg', …]
 */
export function richIn(nutrients: readonly FoodNutrient[], threshold = RICH_SHARE): RichNutrient[] {
  const out: RichNutrient[] = [];
  for (const n of nutrients) {
    if (n.amount === null || NOT_PRAISED.has(n.key)) continue;
    const def = nutrientDef(n.key);
    if (!def) continue;
    const need = adultReferenceIntake(def.key as NutrientKey);
    if (!need || need.value <= 0) continue;
    const share = n.amount / need.value;
    if (share >= threshold) out.push({ key: n.key, name: n.name, unit: n.unit, amount: n.amount, need: need.value, basis: need.basis, share });
  }
  return out.sort((a, b) => b.share - a.share);
}
