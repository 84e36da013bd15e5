/**
 * Every unit an entry can be logged in: the four weights of units.ts, counts (eggs by the piece,
 * radishes by the bunch, lettuces by the head) and volumes (milk, oil, honey). Counts and volumes
 * become grams only through a named household weight (src/lib/count-volume.ts); the exact volume
 * definitions live here.
 */
import { countText } from './plural';
import { trimmedDecimal } from './format-number';
import { formatWeight, isWeightUnit, parseWeightUnit, WEIGHT_UNITS, type UnitSystem, type WeightUnit } from './units';

/** Things counted one by one. Example: `COUNT_UNITS.includes('head')` → true */
export const COUNT_UNITS = ['piece', 'bunch', 'head'] as const;
export type CountUnit = (typeof COUNT_UNITS)[number];

/** Volumes, US customary unless named imperial. Example: `VOLUME_UNITS[0]` → 'ml' */
export const VOLUME_UNITS = ['ml', 'l', 'cup', 'fl_oz', 'pint_us', 'pint_imp'] as const;
export type VolumeUnit = (typeof VOLUME_UNITS)[number];

/** Every unit an entry (harvest, purchase, staple) can carry; the API codes. */
export const ENTRY_UNITS = [...WEIGHT_UNITS, ...COUNT_UNITS, ...VOLUME_UNITS] as const;
export type EntryUnit = (typeof ENTRY_UNITS)[number];

/**
 * Millilitres in one of each volume unit, exact by definition.
 * US units: 1 US gallon = 231 in³ and 1 in = 2.54 cm (NIST Handbook 44, Appendix C), so
 * 1 fl oz = 1/128 gal = 29.5735295625 ml, 1 cup = 8 fl oz, 1 pint = 16 fl oz.
 * Imperial pint: 1 gallon = 4.54609 l (UK Weights and Measures Act 1985), 1 pint = 1/8 gallon.
 */
export const ML_PER_UNIT: Readonly<Record<VolumeUnit, number>> = {
  ml: 1,
  l: 1000,
  cup: 236.5882365,
  fl_oz: 29.5735295625,
  pint_us: 473.176473,
  pint_imp: 568.26125,
};

/** True for a count unit. Example: `isCountUnit('bunch')` → true */
export function isCountUnit(value: unknown): value is CountUnit {
  return typeof value === 'string' && (COUNT_UNITS as readonly string[]).includes(value);
}

/** True for a volume unit. Example: `isVolumeUnit('pint_imp')` → true */
export function isVolumeUnit(value: unknown): value is VolumeUnit {
  return typeof value === 'string' && (VOLUME_UNITS as readonly string[]).includes(value);
}

/** True for any entry unit. Example: `isEntryUnit('cup')` → true */
export function isEntryUnit(value: unknown): value is EntryUnit {
  return typeof value === 'string' && (ENTRY_UNITS as readonly string[]).includes(value);
}

/** True for a count or a volume unit (not a weight). Example: `isCountOrVolume('kg')` → false */
export function isCountOrVolume(value: unknown): value is CountUnit | VolumeUnit {
  return isCountUnit(value) || isVolumeUnit(value);
}

/** The three kinds of unit, in the order the unit pickers offer them. */
export const UNIT_GROUPS: readonly { label: string; units: readonly EntryUnit[] }[] = [
  { label: 'Weight', units: WEIGHT_UNITS },
  { label: 'Count', units: COUNT_UNITS },
  { label: 'Volume', units: VOLUME_UNITS },
];

/** Short names for the pickers. Example: `ENTRY_UNIT_NAMES.pint_imp` → 'imperial pints' */
export const ENTRY_UNIT_NAMES: Readonly<Record<EntryUnit, string>> = {
  g: 'g',
  kg: 'kg',
  oz: 'oz',
  lb: 'lb',
  piece: 'pieces',
  bunch: 'bunches',
  head: 'heads',
  ml: 'ml',
  l: 'l',
  cup: 'US cups',
  fl_oz: 'US fl oz',
  pint_us: 'US pints',
  pint_imp: 'imperial pints',
};

// Nouns a count of the unit is written with (plural.ts picks the number).
const NOUNS: Readonly<Record<CountUnit | 'cup' | 'pint_us' | 'pint_imp', [string, string]>> = {
  piece: ['piece', 'pieces'],
  bunch: ['bunch', 'bunches'],
  head: ['head', 'heads'],
  cup: ['US cup', 'US cups'],
  pint_us: ['US pint', 'US pints'],
  pint_imp: ['imperial pint', 'imperial pints'],
};

