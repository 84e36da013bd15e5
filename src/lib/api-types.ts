/**
 * The JSON shapes the household API answers with for crops, staples, people, members and CSV imports. They
 * live here, as pure types, so that the server modules that build them and the browser islands
 * that read them share one definition without the browser importing anything from `src/server`.
 */
import type { CropCategory } from './crop-categories';
import type { CsvError } from './csv-import';
import type { Use } from './entry-schemas';
import type { RoleValue } from './household-schemas';
import type { PersonFields } from './people-schemas';
import type { PersonEnergy } from './person-energy';
import type { EntryUnit } from './entry-units';
import type { HouseholdMeasure } from './count-volume';

/** A reference food as a crop shows it: enough to judge the match. */
export interface FoodSummary {
  id: number;
  dataset: string;
  code: string;
  name: string;
  refusePct: number | null;
  kcalPer100g: number | null;
  proteinPer100g: number | null;
  /** The dataset's household measures in its order ("1 large" = 50 g): counts and volumes are weighed with them. */
  measures: HouseholdMeasure[];
}

/** A crop of the household's catalogue, with its food match and harvest count. */
export interface CropJson {
  id: number;
  name: string;
  variety: string | null;
  displayName: string;
  foodId: number | null;
  food: FoodSummary | null;
  category: CropCategory;
  edibleFraction: number | null;
  defaultUse: Use | null;
  defaultSpreadMonths: number | null;
  notFood: boolean;
  /** Grams of one piece, bunch or head as the grower counts this crop (weighed whole); null = the food's measures. */
  countGrams: number | null;
  archived: boolean;
  harvestCount: number;
  lastHarvestDate: string | null;
  /** Harvests of the last 365 days up to the household's today (the chips' "most used"). */
  harvestsLastYear: number;
  /** Place among the pinned crop chips (1 = first); null = not pinned. */
  pinRank: number | null;
}

/** A food on the household's staples list, logged again with one tap. */
export interface StapleJson {
  id: number;
  foodId: number;
  foodName: string;
  foodCode: string;
  label: string;
  quantity: number;
  unit: EntryUnit;
  spreadMonths: number;
}

/** A person who eats in the household, as the API answers: stored fields plus this month's energy need. */
export interface PersonJson extends PersonFields {
  id: number;
  /** Daily energy need this month (household time zone), or null when not yet born. */
  energy: PersonEnergy | null;
}

/**
 * A person as growers and viewers get them (src/lib/privacy.ts): no age, birth dates, height,
 * weight, pregnancy or breastfeeding — the name, presence and the energy need only.
 */
export interface PersonSummaryJson {
  id: number;
  name: string;
  atHomePct: number;
  presentFrom: string | null;
  presentTo: string | null;
  energy: Pick<PersonEnergy, 'kcalPerDay' | 'atHomeKcalPerDay' | 'basis'> | null;
  bodyDataHidden: true;
}

/** A row of a CSV import preview as it would be stored. */
export interface PreviewRow {
  row: number;
  date: string;
  crop: string | null;
  foodCode: string | null;
  foodName: string | null;
  quantity: number;
  unit: EntryUnit;
  grams: number;
  edibleGrams: number;
  /** Where a count or volume got its grams; null for a weight. */
  weightSource: string | null;
  use?: string;
  spreadMonths: number;
  trimmed: boolean;
  note: string | null;
  price?: number | null;
  currency?: string | null;
}

/** The body of an import answer (preview or commit, accepted or refused with its rows). */
export interface ImportAnswerBody {
  ok: boolean;
  kind: 'harvests' | 'purchases';
  mode: 'preview' | 'commit';
  /** The first rows as they would be stored (at most the preview limit). */
  rows: PreviewRow[];
  rowCount: number;
  totals: { grams: number; edibleGrams: number };
  errors: CsvError[];
  /** Crops the file names that the household lacks, each with the kind its name suggests (else 'other'). */
  unknownCrops: { name: string; variety?: string; category: CropCategory }[];
  unknownFoodCodes: string[];
  ignoredColumns: string[];
  created?: number;
  error?: { code: string; message: string; fields: Record<string, string> };
}

/** An import answer: its HTTP status and body. */
export interface ImportAnswer {
  status: number;
  body: ImportAnswerBody;
}

/** A member of a household as GET /api/households/{id}/members lists them. */
export interface MemberJson {
  userId: string;
  role: RoleValue;
  name: string;
  /** Owners see every member's address; others only their own (src/lib/privacy.ts). */
  email?: string;
}

/** A pending invitation as GET /api/households/{id}/invitations lists it. */
export interface InvitationJson {
  id: number;
  email: string;
  role: RoleValue;
  expiresAt: string;
}
