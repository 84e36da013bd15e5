/**
 * When food is eaten: an entry's nutrients spread over the months the household eats it (by day,
 * see spread.ts), kept apart for home-grown and bought food, with the weight whose nutrient value is unknown counted
 * beside the sums (an unknown value is never read as zero).
 */
import { addMonths, dateMonthIndex, listMonths, monthIndex, monthOf, parseDate } from './months';
import { SHARE_NUTRIENTS, type NutrientKey } from './nutrients';
import { spreadBetween, spreadByDay, type SpreadPart } from './spread';

import { EATEN_USES, USES, type Use } from './uses';

// The uses are defined once, in ./uses; re-exported for the share code's callers.
export { EATEN_USES, USES, type Use };

export type Source = 'home' | 'bought';

/** Amounts for an entry's edible grams; null = the dataset has no value. A missing key is unknown too. */
export type NutrientAmounts = Partial<Record<NutrientKey, number | null>>;

export interface FoodEntry {
  /** 'YYYY-MM-DD' of the harvest or purchase. */
  date: string;
  use: Use;
  source: Source;
  /** Whole months the food is eaten over, from the entry's date (≥ 1); see spread.ts. */
  spreadMonths: number;
  nutrients: NutrientAmounts;
  /**
   * The same amounts as numbers in SHARE_NUTRIENTS order (NaN: unknown), when the caller has them
   * (share-groups.ts): the share report reads thousands of entries, and an array is read faster
   * than objects of as many shapes as there are foods. It must say what `nutrients` says. A plain
   * array, not a Float64Array: a typed array of 15 doubles gets its own buffer outside V8's heap,
   * about 25 times dearer to make, and the report makes one per group.
   */
  shareAmounts?: readonly number[];
  edibleGrams: number;
  /**
   * A lot re-spread by the larder's records (larder.ts): eaten evenly by day over
   * [eatenFrom ?? date, until) instead of over its spread. Absent for every other entry.
   */
  eatenFrom?: string | null;
  until?: string | null;
}

/** What decides when an entry is eaten. */
type EatenBasis = Pick<FoodEntry, 'date' | 'use' | 'source' | 'spreadMonths' | 'eatenFrom' | 'until'>;

/** Sums for one month and nutrient. */
export interface NutrientSums {
  /** Sum of the known amounts of home-grown food. */
  home: number;
  /** Sum of the known amounts of bought food. */
  bought: number;
  /** Edible grams of home food whose value for this nutrient is known / unknown. */
  homeKnownGrams: number;
  homeUnknownGrams: number;
  boughtKnownGrams: number;
  boughtUnknownGrams: number;
}

export interface MonthAllocation<K extends NutrientKey = NutrientKey> {
  month: string;
  sums: Record<K, NutrientSums>;
}

export interface AllocateOptions<K extends NutrientKey> {
  /** First and last month of the report, 'YYYY-MM', both included. */
  from: string;
  to: string;
  keys: readonly K[];
}

export interface EatenPart {
  month: string;
  /** Share of the entry eaten in this month (the parts of an entry add up to 1). */
  fraction: number;
}

/**
 * Nutrients of an amount of edible food from amounts per 100 g; null stays null,
 * e.g. nutrientsOf(750, { energy_kcal: 77, vitamin_d_ug: null }) → { energy_kcal: 577.5, vitamin_d_ug: null }.
 */
export function nutrientsOf<K extends string>(
  edibleGrams: number,
  per100g: Readonly<Partial<Record<K, number | null>>>,
): Partial<Record<K, number | null>> {
  checkGrams(edibleGrams);
  const out: Partial<Record<K, number | null>> = {};
  for (const key of Object.keys(per100g) as K[]) {
    const amount = per100g[key];
    if (amount != null && (!Number.isFinite(amount) || amount < 0)) {
      throw new RangeError(`amount of ${key} per 100 g must be a number ≥ 0, got ${amount}`);
    }
    out[key] = amount == null ? null : (edibleGrams / 100) * amount;
  }
  return out;
}

/** Whether the household eats food with this use, e.g. isEaten('stored') → true, isEaten('sold') → false. */
export function isEaten(use: Use): boolean {
  return (EATEN_USES as readonly Use[]).includes(use);
}

/**
 * The months an entry is eaten in and the share in each: fresh home food, and anything with a
 * spread of one month, wholly in its own month; stored or preserved food and bought food with a
 * spread of 2 months or more evenly per day from its date to the same date `spreadMonths` months
 * later (see spread.ts); nothing for seed, given, sold or lost,
 * e.g. eatenParts({ date: '2026-11-01', use: 'stored', source: 'home', spreadMonths: 3 }) →
 * 2026-11 30/92, 2026-12 31/92, 2027-01 31/92.
 */
