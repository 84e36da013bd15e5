/**
 * The larder as the API answers it (`GET /api/households/{id}/larder`) and the monthly letter
 * reads it: what is still in store today, lot by lot and summed by crop and category, when each
 * runs out at the present rate, and the months ahead with nothing in store.
 */
import type { CropCategory } from './crop-categories';
import type { LarderOutcomeKind } from './larder-outcomes';
import type { PreserveMethod } from './retention';
import type { UnitSystem } from './units';
import type { EntryUnit } from './entry-units';

/** One recorded outcome of a lot. */
export interface LarderOutcomeJson {
  id: number;
  kind: LarderOutcomeKind;
  /** 'YYYY-MM-DD', the household's local date. */
  date: string;
  /** Spoiled: share of what remained that day that was lost. */
  lostFraction: number | null;
  /** Lasting longer: the new day the lot runs out (excluded). */
  until: string | null;
  note: string | null;
}

/** A typical storage loss for the crop, shown as an expectation and never applied. */
export interface ExpectedLoss {
  /** Share of a lot typically lost over a storage season (0–1). */
  fraction: number;
  /** Where the figure comes from, or 'common practice'. */
  source: string;
}

/** One stored or preserved harvest still (or recently) in store. */
export interface LarderLot {
  harvestId: number;
  cropId: number | null;
  /** Crop name with variety, or the food's name. */
  name: string;
  category: CropCategory | null;
  use: 'stored' | 'preserved';
  preserveMethod: PreserveMethod | null;
  /** 'YYYY-MM-DD' the lot went into store. */
  date: string;
  spreadMonths: number;
  /** As logged, in the entry's own unit. */
  quantity: number;
  unit: EntryUnit;
  /** What is left today, in the entry's unit and in grams (whole and edible). */
  remainingQuantity: number;
  remainingGrams: number;
  remainingEdibleGrams: number;
  /** Energy (kcal) and protein (g) of what is left; null when the food has no value. */
  energyKcal: number | null;
  proteinG: number | null;
  /** 'YYYY-MM-DD': the day it runs out at the present rate (the first day with none left). */
  runsOut: string;
  /** Edible grams recorded as lost (spoiled or thrown out) up to today. */
  lostGrams: number;
  /** Edible grams of the whole lot, and how many of them have been eaten up to today. */
  edibleGrams: number;
  eatenEdibleGrams: number;
  outcomes: LarderOutcomeJson[];
  expectedLoss: ExpectedLoss | null;
}

/** Lots summed by crop or by category. */
export interface LarderGroup {
  key: string;
  label: string;
  remainingGrams: number;
  energyKcal: number | null;
  proteinG: number | null;
  /** The last of its lots runs out on this day. */
  runsOut: string;
  lots: number;
}

export interface LarderResponse {
  /** The household's local date the larder is reckoned for. */
  today: string;
  /** Lots with something left today, soonest to run out first. */
  lots: LarderLot[];
  byCrop: LarderGroup[];
  byCategory: LarderGroup[];
  totals: { remainingGrams: number; energyKcal: number | null; proteinG: number | null };
  /** 'YYYY-MM' months of the next twelve (this month included) in which nothing stored is left to eat. */
  emptyMonths: string[];
  /** The household's unit system, for showing weights. */
  units: UnitSystem;
}
