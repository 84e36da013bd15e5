/**
 * The gap finder: for each key nutrient, how far the garden fell short of the household's need over
 * a year, in which months it fell shortest (the late-winter hungry gap), which crops would close the
 * shortfall on the least bed area, and which crops keep (in store, or standing in the ground) long
 * enough to carry food into those lean months. It reads the share report's months and the
 * reference crops' nutrient per m² (crop-table.ts) with their eating months (eating-months.ts);
 * it does not plan — the planner (POST …/plan) chooses areas — it points at where to look.
 *
 * Unknown stays unknown: a month whose need or home supply is unknown gives no share and is never
 * called lean; a crop with no value for a nutrient is never suggested for it.
 */
import type { NutrientKey } from './nutrients';
import { parseMonth } from './months';

/** The parts of one share-report month the gap finder reads. */
export interface GapMonthInput<K extends string> {
  month: string;
  /** Before the household's records start (no need is charged); optional for older reports. */
  beforeRecords?: boolean;
  /** After the current month: its fresh harvest has not happened yet. */
  future?: boolean;
  values: Record<K, { home: number | null; need: number | null; shareOfNeed: number | null }>;
}

/** A reference crop as the gap finder weighs it. */
export interface GapCrop {
  key: string;
  name: string;
  /** Nutrient per m² per season (from the household's own yield when it has one). */
  perM2: Partial<Record<NutrientKey, number | null>>;
  /** Where the yield behind perM2 comes from. */
  yieldSource: 'reference' | 'own';
  /** kg per m² used. */
  yieldKgM2: number;
  /** Calendar months (1–12) of its harvest window, and after it the months its food keeps. */
  harvestMonths: readonly number[];
  storedMonths: readonly number[];
}

export interface GapsInput<K extends NutrientKey> {
  nutrients: readonly { key: K; name: string; unit: string }[];
  months: readonly GapMonthInput<K>[];
  crops: readonly GapCrop[];
  /** How many lowest months to name (default 3). */
  leanMonthCount?: number;
  /** How many least-area crops and carrying crops to list per nutrient (default 5 each). */
  cropCount?: number;
}

export interface GapMonth {
  month: string;
  home: number | null;
  need: number | null;
  shareOfNeed: number | null;
  /** Counted in the year's need and supply (not before records, not still to come). */
  counted: boolean;
}

/** A crop that would close a shortfall, with the area it takes. */
export interface AreaCrop {
  cropKey: string;
  name: string;
  /** Amount of the nutrient one m² gives in a season. */
  perM2: number;
  /** m² for each unit of the nutrient (1 ÷ perM2): the smaller, the better. */
  m2PerUnit: number;
  /** m² that would cover the whole shortfall; 0 when there is none. */
  areaToCloseM2: number;
  yieldSource: 'reference' | 'own';
  yieldKgM2: number;
}

/** A crop whose food is still there in some lean months. */
export interface CarryCrop {
  cropKey: string;
  name: string;
  perM2: number;
  /** The lean months ('YYYY-MM') it covers, in the year's order. */
  covers: string[];
  /** How: picked fresh in those months (overwintering, late harvest), from store, or both. */
  how: 'fresh' | 'stored' | 'both';
}

export interface NutrientGap<K extends NutrientKey> {
  key: K;
  name: string;
  unit: string;
  /** Sums over the counted months; null when any counted month's figure is unknown. */
  need: number | null;
  home: number | null;
  /** need − home when positive, else 0; null when either is unknown. */
  shortfall: number | null;
  shareOfNeed: number | null;
  months: GapMonth[];
  /** The counted months with the lowest home share of need, lowest first. */
  leanMonths: string[];
  leastAreaCrops: AreaCrop[];
  carryCrops: CarryCrop[];
}

export interface GapsReport<K extends NutrientKey> {
  /** Months counted in the year's totals ('YYYY-MM'). */
  countedMonths: string[];
  nutrients: NutrientGap<K>[];
}

function sumOrNull(values: readonly (number | null)[]): number | null {
  let s = 0;
  for (const v of values) {
    if (v === null) return null;
    s += v;
  }
  return s;
}

/**
 * The counted months with the lowest home share of need, lowest first (ties: the earlier month);
 * months without a share are left out,
 * e.g. lowestMonths([{ month: '2027-01', shareOfNeed: 0.1, counted: true }, { month: '2027-02', shareOfNeed: 0, counted: true }], 1) → ['2027-02'].
 */
export function lowestMonths(months: readonly Pick<GapMonth, 'month' | 'shareOfNeed' | 'counted'>[], n: number): string[] {
  return months
    .filter((m) => m.counted && m.shareOfNeed !== null)
    .map((m, i) => ({ m, i }))
    .sort((a, b) => a.m.shareOfNeed! - b.m.shareOfNeed! || a.i - b.i)
    .slice(0, Math.max(0, n))
    .map(({ m }) => m.month);
}

