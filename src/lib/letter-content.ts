/**
 * What one monthly letter says, picked from the reports the app already makes — never worked out
 * again: the month's home share of energy and protein from the share report, the nutrients
 * furthest from need by the gap finder's own definition (shortfall = need − home, ranked by the
 * lowest home share of need), the crops that gave most energy (the share report's top crops), the
 * larder as it stands, and one suggestion from the gap finder's report of the growing year.
 * letter-text.ts turns the result into words.
 */
import type { GapsReport } from './gaps';
import { findGaps } from './gaps';
import type { LarderResponse } from './larder-types';
import type { ShareNutrientKey } from './nutrients';
import type { ShareResponse } from './share-types';
import type { UnitSystem } from './units';

/** How many nutrients, crops and larder rows a letter names. */
export const LETTER_LIMITS = { nutrients: 3, crops: 3, larder: 5 } as const;

export interface LetterShare {
  /** Home ÷ (home + bought), fraction; null when nothing was eaten or a value is unknown. */
  shareOfIntake: number | null;
  /** Home ÷ need, fraction; null when the need is unknown (no people) or the home supply is. */
  shareOfNeed: number | null;
  uncertain: boolean;
}

export interface LetterGap {
  key: ShareNutrientKey;
  name: string;
  unit: string;
  home: number;
  need: number;
  shortfall: number;
  shareOfNeed: number;
}

export interface LetterCrop {
  name: string;
  energyKcal: number | null;
  proteinG: number | null;
  /** The crop's part of everything home-grown eaten in the month, in energy (fraction). */
  shareOfHomeEnergy: number | null;
}

export interface LetterStore {
  label: string;
  remainingGrams: number;
  /** 'YYYY-MM-DD': the first day with none left at the present rate. */
  runsOut: string;
}

export interface LetterSuggestion {
  nutrient: string;
  unit: string;
  /** The growing year's shortfall of the nutrient so far. */
  shortfall: number;
  crop: string;
  /** m² of the crop that would cover the shortfall. */
  areaM2: number;
  yieldSource: 'reference' | 'own';
}

export interface LetterData {
  householdName: string;
  /** 'YYYY-MM', the month the letter reports on. */
  month: string;
  units: UnitSystem;
  energy: LetterShare;
  protein: LetterShare;
  /**
   * 'gaps': some nutrients fell short (in `gaps`); 'none': every nutrient with a known need was
   * covered; 'unknown': no need could be worked out (no people recorded, or no figures).
   */
  gapState: 'gaps' | 'none' | 'unknown';
  gaps: LetterGap[];
  crops: LetterCrop[];
  larder: { today: string; stores: LetterStore[]; moreStores: number; totalGrams: number; firstEmptyMonth: string | null };
  suggestion: LetterSuggestion | null;
  links: { share: string; account: string; unsubscribe: string };
}

export interface LetterInput {
  householdName: string;
  month: string;
  /** The share report of exactly `month`. */
  share: Pick<ShareResponse, 'nutrients' | 'months' | 'topCrops'>;
  /** The gap finder's report of the growing year holding `month`; null when it could not be made. */
  yearGaps: GapsReport<ShareNutrientKey> | null;
  larder: LarderResponse;
  links: LetterData['links'];
}

const NO_SHARE: LetterShare = { shareOfIntake: null, shareOfNeed: null, uncertain: false };

/**
 * True when the month's records show nothing eaten, home-grown or bought: such a household gets no
 * letter that month (an empty letter tells a grower nothing),
 * e.g. nothingEaten(report of a household with no entries) → true.
 */
export function nothingEaten(share: Pick<ShareResponse, 'months'>, month: string): boolean {
  const v = share.months.find((m) => m.month === month)?.values.energy_kcal;
  return !v || (!(v.home ?? 0) && !(v.bought ?? 0));
}

/**
 * The nutrients the gap finder finds short in the month (need − home > 0, both known), lowest home
 * share of need first, at most `n`; with 'none' when every known need was met and 'unknown' when no
 * need is known at all.
 */
