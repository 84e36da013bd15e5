/**
 * Counts and volumes become grams only through a named weight: eggs by the piece, radishes by the
 * bunch, milk by the litre. The weight comes from the grower's own crop (the weight of one, weighed
 * whole as harvested, so the food's refuse still comes off) or from the reference food's household
 * measures (SR28's Weight file: "1 large" egg = 50 g, "1 cup" of whole milk = 244 g). SR28 gives
 * those gram weights for the edible portion (SR28 documentation, Weight file), so an entry
 * converted from them is edible as logged, like one weighed trimmed. Every conversion says where its
 * weight came from; nothing is guessed.
 */
import { ML_PER_UNIT, isCountUnit, type CountUnit, type EntryUnit, type VolumeUnit } from './entry-units';
import { trimmedDecimal } from './format-number';
import { isWeightUnit, toGrams } from './units';

/** One household measure of a reference food, in the dataset's own order: "1 large" = 50 g. */
export interface HouseholdMeasure {
  description: string;
  grams: number;
}

/** A reference food as far as its household measures go. */
export interface MeasuredFood {
  /** The dataset's short name, e.g. 'USDA SR28' (datasetShortName). */
  dataset: string;
  code: string;
  name?: string;
  /** In the dataset's order (SR28: Seq). */
  measures: readonly HouseholdMeasure[];
}

/** What a count or volume can be weighed from: the crop's own weight of one and the reference food. */
export interface CountVolumeBasis {
  crop?: { name: string; countGrams: number | null } | null;
  food?: MeasuredFood | null;
}

/** Grams of one unit and where they come from. */
export interface UnitWeight {
  gramsPerUnit: number;
  /** 'crop': the grower's weight as harvested (refuse comes off); 'food': a dataset's edible-portion weight. */
  from: 'crop' | 'food';
  /** Names the weight exactly, e.g. 'USDA SR28 01123, 1 large = 50 g'; at most 200 characters. */
  source: string;
}

/** An entry's grams: worked out, or refused with what to do. */
export type EntryWeight =
  | { ok: true; grams: number; weightSource: string | null; edibleAsLogged: boolean }
  | { ok: false; message: string };

/** Longest weight_source the database keeps (varchar(200)). */
export const WEIGHT_SOURCE_MAX = 200;

/** A dataset's short name from its slug. Example: `datasetShortName('usda-sr28')` → 'USDA SR28' */
export function datasetShortName(slug: string): string {
  return slug.replace(/-/g, ' ').toUpperCase();
}

// Millilitres in the US measures SR28 names (a US dataset). 1 US gallon = 231 in³ (NIST Handbook 44,
// Appendix C): fl oz = 1/128 gal, cup = 8 fl oz, pint = 16, quart = 32, tablespoon = 1/2 fl oz,
// teaspoon = 1/6 fl oz. Ranked: the cup first (the measure SR28 gives most foods), then the others.
const MEASURE_VOLUMES: readonly { pattern: RegExp; ml: number; name: string }[] = [
  { pattern: /^cups?\b/, ml: ML_PER_UNIT.cup, name: '1 US cup' },
  { pattern: /^fl\.? ?oz\b/, ml: ML_PER_UNIT.fl_oz, name: '1 US fl oz' },
  { pattern: /^(quarts?|qt)\b/, ml: 4 * ML_PER_UNIT.cup, name: '1 US quart' },
  { pattern: /^(pints?|pt)\b/, ml: ML_PER_UNIT.pint_us, name: '1 US pint' },
  { pattern: /^(tbsp|tablespoons?)\b/, ml: ML_PER_UNIT.fl_oz / 2, name: '1 US tablespoon' },
  { pattern: /^(tsp|teaspoons?)\b/, ml: ML_PER_UNIT.fl_oz / 6, name: '1 US teaspoon' },
];

// First words of a measure that is not a count of whole things: volumes, weights, servings,
// containers, cut parts ("1 slice", "1 leaf", "1 half") and made portions ("1 pat", "1 bar"), and
// the other two counts (head, bunch).
const NOT_A_PIECE = new Set([
  'cup', 'cups', 'tbsp', 'tablespoon', 'tablespoons', 'tsp', 'teaspoon', 'teaspoons', 'fl', 'oz', 'lb', 'lbs', 'g', 'gram', 'grams', 'kg',
  'ml', 'l', 'liter', 'litre', 'quart', 'quarts', 'qt', 'pint', 'pints', 'pt', 'gallon', 'serving', 'servings', 'nlea', 'portion', 'order',
  'recipe', 'package', 'packet', 'container', 'can', 'jar', 'bottle', 'pouch', 'bag', 'box', 'scoop', 'slice', 'slices', 'leaf', 'leaves',
  'stalk', 'stalks', 'sprig', 'sprigs', 'spear', 'spears', 'strip', 'strips', 'wedge', 'wedges', 'ring', 'rings', 'floweret', 'flowerets',
  'inch', 'cubic', 'half', 'halves', 'skin', 'pat', 'envelope', 'bar', 'patty', 'puffs', 'fries', 'sheet', 'sheets', 'dash', 'pinch', 'drop',
  'stick', 'cube', 'cubes', 'head', 'heads', 'bunch', 'bunches',
]);

/** A measure read as "how many" and the words after it: "1 large (2-1/4" dia)" → 1, 'large (2-1/4" dia)'. */
function readMeasure(m: HouseholdMeasure): { amount: number; words: string } | null {
  const match = /^(\d+(?:\.\d+)?|\.\d+)\s+(.+)$/.exec(m.description.trim());
  if (!match || !(m.grams > 0)) return null;
  const amount = Number(match[1]);
  return amount > 0 ? { amount, words: match[2]!.trim() } : null;
}