/**
 * The crops that give a nutrient on the least area: every crop with a known, positive amount per
 * m², ranked by m² per unit (ties by name), with the m² that would cover `shortfall`,
 * e.g. leastAreaCrops(crops, 'energy_kcal', 10_000, 5)[0].cropKey → the crop with the most kcal per m².
 */
export function leastAreaCrops(crops: readonly GapCrop[], key: NutrientKey, shortfall: number | null, n: number): AreaCrop[] {
  return crops
    .flatMap((c) => {
      const perM2 = c.perM2[key];
      if (perM2 == null || !(perM2 > 0)) return [];
      const short = shortfall ?? 0;
      return [{ cropKey: c.key, name: c.name, perM2, m2PerUnit: 1 / perM2, areaToCloseM2: short > 0 ? short / perM2 : 0, yieldSource: c.yieldSource, yieldKgM2: c.yieldKgM2 }];
    })
    .sort((a, b) => a.m2PerUnit - b.m2PerUnit || a.name.localeCompare(b.name))
    .slice(0, Math.max(0, n));
}

/**
 * The crops whose food is there in the lean months — fresh from a late or overwintering harvest,
 * or kept in store — and that give the nutrient; ranked by how many lean months they cover, then
 * by amount per m², e.g. carryCrops(crops, 'vitamin_c_mg', ['2027-02', '2027-03'], 5).
 */
export function carryCrops(crops: readonly GapCrop[], key: NutrientKey, leanMonths: readonly string[], n: number): CarryCrop[] {
  if (leanMonths.length === 0) return [];
  return crops
    .flatMap((c) => {
      const perM2 = c.perM2[key];
      if (perM2 == null || !(perM2 > 0)) return [];
      let fresh = false;
      let stored = false;
      const covers = [...leanMonths].sort().filter((month) => {
        const m = parseMonth(month).month;
        const inHarvest = c.harvestMonths.includes(m);
        const inStore = !inHarvest && c.storedMonths.includes(m);
        fresh ||= inHarvest;
        stored ||= inStore;
        return inHarvest || inStore;
      });
      if (covers.length === 0) return [];
      const how: CarryCrop['how'] = fresh && stored ? 'both' : fresh ? 'fresh' : 'stored';
      return [{ cropKey: c.key, name: c.name, perM2, covers, how }];
    })
    .sort((a, b) => b.covers.length - a.covers.length || b.perM2 - a.perM2 || a.name.localeCompare(b.name))
    .slice(0, Math.max(0, n));
}

/**
 * The gaps of a year: per nutrient the need, home supply, shortfall and share over the counted
 * months (neither before the records start nor still to come), the lean months, the least-area
 * crops and the crops that carry food into the lean months.
 * Example: `findGaps({ nutrients, months: report.months, crops }).nutrients[0].leanMonths` → ['2027-02', '2027-03', '2027-01']
 */
export function findGaps<K extends NutrientKey>(input: GapsInput<K>): GapsReport<K> {
  const leanCount = input.leanMonthCount ?? 3;
  const cropCount = input.cropCount ?? 5;
  const counted = (m: GapMonthInput<K>) => !m.beforeRecords && !m.future;
  const countedMonths = input.months.filter(counted).map((m) => m.month);

  const nutrients = input.nutrients.map(({ key, name, unit }): NutrientGap<K> => {
    const months: GapMonth[] = input.months.map((m) => {
      const v = m.values[key];
      if (!v) throw new RangeError(`The share report has no ${name} figures for ${m.month}: ask the report for the same nutrients as the gaps.`);
      return { month: m.month, home: v.home, need: v.need, shareOfNeed: v.shareOfNeed, counted: counted(m) };
    });
    const inYear = months.filter((m) => m.counted);
    const need = inYear.length === 0 ? null : sumOrNull(inYear.map((m) => m.need));
    const home = inYear.length === 0 ? null : sumOrNull(inYear.map((m) => m.home));
    const shortfall = need === null || home === null ? null : Math.max(0, need - home);
    const shareOfNeed = need === null || home === null || need === 0 ? null : home / need;
    const leanMonths = lowestMonths(months, leanCount);
    return {
      key,
      name,
      unit,
      need,
      home,
      shortfall,
      shareOfNeed,
      months,
      leanMonths,
      leastAreaCrops: leastAreaCrops(input.crops, key, shortfall, cropCount),
      carryCrops: carryCrops(input.crops, key, leanMonths, cropCount),
    };
  });
  return { countedMonths, nutrients };
}