export function eatenParts(entry: EatenBasis): EatenPart[] {
  const month = monthOf(entry.date);
  return eatenShares(entry).map(({ offset, fraction }) => ({ month: addMonths(month, offset), fraction }));
}

/**
 * The same as offsets from the entry's month (0, 1, …) with their shares, without building month
 * strings: the share report calls this for every entry,
 * e.g. eatenShares({ date: '2026-11-30', use: 'stored', source: 'home', spreadMonths: 3 })[0] → { offset: 0, fraction: 1/90 }.
 */
export function eatenShares(entry: EatenBasis): readonly SpreadPart[] {
  checkSpread(entry.spreadMonths);
  if (!isEaten(entry.use)) return NONE;
  if (entry.until) {
    // Offsets stay counted from the entry's own month, as for every other entry.
    const from = entry.eatenFrom ?? entry.date;
    const shift = dateMonthIndex(from) - dateMonthIndex(entry.date);
    return spreadBetween(from, entry.until).map((p) => ({ offset: p.offset + shift, fraction: p.fraction }));
  }
  if (entry.use === 'fresh' && entry.source === 'home') {
    parseDate(entry.date); // checks the date
    return WHOLE_OWN_MONTH;
  }
  return spreadByDay(entry.date, entry.spreadMonths);
}

// Shared answers, read and never changed by callers (as spreadByDay's kept parts are).
const NONE: readonly SpreadPart[] = Object.freeze([]);
const WHOLE_OWN_MONTH: readonly SpreadPart[] = Object.freeze([Object.freeze({ offset: 0, fraction: 1 })]);

/**
 * The months an entry touches, as offsets from its month; a lot spread by day from a late date
 * touches one month more than its spread, e.g. a stored entry of 30 November with spreadMonths 3
 * → [0, 1, 2, 3]. Use eatenShares for how much falls in each.
 */
export function eatenSpan(entry: EatenBasis): number[] {
  return eatenShares(entry).map((p) => p.offset);
}

/**
 * The share of an entry eaten within [from, to] (months 'YYYY-MM', both included), by day like
 * allocate(), e.g. fractionEatenIn({ date: '2026-11-30', use: 'stored', source: 'home', spreadMonths: 3 }, { from: '2026-12', to: '2027-12' }) → 89/90.
 */
export function fractionEatenIn(
  entry: EatenBasis,
  { from, to }: { from: string; to: string },
): number {
  return fractionEatenBetween(entry, monthIndex(from), monthIndex(to));
}

/** fractionEatenIn with the range as month indexes (monthIndex), for callers that ask for many entries. */
export function fractionEatenBetween(entry: EatenBasis, start: number, end: number): number {
  const first = dateMonthIndex(entry.date);
  const shares = eatenShares(entry);
  let sum = 0;
  for (let i = 0; i < shares.length; i++) {
    const { offset, fraction } = shares[i]!;
    if (first + offset >= start && first + offset <= end) sum += fraction;
  }
  return sum;
}

/** Month index (year × 12 + month − 1) of a 'YYYY-MM-DD' date, checked once (months.ts). */
export { dateMonthIndex };

function checkSpread(spreadMonths: number): void {
  if (!Number.isInteger(spreadMonths) || spreadMonths < 1) {
    throw new RangeError(`spreadMonths must be a whole number ≥ 1, got ${spreadMonths}`);
  }
}

function checkGrams(grams: number): void {
  if (!Number.isFinite(grams) || grams < 0) throw new RangeError(`edible grams must be a number ≥ 0, got ${grams}`);
}

/** Empty sums, e.g. as the start of a total. */
export function emptySums(): NutrientSums {
  return { home: 0, bought: 0, homeKnownGrams: 0, homeUnknownGrams: 0, boughtKnownGrams: 0, boughtUnknownGrams: 0 };
}

/** Adds b into a (mutates a) and returns a, e.g. to total months. */
export function addSums(a: NutrientSums, b: NutrientSums): NutrientSums {
  a.home += b.home;
  a.bought += b.bought;
  a.homeKnownGrams += b.homeKnownGrams;
  a.homeUnknownGrams += b.homeUnknownGrams;
  a.boughtKnownGrams += b.boughtKnownGrams;
  a.boughtUnknownGrams += b.boughtUnknownGrams;
  return a;
}

/** What addEntryPart reads of an entry. */
type EntryAmounts = Pick<FoodEntry, 'date' | 'source' | 'edibleGrams' | 'nutrients'>;

/** An entry's amount of a nutrient (null or missing: unknown), refused when negative or not a number. */
function checkedAmount(entry: Pick<FoodEntry, 'date' | 'nutrients'>, key: NutrientKey): number | null | undefined {
  return checked(entry, key, entry.nutrients[key]);
}

