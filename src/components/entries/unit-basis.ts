/**
 * What the entry forms weigh a count or volume from, in the browser: the crop's weight of one and
 * its food's household measures (from the crops API), or a chosen food's measures (from the food
 * API). The rules and the wording are src/lib/count-volume.ts, the same the server applies.
 */
import { datasetShortName, type CountVolumeBasis, type MeasuredFood } from '@/lib/count-volume';
import type { Crop, FoodDetail } from './api';

/** A food summary or detail as the rules read it. */
export function measured(food: { dataset: string; code: string; name: string; measures?: { description: string; grams: number }[]; weights?: { description: string; grams: number }[] }): MeasuredFood {
  return { dataset: datasetShortName(food.dataset), code: food.code, name: food.name, measures: food.measures ?? food.weights ?? [] };
}

/** A harvest of this crop: its own weight of one, then its food's measures. */
export function cropWeighBasis(crop: Crop | undefined): CountVolumeBasis | null {
  if (!crop) return null;
  return { crop: { name: crop.displayName, countGrams: crop.countGrams }, food: crop.food ? measured(crop.food) : null };
}

/** Bought food (or a harvest logged straight against a food): the food's measures. */
export function foodWeighBasis(food: FoodDetail | undefined): CountVolumeBasis | null {
  return food ? { food: measured(food) } : null;
}
