/**
 * Reference foods as the food API sends them: a search hit and the full detail with every
 * nutrient per 100 g. They live in src/lib so that the browser's food picker and the server's
 * look-ups share one definition.
 */

/** One food found by words or by code. */
export interface FoodHit {
  id: number;
  dataset: string;
  code: string;
  name: string;
  group: string;
  refusePct: number | null;
}

/** A food with its dataset, household measures and every nutrient (amount null = not in the dataset). */
export interface FoodDetail extends FoodHit {
  originalName: string;
  datasetInfo: { slug: string; name: string; release: string; publisher: string; licence: string };
  weights: { description: string; grams: number }[];
  nutrients: { key: string; name: string; unit: string; amount: number | null }[];
}
