/**
 * Home share per month and nutrient — the main number. All shares are fractions (0.25 = 25 %);
 * shareOfNeed may pass 1.
 *
 * Unknown is not zero: `home` and `bought` sum the known values and `unknownGrams` says how many
 * edible grams had no value for the nutrient. When every gram behind `home` (or `bought`) is of
 * unknown value, that sum is null, and so is any share built on it. No food at all is a known 0.
 * A share resting on more than 10 % unknown weight is `uncertain`: the screens flag it.
 *
 * Whose need, and when (issue 9): months before the household's records start carry no need and
 * are left out of every total and headline; months after the current one are `future`; the
 * headline covers the counted months up to now. Carbohydrate and fat carry their AMDR range.
 */
import { addSums, allocate, emptySums, fractionEatenIn, isEaten, type FoodEntry, type NutrientSums } from './allocate';
import { needBasis, type NeedBasis } from './need-basis';
import { daysInMonth, listMonths } from './months';
import { monthlyNeedDetails, needMemo, type MonthNeed, type Person } from './needs';
import { SHARE_NUTRIENTS, nutrientDef, type NutrientKey, type ShareNutrientKey } from './nutrients';
import { selfSufficiency } from './ratio';
import { isBeforeRecords, isFutureMonth } from './records-start';

/** Above this share of unknown edible weight a figure is flagged, not shown clean. */
export const UNCERTAIN_UNKNOWN_SHARE = 0.1;

/** Logged home + bought energy below this share of the energy need: the bought food looks incomplete. */
export const INCOMPLETE_INTAKE_SHARE = 0.7;

export interface ShareValue {
  home: number | null;
  bought: number | null;
  /** The recommended intake (for carbohydrate and fat the low end of the AMDR); null when unknown or before records. */
  need: number | null;
  /** The AMDR range in grams for carbohydrate and fat; null for other nutrients. */
  needLow: number | null;
  needHigh: number | null;
  /** home / (home + bought); null when both are 0 or either is unknown. */
  shareOfIntake: number | null;
  /** home / need; null when the need is 0 or unknown, or home is unknown. */
  shareOfNeed: number | null;
  /** Edible grams eaten (home and bought) with no value for this nutrient. */
  unknownGrams: number;
  /** unknownGrams ÷ all edible grams eaten; null when nothing was eaten. */
  unknownShare: number | null;
  /** unknownShare > 10 %: the figure must be flagged, not shown clean. */
  uncertain: boolean;
}

export interface ShareInput<K extends NutrientKey> {
  /** 'YYYY-MM', both included, at most 120 months. */
  from: string;
  to: string;
  entries: readonly FoodEntry[];
  people: readonly Person[];
  /** Default: SHARE_NUTRIENTS. */
  nutrients?: readonly K[];
  /** 'YYYY-MM' the household's records start; months before it are not charged. Default: `from` (none before). */
  recordsSince?: string | null;
  /** 'YYYY-MM' now in the household's time zone; months after it are future. Default: `to` (none future). */
  currentMonth?: string | null;
}

export interface ShareMonth<K extends NutrientKey> {
  month: string;
  days: number;
  /** Before the household's records start: need null, left out of every total and headline. */
  beforeRecords: boolean;
  /** After the current month in the household's time zone. */
  future: boolean;
  values: Record<K, ShareValue>;
}