/**
 * A quantity in its unit as people read it: weights and metric volumes with their symbol, counts
 * and cups or pints with their noun in the right number.
 * Example: `entryQuantityText(12, 'piece')` → '12 pieces'; `entryQuantityText(1.5, 'kg')` → '1.5 kg'; `entryQuantityText(1, 'pint_imp')` → '1 imperial pint'
 */
export function entryQuantityText(quantity: number, unit: EntryUnit): string {
  if (unit in NOUNS) {
    const [one, many] = NOUNS[unit as keyof typeof NOUNS];
    return countText(Number(trimmedDecimal(quantity, 2)), one, many);
  }
  const decimals = unit === 'g' || unit === 'ml' ? 0 : 2;
  return `${trimmedDecimal(quantity, decimals)} ${unit === 'fl_oz' ? 'US fl oz' : unit}`;
}

/**
 * A count or volume as logged with the grams it stands for, in the household's system; a weight is
 * left to formatWeightPair. Example: `countedAmountText({ quantity: 12, unit: 'piece', grams: 600 }, 'metric')` → '12 pieces (600 g)'
 */
export function countedAmountText(entry: { quantity: number; unit: CountUnit | VolumeUnit; grams: number }, system: UnitSystem): string {
  return `${entryQuantityText(entry.quantity, entry.unit)} (${formatWeight(entry.grams, system)})`;
}

/** Which pint a bare "pint" or "pt" means when a file does not say: the household's own. */
export type PintMeaning = 'pint_us' | 'pint_imp';

// Spellings of counts and volumes found in spreadsheet logs (weights: units.ts). A bare "pint" is
// read with the household's meaning; "fl oz" and "cup" are the US units the API codes name.
const COUNT_VOLUME_ALIASES: Readonly<Record<string, CountUnit | VolumeUnit | 'pint'>> = {
  piece: 'piece', pieces: 'piece', pc: 'piece', pcs: 'piece', each: 'piece', ea: 'piece', count: 'piece', ct: 'piece', item: 'piece', items: 'piece',
  bunch: 'bunch', bunches: 'bunch', bn: 'bunch',
  head: 'head', heads: 'head', hd: 'head',
  ml: 'ml', millilitre: 'ml', millilitres: 'ml', milliliter: 'ml', milliliters: 'ml',
  l: 'l', litre: 'l', litres: 'l', liter: 'l', liters: 'l', ltr: 'l', lt: 'l',
  cup: 'cup', cups: 'cup', 'us cup': 'cup', 'us cups': 'cup',
  fl_oz: 'fl_oz', 'fl oz': 'fl_oz', 'fl. oz': 'fl_oz', floz: 'fl_oz', 'fluid ounce': 'fl_oz', 'fluid ounces': 'fl_oz', 'us fl oz': 'fl_oz',
  pint_us: 'pint_us', 'us pint': 'pint_us', 'us pints': 'pint_us', 'pint us': 'pint_us',
  pint_imp: 'pint_imp', 'imperial pint': 'pint_imp', 'imperial pints': 'pint_imp', 'imp pint': 'pint_imp', 'imp pints': 'pint_imp', 'uk pint': 'pint_imp', 'uk pints': 'pint_imp', 'pint imp': 'pint_imp',
  pint: 'pint', pints: 'pint', pt: 'pint', pts: 'pint',
};

/**
 * Reads a unit as people write it (case, spaces, plurals, common abbreviations), weights included.
 * A bare pint takes `pint` (the household's own), or is not read when none is given.
 * Example: `parseEntryUnit(' Pcs ')` → 'piece'; `parseEntryUnit('litre')` → 'l'; `parseEntryUnit('pt', 'pint_imp')` → 'pint_imp'
 */
export function parseEntryUnit(text: string, pint?: PintMeaning): EntryUnit | undefined {
  const weight = parseWeightUnit(text);
  if (weight) return weight;
  const key = text.trim().toLowerCase().replace(/\.$/, '').replace(/\s+/g, ' ');
  if (!Object.hasOwn(COUNT_VOLUME_ALIASES, key)) return undefined;
  const unit = COUNT_VOLUME_ALIASES[key]!;
  return unit === 'pint' ? pint : unit;
}

/** A weight unit, else `fallback`: the weight a count or volume is shown in. Example: `weightUnitOr('piece', 'kg')` → 'kg' */
export function weightUnitOr(unit: EntryUnit, fallback: WeightUnit): WeightUnit {
  return isWeightUnit(unit) ? unit : fallback;
}