function checked<A extends number | null | undefined>(entry: Pick<FoodEntry, 'date'>, key: NutrientKey, amount: A): A {
  if (amount != null && (!Number.isFinite(amount) || amount < 0)) {
    throw new RangeError(`${key} of an entry dated ${entry.date} must be a number ≥ 0, got ${amount}`);
  }
  return amount;
}

/** Each key's place in SHARE_NUTRIENTS (for FoodEntry.shareAmounts), or null when a key is not a share nutrient. */
export function shareIndexes(keys: readonly NutrientKey[]): number[] | null {
  const places = keys.map((k) => (SHARE_NUTRIENTS as readonly NutrientKey[]).indexOf(k));
  return places.every((i) => i >= 0) ? places : null;
}

/**
 * An entry's amount of the key at `k`, NaN when unknown: from shareAmounts when the entry has them
 * and `places` (shareIndexes of the keys) says where, else from its nutrients. Checked as checkedAmount.
 */
export function amountAt(entry: Pick<FoodEntry, 'date' | 'nutrients' | 'shareAmounts'>, keys: readonly NutrientKey[], places: readonly number[] | null, k: number): number {
  if (places && entry.shareAmounts) {
    const a = entry.shareAmounts[places[k]!]!;
    return Number.isNaN(a) ? NaN : checked(entry, keys[k]!, a);
  }
  return checkedAmount(entry, keys[k]!) ?? NaN;
}

/**
 * Adds one share of an entry into the sums of one month and nutrient.
 * A null or missing value adds its grams to the unknown weight, never zero to the sum.
 */
export function addEntryPart(sums: NutrientSums, entry: EntryAmounts, key: NutrientKey, fraction: number): void {
  const amount = checkedAmount(entry, key);
  addAmount(sums, entry.source, amount == null ? NaN : amount * fraction, entry.edibleGrams * fraction);
}

/**
 * Adds an amount of a nutrient (NaN: unknown) eaten with `grams` of food into a month's sums: an
 * unknown amount adds its grams to the unknown weight, never zero to the sum.
 */
export function addAmount(sums: NutrientSums, source: Source, amount: number, grams: number): void {
  if (source === 'home') {
    if (Number.isNaN(amount)) sums.homeUnknownGrams += grams;
    else {
      sums.home += amount;
      sums.homeKnownGrams += grams;
    }
  } else if (Number.isNaN(amount)) sums.boughtUnknownGrams += grams;
  else {
    sums.bought += amount;
    sums.boughtKnownGrams += grams;
  }
}

/**
 * Per month of [from, to] and per nutrient: what was eaten from home and from bought food.
 * Entries dated before `from` count in the months of the range they are still eaten in,
 * e.g. allocate(entries, { from: '2026-01', to: '2026-12', keys: ['energy_kcal'] })[10].sums.energy_kcal.home.
 */
export function allocate<K extends NutrientKey>(
  entries: readonly FoodEntry[],
  { from, to, keys }: AllocateOptions<K>,
): MonthAllocation<K>[] {
  const months = listMonths(from, to);
  const start = monthIndex(from);
  const result: MonthAllocation<K>[] = months.map((month) => {
    const sums = {} as Record<K, NutrientSums>;
    for (const key of keys) sums[key] = emptySums();
    return { month, sums };
  });
  // The sums of each month as an array in the order of `keys`, so the inner loop indexes, not looks up.
  const slots = result.map((m) => keys.map((key) => m.sums[key]));
  // An entry's amounts by key, unboxed (NaN: unknown), so reading thousands of entries makes no garbage.
  const amounts = new Float64Array(keys.length);
  const places = shareIndexes(keys);
  for (const entry of entries) {
    checkGrams(entry.edibleGrams);
    const shares = eatenShares(entry);
    if (shares.length === 0) continue;
    const first = dateMonthIndex(entry.date) - start;
    for (let k = 0; k < keys.length; k++) amounts[k] = amountAt(entry, keys, places, k);
    const home = entry.source === 'home';
    for (let p = 0; p < shares.length; p++) {
      const { offset, fraction } = shares[p]!;
      const slot = slots[first + offset];
      if (!slot) continue; // eaten outside the report's range
      const grams = entry.edibleGrams * fraction;
      for (let k = 0; k < keys.length; k++) {
        const sums = slot[k]!;
        const amount = amounts[k]!;
        // As addEntryPart: a null or missing value adds its grams to the unknown weight, never zero to the sum.
        if (home) {
          if (Number.isNaN(amount)) sums.homeUnknownGrams += grams;
          else {
            sums.home += amount * fraction;
            sums.homeKnownGrams += grams;
          }
        } else if (Number.isNaN(amount)) sums.boughtUnknownGrams += grams;
        else {
          sums.bought += amount * fraction;
          sums.boughtKnownGrams += grams;
        }
      }
    }
  }
  return result;
}
