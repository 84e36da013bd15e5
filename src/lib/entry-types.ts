/**
 * The JSON the entry API answers with for harvests and bought food, as plain types. They live here,
 * apart from the database code that fills them, so that the browser islands and the server name
 * one shape without the islands reaching into server modules. Types only: nothing here runs.
 */
import type { Use } from './entry-schemas';
import type { PreserveMethod } from './retention';
import type { EntryUnit } from './entry-units';

/** One harvest as the API sends it; `grams` and `edibleGrams` were worked out when it was stored. */
export interface HarvestJson {
  id: number;
  date: string;
  cropId: number | null;
  cropName: string | null;
  foodId: number | null;
  foodName: string | null;
  foodCode: string | null;
  quantity: number;
  unit: EntryUnit;
  grams: number;
  edibleGrams: number;
  /** Where a count or volume got its grams ("USDA SR28 01123, 1 large = 50 g"); null for a weight. */
  weightSource: string | null;
  use: Use;
  spreadMonths: number;
  /** How a preserved harvest was kept (frozen, canned, dried, fermented); null when not said or not preserved. */
  preserveMethod: PreserveMethod | null;
  /** The planting it came from (its weight counts toward the household's own yield per m²), or null. */
  plantingId: number | null;
  trimmed: boolean;
  note: string | null;
  splitGroup: string | null;
  createdAt: string;
}

/** One entry of bought food as the API sends it; `price` is null when none was given. */
export interface PurchaseJson {
  id: number;
  date: string;
  foodId: number;
  foodName: string;
  foodCode: string;
  quantity: number;
  unit: EntryUnit;
  grams: number;
  edibleGrams: number;
  /** Where a count or volume got its grams; null for a weight. */
  weightSource: string | null;
  price: number | null;
  currency: string | null;
  spreadMonths: number;
  trimmed: boolean;
  note: string | null;
  createdAt: string;
}

/** Grams and edible grams summed over every entry of a filter. */
export interface EntryTotals {
  grams: number;
  edibleGrams: number;
}

/** Where a page stands in the whole filtered list. */
export interface EntryPage {
  page: number;
  pageSize: number;
  total: number;
  totals: EntryTotals;
}

/** One page of the harvest log: `GET /api/households/{id}/harvests`. */
export interface HarvestList extends EntryPage {
  harvests: HarvestJson[];
}

/** One page of bought food: `GET /api/households/{id}/purchases`. */
export interface PurchaseList extends EntryPage {
  purchases: PurchaseJson[];
}
