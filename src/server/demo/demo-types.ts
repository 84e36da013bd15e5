/**
 * The shapes the demo generator hands to the writer (and to issue 14's benchmark): plain data that
 * names crops by their crop-table key, beds and plantings by their own keys and foods by USDA SR28
 * code, so it can be generated, compared and hashed without a database.
 */
import type { z } from 'zod';
import type { CropCategory } from '@/lib/crop-categories';
import type { CropTableRow } from '@/lib/crop-table';
import type { HarvestInputRaw, PurchaseInputRaw } from '@/lib/entry-schemas';
import type { LarderOutcomeKind } from '@/lib/larder-outcomes';
import type { personInput } from '@/lib/people-schemas';
import type { PlantingSlot } from '@/lib/planting-slots';

export type PersonInputRaw = z.input<typeof personInput>;

/** What the generator needs to know of a reference food: energy and refuse. */
export interface DemoFood {
  kcalPer100g: number;
  refusePct: number | null;
}

export interface DemoOptions {
  /** Any whole number; the same seed and anchor give the same household. */
  seed: number;
  /** The last day with entries ('YYYY-MM-DD'); default today in the household's zone. */
  anchor?: string;
  /** Growing years of records, ending with the one holding the anchor (default 3, at most 10). */
  years?: number;
  /** The reference crop table (reference-data/crops.csv, parsed). */
  cropTable: readonly CropTableRow[];
  /** Energy and refuse of every SR28 code the demo names. */
  foods: ReadonlyMap<string, DemoFood>;
  /** Keep only the first n beds of the catalogue (default: all of them). */
  bedCount?: number;
  /** Multiplies every bed's area (default 1). */
  areaScale?: number;
  people?: readonly PersonInputRaw[];
  hens?: number;
  hives?: number;
  /**
   * Sizes for the benchmark's heavy household (defaults keep the demo as it is): `lines` repeats
   * the beds that many times, each line growing its own variety of every crop; `pickScale` picks
   * that many times as often; `tripsPerBuy` splits every purchase into that many shopping trips.
   */
  lines?: number;
  pickScale?: number;
  tripsPerBuy?: number;
}

export interface DemoCrop {
  /** The crop's own key (a second line's crops carry the line: 'potatoes~2'). */
  key: string;
  /** Its row of the reference crop table. */
  referenceKey: string;
  name: string;
  variety: string;
  code: string;
  category: CropCategory;
  edibleFraction: number | null;
  defaultSpreadMonths: number | null;
}

export interface DemoBed {
  key: string;
  name: string;
  areaM2: number;
  notes: string;
}

export interface DemoPlanting {
  key: string;
  crop: string;
  bed: string;
  areaM2: number;
  seasonYear: number;
  slot: PlantingSlot;
  sowDate: string | null;
  harvestFrom: string;
  harvestTo: string;
}

/** A harvest entry as the API would take it, less its crop or food id (named by key and code here). */
export type DemoHarvestEntry = Omit<HarvestInputRaw, 'cropId' | 'foodId' | 'plantingId'> & { date: string; quantity: number; unit: 'kg' | 'g'; use: NonNullable<HarvestInputRaw['use']>; spreadMonths: number };

export interface DemoHarvest {
  /** Crop key, or null for eggs and honey (logged straight against their food). */
  crop: string | null;
  /** SR28 code of its food. */
  food: string;
  planting: string | null;
  /** Parts of one weighing share a split key. */
  split: string | null;
  entry: DemoHarvestEntry;
  /** As the app stores them (src/lib/units.ts, edible.ts). */
  grams: number;
  edibleGrams: number;
}

export type DemoPurchaseEntry = Omit<PurchaseInputRaw, 'foodId'> & { date: string; quantity: number; unit: 'kg' | 'g'; spreadMonths: number };

export interface DemoPurchase {
  food: string;
  entry: DemoPurchaseEntry;
  grams: number;
  edibleGrams: number;
}

/** A larder record of one stored lot (by its index in `harvests`). */
export interface DemoOutcome {
  harvest: number;
  kind: LarderOutcomeKind;
  date: string;
  lostFraction: number | null;
  note: string;
}

/** The generator's own estimate of a month's energy (kcal): what the household needs, grew and bought, as eaten. */
export interface DemoMonth {
  month: string;
  needKcal: number;
  homeKcal: number;
  boughtKcal: number;
}

export interface DemoData {
  household: { name: string; timezone: string; units: 'metric'; currency: string; yearStartMonth: number; recordsSince: string; lastSpringFrost: string; firstAutumnFrost: string };
  people: PersonInputRaw[];
  beds: DemoBed[];
  crops: DemoCrop[];
  plantings: DemoPlanting[];
  harvests: DemoHarvest[];
  purchases: DemoPurchase[];
  outcomes: DemoOutcome[];
  staples: { code: string; label: string; quantity: number; unit: 'kg'; spreadMonths: number }[];
  months: DemoMonth[];
  totals: { harvests: number; purchases: number; harvestKg: number; purchaseKg: number; homeKcal: number; boughtKcal: number };
}