function firstWord(words: string): string {
  return (/^[a-z]+/i.exec(words)?.[0] ?? '').toLowerCase();
}

/** Whether a measure counts whole things of the unit's kind: any count for piece, "head" or "bunch" named for those. */
function countsUnit(words: string, unit: CountUnit): boolean {
  if (unit === 'head') return /\bheads?\b/i.test(words);
  if (unit === 'bunch') return /\bbunch(es)?\b/i.test(words);
  const word = firstWord(words);
  return word !== '' && !NOT_A_PIECE.has(word);
}

const grams = (g: number) => `${trimmedDecimal(g, 2)} g`;

/** Shortens the variable part of a source so the whole stays within the database's 200 characters. */
function fit(make: (text: string) => string, text: string): string {
  const whole = make(text);
  if (whole.length <= WEIGHT_SOURCE_MAX) return whole;
  const room = Math.max(0, text.length - (whole.length - WEIGHT_SOURCE_MAX) - 1);
  return make(`${text.slice(0, room)}…`);
}

/**
 * The food's weight of one piece, head or bunch: the first of its measures, in the dataset's order,
 * that counts that kind of thing. Example: egg 01123 ["1 large" = 50 g] → 50 g per piece.
 */
export function foodCountWeight(food: MeasuredFood, unit: CountUnit): UnitWeight | null {
  for (const m of food.measures) {
    const read = readMeasure(m);
    if (!read || !countsUnit(read.words, unit)) continue;
    const each = m.grams / read.amount;
    const eachText = read.amount === 1 ? '' : ` (${grams(each)} each)`;
    return { gramsPerUnit: each, from: 'food', source: fit((d) => `${food.dataset} ${food.code}, ${d} = ${grams(m.grams)}${eachText}`, m.description) };
  }
  return null;
}

/**
 * The food's grams per millilitre from a volume measure, the cup preferred, written as a weight of
 * one unit. Example: whole milk 01077 ["1 cup" = 244 g] → 244 / 236.5882365 g per ml.
 */
export function foodVolumeWeight(food: MeasuredFood, unit: VolumeUnit): UnitWeight | null {
  let best: { rank: number; perMl: number; m: HouseholdMeasure; name: string } | null = null;
  for (const m of food.measures) {
    const read = readMeasure(m);
    if (!read) continue;
    const rank = MEASURE_VOLUMES.findIndex((v) => v.pattern.test(read.words.toLowerCase()));
    if (rank < 0 || (best && best.rank <= rank)) continue;
    best = { rank, perMl: m.grams / (read.amount * MEASURE_VOLUMES[rank]!.ml), m, name: MEASURE_VOLUMES[rank]!.name };
  }
  if (!best) return null;
  const { perMl, m, name } = best;
  const ml = trimmedDecimal(MEASURE_VOLUMES[best.rank]!.ml, 10);
  return {
    gramsPerUnit: perMl * ML_PER_UNIT[unit],
    from: 'food',
    source: fit((d) => `${food.dataset} ${food.code}, ${d} = ${grams(m.grams)}; ${name} = ${ml} ml`, m.description),
  };
}

/**
 * Grams of one count or volume unit, or null when nothing names one: for a count the crop's own
 * weight of one first, then the food's count measure; for a volume the food's volume measure.
 * Example: `unitWeight('bunch', { crop: { name: 'Radish', countGrams: 120 } }).source` → 'Your crop Radish: 1 bunch = 120 g'
 */
export function unitWeight(unit: CountUnit | VolumeUnit, basis: CountVolumeBasis): UnitWeight | null {
  if (isCountUnit(unit)) {
    const own = basis.crop?.countGrams;
    if (own != null && own > 0) {
      return { gramsPerUnit: own, from: 'crop', source: fit((n) => `Your crop ${n}: 1 ${unit} = ${grams(own)}`, basis.crop!.name) };
    }
    return basis.food ? foodCountWeight(basis.food, unit) : null;
  }
  return basis.food ? foodVolumeWeight(basis.food, unit) : null;
}

/** What to do when a count or volume has no weight: weigh it, or give the crop a weight of one. */
export function noWeightMessage(unit: CountUnit | VolumeUnit, basis: CountVolumeBasis): string {
  const what = basis.crop?.name ?? basis.food?.name ?? 'This food';
  const kind = isCountUnit(unit) ? `one ${unit}` : 'a volume';
  const source = basis.food ? `${basis.food.dataset} ${basis.food.code} has no household measure for ${kind}` : 'it has no reference food';
  if (isCountUnit(unit) && basis.crop) return `There is no weight for ${kind} of ${what} (${source}): weigh it, or set a weight of one on the crop.`;
  return `There is no weight for ${kind} of ${what} (${source}): weigh it and log the weight.`;
}

/**
 * Grams of an entry in any unit: a weight converts exactly; a count or volume through unitWeight,
 * with its source, or is refused with what to do.
 * Example: `entryWeight(12, 'piece', { food: egg })` → { ok: true, grams: 600, weightSource: 'USDA SR28 01123, 1 large = 50 g', edibleAsLogged: true }
 */
export function entryWeight(quantity: number, unit: EntryUnit, basis: CountVolumeBasis): EntryWeight {
  if (isWeightUnit(unit)) return { ok: true, grams: toGrams(quantity, unit), weightSource: null, edibleAsLogged: false };
  const w = unitWeight(unit, basis);
  if (!w) return { ok: false, message: noWeightMessage(unit, basis) };
  return { ok: true, grams: quantity * w.gramsPerUnit, weightSource: w.source, edibleAsLogged: w.from === 'food' };
}