export interface ShareReport<K extends NutrientKey> {
  from: string;
  to: string;
  /** 'YYYY-MM' the records start (the household's value or the default rule). */
  recordsSince: string;
  /** 'YYYY-MM' now in the household's time zone. */
  currentMonth: string;
  nutrients: { key: K; name: string; unit: string }[];
  months: ShareMonth<K>[];
  /** The range's counted months (not before records; future months carry food already logged): sums and shares of those sums. */
  total: { values: Record<K, ShareValue> };
  /** What each nutrient's need rests on over the counted months ('mixed' when people differ; null when nobody has a value). */
  needBasis: Record<K, NeedBasis | null>;
  /** The months neither before records nor in the future ("the growing year so far"); null when there are none. */
  headline: { from: string; to: string; values: Record<K, ShareValue> } | null;
  /** Logged energy over the headline months against the energy need. */
  intake: {
    /** (home + bought energy) ÷ energy need; null when the need is unknown or 0, or there is no headline. */
    loggedEnergyShareOfNeed: number | null;
    /** Logged energy under 70 % of the need: bought food looks incomplete. */
    looksIncomplete: boolean;
  };
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

/** A need with no range, as older callers give it. */
function plainNeed(need: number | null): Pick<MonthNeed, 'need' | 'needLow' | 'needHigh'> {
  return { need, needLow: null, needHigh: null };
}

/**
 * The share figures for one month (or a total) from its sums and need,
 * e.g. shareValue({ home: 300, bought: 100, …grams }, 400).shareOfIntake → 0.75.
 */
export function shareValue(sums: NutrientSums, need: number | null | Pick<MonthNeed, 'need' | 'needLow' | 'needHigh'>): ShareValue {
  const n = need === null || typeof need === 'number' ? plainNeed(need) : need;
  const home = knownSum(sums.home, sums.homeKnownGrams, sums.homeUnknownGrams);
  const bought = knownSum(sums.bought, sums.boughtKnownGrams, sums.boughtUnknownGrams);
  const intake = home === null || bought === null ? null : home + bought;
  const unknownGrams = sums.homeUnknownGrams + sums.boughtUnknownGrams;
  const allGrams = unknownGrams + sums.homeKnownGrams + sums.boughtKnownGrams;
  const unknownShare = allGrams > 0 ? unknownGrams / allGrams : null;
  return {
    home,
    bought,
    need: n.need,
    needLow: n.needLow,
    needHigh: n.needHigh,
    shareOfIntake: intake === null || intake === 0 || home === null ? null : home / intake,
    shareOfNeed: n.need === null || n.need === 0 || home === null ? null : home / n.need,
    unknownGrams,
    unknownShare,
    uncertain: unknownShare !== null && unknownShare > UNCERTAIN_UNKNOWN_SHARE,
  };
}

/** A running total of months: food sums and need, the need null as soon as one month's is unknown. */
interface Running {
  sums: NutrientSums;
  need: number | null;
  low: number | null;
  high: number | null;
  ranged: boolean;
}

function startRunning(): Running {
  return { sums: emptySums(), need: 0, low: 0, high: 0, ranged: false };
}

function addMonth(t: Running, sums: NutrientSums, n: MonthNeed): void {
  addSums(t.sums, sums);
  t.need = t.need === null || n.need === null ? null : t.need + n.need;
  // A month without a range (nobody with an AMDR at home) adds its need to both ends.
  t.low = t.low === null || n.need === null ? null : t.low + (n.needLow ?? n.need);
  t.high = t.high === null || n.need === null ? null : t.high + (n.needHigh ?? n.need);
  if (n.needLow !== null) t.ranged = true;
}

function runningValue(t: Running): ShareValue {
  return shareValue(t.sums, { need: t.need, needLow: t.ranged ? t.low : null, needHigh: t.ranged ? t.high : null });
}

/**
 * The whole share report for a range: per month and nutrient home, bought, need (with the AMDR
 * range) and shares; the total over the counted months; the headline over the year so far; whether
 * the logs look incomplete; and the FAO self-sufficiency ratio,
 * e.g. computeShare({ from: '2026-01', to: '2026-12', entries, people, recordsSince: '2026-04', currentMonth: '2026-09' }).headline.values.energy_kcal.shareOfNeed.
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
  const recordsSince = input.recordsSince ?? from;
  const currentMonth = input.currentMonth ?? to;
  isFutureMonth(currentMonth, currentMonth); // validates the current month
  // Energy is always counted: the intake check rests on it.
  const allocKeys = keys.includes('energy_kcal' as K) ? keys : [...keys, 'energy_kcal' as K];
  const allocation = allocate(entries, { from, to, keys: allocKeys });
  const memo = needMemo();

  const total = {} as Record<K, Running>;
  const headline = {} as Record<K, Running>;
  for (const key of allocKeys) {
    total[key] = startRunning();
    headline[key] = startRunning();
  }
  const counted: string[] = [];
  const headlineList: string[] = [];

  const months = allocation.map(({ month, sums }) => {
    const beforeRecords = isBeforeRecords(month, recordsSince);
    const future = isFutureMonth(month, currentMonth);
    const needs = monthlyNeedDetails(people, month, allocKeys, memo);
    const values = {} as Record<K, ShareValue>;
    for (const key of allocKeys) {
      const need = beforeRecords ? { need: null, needLow: null, needHigh: null, peopleWithoutValue: 0 } : needs[key];
      if (keys.includes(key)) values[key] = shareValue(sums[key], need);
      if (beforeRecords) continue;
      addMonth(total[key], sums[key], need);
      if (!future) addMonth(headline[key], sums[key], need);
    }
    if (!beforeRecords) counted.push(month);
    if (!beforeRecords && !future) headlineList.push(month);
    return { month, days: daysInMonth(month), beforeRecords, future, values };
  });

  const totalValues = {} as Record<K, ShareValue>;
  const headlineValues = {} as Record<K, ShareValue>;
  for (const key of keys) {
    totalValues[key] = runningValue(total[key]);
    headlineValues[key] = runningValue(headline[key]);
  }

  const energy = headline['energy_kcal' as K];
  const logged = energy.sums.home + energy.sums.bought;
  const loggedEnergyShareOfNeed = headlineList.length === 0 || energy.need === null || energy.need === 0 ? null : logged / energy.need;

  const ssr = selfSufficiency(entries, { from, to, keys });
  const ratio = {} as Record<K, number | null>;
  const ratioPercent = {} as Record<K, number | null>;
  for (const key of keys) {
    ratio[key] = ssr[key].fraction;
    ratioPercent[key] = ssr[key].percent;
  }

  return {
    from,
    to,
    recordsSince,
    currentMonth,
    nutrients,
    months,
    total: { values: totalValues },
    needBasis: needBasis(people, counted, keys, memo),
    headline: headlineList.length === 0 ? null : { from: headlineList[0]!, to: headlineList[headlineList.length - 1]!, values: headlineValues },
    intake: {
      loggedEnergyShareOfNeed,
      looksIncomplete: loggedEnergyShareOfNeed !== null && loggedEnergyShareOfNeed < INCOMPLETE_INTAKE_SHARE,
    },
    ratio,
    ratioPercent,
  };
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
  /** The share of each entry eaten in `range`, when the caller has them already (one per entry). */
  fractions?: readonly number[],
): Contributor[] {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a whole number ≥ 0, got ${n}`);
  const byCrop = new Map<string | number, { name: string; amount: number }>();
  let total = 0;
  for (let i = 0; i < entries.length; i++) {
    const entry = entries[i]!;
    if (entry.source !== 'home' || !isEaten(entry.use)) continue;
    const amount = entry.nutrients[key];
    if (amount == null) continue; // unknown: cannot rank
    // By day, like allocate(): a lot stored on 30 November counts one day's share in November.
    const fraction = fractions ? fractions[i]! : range ? fractionEatenIn(entry, range) : 1;
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