export function furthestFromNeed(share: Pick<ShareResponse, 'nutrients' | 'months'>, month: string, n: number = LETTER_LIMITS.nutrients): { state: LetterData['gapState']; gaps: LetterGap[] } {
  const months = share.months.filter((m) => m.month === month);
  const report = findGaps({ nutrients: share.nutrients, months, crops: [] });
  const known = report.nutrients.filter((g) => g.need !== null && g.home !== null && g.need > 0);
  const gaps = known
    .filter((g) => g.shortfall !== null && g.shortfall > 0 && g.shareOfNeed !== null)
    .sort((a, b) => a.shareOfNeed! - b.shareOfNeed! || a.name.localeCompare(b.name))
    .slice(0, n)
    .map((g) => ({ key: g.key, name: g.name, unit: g.unit, home: g.home!, need: g.need!, shortfall: g.shortfall!, shareOfNeed: g.shareOfNeed! }));
  return { state: known.length === 0 ? 'unknown' : gaps.length > 0 ? 'gaps' : 'none', gaps };
}

/**
 * One suggestion from the gap finder's year: for the nutrient with the lowest home share of need
 * that has a shortfall, the crop that closes it on the least bed area; null when nothing falls
 * short or no crop gives the nutrient.
 */
export function pickSuggestion(gaps: GapsReport<ShareNutrientKey> | null): LetterSuggestion | null {
  if (!gaps) return null;
  const short = gaps.nutrients
    .filter((g) => g.shortfall !== null && g.shortfall > 0 && g.shareOfNeed !== null && g.leastAreaCrops.length > 0)
    .sort((a, b) => a.shareOfNeed! - b.shareOfNeed! || a.name.localeCompare(b.name));
  const g = short[0];
  if (!g) return null;
  const crop = g.leastAreaCrops[0]!;
  return { nutrient: g.name, unit: g.unit, shortfall: g.shortfall!, crop: crop.name, areaM2: crop.areaToCloseM2, yieldSource: crop.yieldSource };
}

/** The larder rows a letter names: by crop, soonest to run out first. */
function larderPart(larder: LarderResponse): LetterData['larder'] {
  const groups = [...larder.byCrop].filter((g) => g.remainingGrams > 0).sort((a, b) => a.runsOut.localeCompare(b.runsOut) || a.label.localeCompare(b.label));
  return {
    today: larder.today,
    stores: groups.slice(0, LETTER_LIMITS.larder).map((g) => ({ label: g.label, remainingGrams: g.remainingGrams, runsOut: g.runsOut })),
    moreStores: Math.max(0, groups.length - LETTER_LIMITS.larder),
    totalGrams: larder.totals.remainingGrams,
    firstEmptyMonth: groups.length > 0 ? (larder.emptyMonths[0] ?? null) : null,
  };
}

/** Everything one letter says, from the month's share report, the year's gaps and the larder. */
export function letterData(input: LetterInput): LetterData {
  const values = input.share.months.find((m) => m.month === input.month)?.values;
  const shareOf = (key: 'energy_kcal' | 'protein_g'): LetterShare => {
    const v = values?.[key];
    return v ? { shareOfIntake: v.shareOfIntake, shareOfNeed: v.shareOfNeed, uncertain: v.uncertain } : NO_SHARE;
  };
  const { state, gaps } = furthestFromNeed(input.share, input.month);
  const crops = input.share.topCrops
    .filter((c) => (c.values.energy_kcal ?? 0) > 0 || (c.values.protein_g ?? 0) > 0)
    .slice(0, LETTER_LIMITS.crops)
    .map((c) => ({ name: c.name, energyKcal: c.values.energy_kcal, proteinG: c.values.protein_g, shareOfHomeEnergy: c.shareOfHome.energy_kcal }));
  return {
    householdName: input.householdName,
    month: input.month,
    units: input.larder.units,
    energy: shareOf('energy_kcal'),
    protein: shareOf('protein_g'),
    gapState: state,
    gaps,
    crops,
    larder: larderPart(input.larder),
    suggestion: pickSuggestion(input.yearGaps),
    links: input.links,
  };
}
