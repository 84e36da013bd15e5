/**
 * Home share per month and nutrient — the main number. All shares are fractions (0.25 = 25 %);
 * shareOfNeed may pass 1.
 *
 * Unknown is not zero: `home` and `bought` sum the known values and `unknownGrams` says how many
 * edible grams had no value for the nutrient. When every gram behind `home` (or `bought`) is of
 * unknown value, that sum is null, and so is any share built on it. No food at all is a known 0.
 */
import { addSums, allocate, dateMonthIndex, eatenSpan, emptySums, isEaten, type FoodEntry, type NutrientSums } from './allocate';
import { daysInMonth, listMonths, monthIndex } from './months';
import { monthlyNeeds, type Person } from './needs';
import { SHARE_NUTRIENTS, nutrientDef, type NutrientKey, type ShareNutrientKey } from './nutrients';
import { selfSufficiency } from './ratio';

export interface ShareValue {
  home: number | null;
  bought: number | null;
  need: number | null;
  /** home / (home + bought); null when both are 0 or either is unknown. */
  shareOfIntake: number | null;
  /** home / need; null when the need is 0 or unknown, or home is unknown. */
  shareOfNeed: number | null;
  /** Edible grams eaten (home and bought) with no value for this nutrient. */
  unknownGrams: number;
}

export interface ShareInput<K extends NutrientKey> {
  /** 'YYYY-MM', both included, at most 120 months. */
  from: string;
  to: string;
  entries: readonly FoodEntry[];
  people: readonly Person[];
  /** Default: SHARE_NUTRIENTS. */
  nutrients?: readonly K[];
}

export interface ShareReport<K extends NutrientKey> {
  from: string;
  to: string;
  nutrients: { key: K; name: string; unit: string }[];
  months: { month: string; days: number; values: Record<K, ShareValue> }[];
  /** The range as a whole: sums of the months, shares of those sums. */
  total: { values: Record<K, ShareValue> };
  /** FAO self-sufficiency ratio over the range as a fraction (ratioPercent × 1/100); see ratio.ts. */
  ratio: Record<K, number | null>;
  /** The same ratio in percent, as FAO states it. */
  ratioPercent: Record<K, number | null>;
}

/**
 * A sum of known amounts, or null when every gram behind it is of unknown value (no food is a known 0),
 * e.g. knownSum(0, 0, 250) → null, knownSum(0, 0, 0) → 0, knownSum(90, 100, 250) → 90.
 */
export function knownSum(sum: number, knownGrams: number, unknownGrams: number): number | null {
  return knownGrams === 0 && unknownGrams > 0 ? null : sum;
}

/**
 * The share figures for one month (or a total) from its sums and need,
 * e.g. shareValue({ home: 300, bought: 100, …grams }, 400).shareOfIntake → 0.75.
 */
export function shareValue(sums: NutrientSums, need: number | null): ShareValue {
  const home = knownSum(sums.home, sums.homeKnownGrams, sums.homeUnknownGrams);
  const bought = knownSum(sums.bought, sums.boughtKnownGrams, sums.boughtUnknownGrams);
  const intake = home === null || bought === null ? null : home + bought;
  return {
    home,
    bought,
    need,
    shareOfIntake: intake === null || intake === 0 || home === null ? null : home / intake,
    shareOfNeed: need === null || need === 0 || home === null ? null : home / need,
    unknownGrams: sums.homeUnknownGrams + sums.boughtUnknownGrams,
  };
}

/**
 * The whole share report for a range: per month and nutrient home, bought, need and shares, the
 * total over the range and the FAO self-sufficiency ratio,
 * e.g. computeShare({ from: '2026-01', to: '2026-12', entries, people }).total.values.energy_kcal.shareOfNeed.
 */
export function computeShare<K extends NutrientKey = ShareNutrientKey>(input: ShareInput<K>): ShareReport<K> {
  const { from, to, entries, people } = input;
  const keys = [...new Set(input.nutrients ?? (SHARE_NUTRIENTS as readonly NutrientKey[] as readonly K[]))];
  const nutrients = keys.map((key) => {
    const def = nutrientDef(key);
    if (!def) throw new RangeError(`unknown nutrient "${key}"`);
    return { key, name: def.name, unit: def.unit };
  });
  listMonths(from, to); // validates the range before any work
  const allocation = allocate(entries, { from, to, keys });

  const totalSums = {} as Record<K, NutrientSums>;
  const totalNeed = {} as Record<K, number | null>;
  for (const key of keys) {
    totalSums[key] = emptySums();
    totalNeed[key] = 0;
  }

  const months = allocation.map(({ month, sums }) => {
    const needs = monthlyNeeds(people, month, keys);
    const values = {} as Record<K, ShareValue>;
    for (const key of keys) {
      values[key] = shareValue(sums[key], needs[key]);
      addSums(totalSums[key], sums[key]);
      const t = totalNeed[key];
      const n = needs[key];
      totalNeed[key] = t === null || n === null ? null : t + n;
    }
    return { month, days: daysInMonth(month), values };
  });

  const totalValues = {} as Record<K, ShareValue>;
  for (const key of keys) totalValues[key] = shareValue(totalSums[key], totalNeed[key]);

  const ssr = selfSufficiency(entries, { from, to, keys });
  const ratio = {} as Record<K, number | null>;
  const ratioPercent = {} as Record<K, number | null>;
  for (const key of keys) {
    ratio[key] = ssr[key].fraction;
    ratioPercent[key] = ssr[key].percent;
  }

  return { from, to, nutrients, months, total: { values: totalValues }, ratio, ratioPercent };
}

export interface CropEntry extends FoodEntry {
  cropId: string | number;
  name: string;
}

export interface Contributor {
  cropId: string | number;
  name: string;
  /** Known amount of the nutrient the household ate from this crop. */
  amount: number;
  /** amount / all home-grown amount eaten (fraction); null when that is 0. */
  shareOfHome: number | null;
}

/**
 * The n home-grown crops that gave the most of a nutrient to what was eaten — within [from, to]
 * when a range is given (stored food counting in the months it is eaten), else over all entries,
 * e.g. topContributors(entries, 'vitamin_c_mg', 3, { from: '2026-01', to: '2026-12' })[0].name.
 */
export function topContributors(
  entries: readonly CropEntry[],
  key: NutrientKey,
  n: number,
  range?: { from: string; to: string },
): Contributor[] {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a whole number ≥ 0, got ${n}`);
  const window = range ? { start: monthIndex(range.from), months: listMonths(range.from, range.to).length } : null;
  const byCrop = new Map<string | number, { name: string; amount: number }>();
  let total = 0;
  for (const entry of entries) {
    if (entry.source !== 'home' || !isEaten(entry.use)) continue;
    const amount = entry.nutrients[key];
    if (amount == null) continue; // unknown: cannot rank
    let fraction = 1;
    if (window) {
      const span = eatenSpan(entry);
      const first = dateMonthIndex(entry.date) - window.start;
      fraction = span.filter((o) => first + o >= 0 && first + o < window.months).length / (span.length || 1);
    }
    const eaten = amount * fraction;
    if (eaten <= 0) continue;
    const crop = byCrop.get(entry.cropId) ?? { name: entry.name, amount: 0 };
    crop.amount += eaten;
    byCrop.set(entry.cropId, crop);
    total += eaten;
  }
  return [...byCrop.entries()]
    .map(([cropId, c]) => ({ cropId, name: c.name, amount: c.amount, shareOfHome: total === 0 ? null : c.amount / total }))
    .sort((a, b) => b.amount - a.amount || a.name.localeCompare(b.name))
    .slice(0, n);
}
