/**
 * The share report as the API sends it and the dashboard reads it. These wire types live in
 * src/lib, beside the pure code that fills them, so that the browser's islands can import them
 * without reaching into server modules.
 */
import type { Use } from './allocate';
import type { ShareNutrientKey } from './nutrients';
import type { ShareReport } from './shares';

// What a need rests on (RDA, AI, AMDR, EER or mixed), for the dashboard's labels.
export type { NeedBasis } from './need-basis';
export type { ShareMonth, ShareValue } from './shares';

export interface TopCrop {
  /** The household's crop, or null for a harvest logged directly against a reference food. */
  cropId: number | null;
  foodId: number | null;
  name: string;
  /** Amount of each nutrient eaten from this crop in the range; null when its food has no value. */
  values: Record<ShareNutrientKey, number | null>;
  /** values ÷ everything home-grown eaten in the range (fraction). */
  shareOfHome: Record<ShareNutrientKey, number | null>;
}

export interface UseTotal {
  use: Use;
  /** Weight as harvested, g. */
  grams: number;
  /** Edible portion, g. */
  edibleGrams: number;
  entries: number;
  /** Energy of the edible portion, kcal; null when none of it has a known value. */
  energyKcal: number | null;
}

/** A food composition dataset behind the figures. */
export interface DatasetRef {
  slug: string;
  name: string;
  release: string;
}

export interface ShareResponse extends ShareReport<ShareNutrientKey> {
  topCrops: TopCrop[];
  /** The harvest dated in the range, by use (not-food crops left out). */
  uses: UseTotal[];
  /** People counted for the need (present in some month of the range or not). */
  peopleCount: number;
  /** Food composition datasets behind the figures. */
  datasets: DatasetRef[];
}
