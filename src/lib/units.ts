/**
 * Weight units a harvest or a purchase can be logged in, conversion to and from grams, and how a
 * weight is written back to the household in its unit system. Everything is stored in the entry's
 * own unit and converted to grams only when it is counted.
 */
import { trimmedDecimal } from './format-number';

/** Weight units an entry can be logged in. Example: `WEIGHT_UNITS.includes('lb')` → true */
export const WEIGHT_UNITS = ['g', 'kg', 'oz', 'lb'] as const;

export type WeightUnit = (typeof WEIGHT_UNITS)[number];

/** Unit systems a household can choose for display. Example: `UNIT_SYSTEMS[1]` → 'us' */
export const UNIT_SYSTEMS = ['metric', 'us'] as const;

export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

/** Grams in one of each unit. Example: `GRAMS_PER_UNIT.lb` → 453.59237 */
export const GRAMS_PER_UNIT: Readonly<Record<WeightUnit, number>> = {
  g: 1,
  kg: 1000,
  // 1 oz = 1/16 lb = 28.349523125 g exactly (International Yard and Pound Agreement, 1959)
  oz: 28.349523125,
  // 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959)
  lb: 453.59237,
};

/** Display names for the units. Example: `WEIGHT_UNIT_LABELS.oz` → 'ounces (oz)' */
export const WEIGHT_UNIT_LABELS: Readonly<Record<WeightUnit, string>> = {
  g: 'grams (g)',
  kg: 'kilograms (kg)',
  oz: 'ounces (oz)',
  lb: 'pounds (lb)',
};

/** The unit a new entry starts with in each system. Example: `DEFAULT_ENTRY_UNIT.us` → 'lb' */
export const DEFAULT_ENTRY_UNIT: Readonly<Record<UnitSystem, WeightUnit>> = { metric: 'kg', us: 'lb' };

/** True for one of the four weight units (exact, lower case). Example: `isWeightUnit('kg')` → true */
export function isWeightUnit(value: unknown): value is WeightUnit {
  return typeof value === 'string' && (WEIGHT_UNITS as readonly string[]).includes(value);
}

// Spellings found in old spreadsheet logs. 'gr' is left out on purpose: it is also the grain (64.8 mg).
const UNIT_ALIASES: Readonly<Record<string, WeightUnit>> = {
  g: 'g', gram: 'g', grams: 'g', gramme: 'g', grammes: 'g',
  kg: 'kg', kgs: 'kg', kilo: 'kg', kilos: 'kg', kilogram: 'kg', kilograms: 'kg', kilogramme: 'kg', kilogrammes: 'kg',
  oz: 'oz', ounce: 'oz', ounces: 'oz',
  lb: 'lb', lbs: 'lb', pound: 'lb', pounds: 'lb',
};

/** Reads a unit as people write it (case, spaces, plurals). Example: `parseWeightUnit(' Lbs ')` → 'lb' */
export function parseWeightUnit(text: string): WeightUnit | undefined {
  const key = text.trim().toLowerCase().replace(/\.$/, '');
  return Object.hasOwn(UNIT_ALIASES, key) ? UNIT_ALIASES[key] : undefined;
}

function gramsPer(unit: string): number {
  if (!isWeightUnit(unit)) {
    throw new Error(`Unknown weight unit "${unit}": use one of ${WEIGHT_UNITS.join(', ')}.`);
  }
  return GRAMS_PER_UNIT[unit];
}

function assertFinite(value: number, what: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new Error(`The ${what} must be a finite number, got ${String(value)}.`);
  }
}

/** Converts a quantity in a unit to grams. Example: `toGrams(2, 'lb')` → 907.18474 */
export function toGrams(quantity: number, unit: WeightUnit | string): number {
  const factor = gramsPer(unit);
  assertFinite(quantity, 'quantity');
  return quantity * factor;
}

/** Converts grams to a quantity in a unit. Example: `fromGrams(1500, 'kg')` → 1.5 */
export function fromGrams(grams: number, unit: WeightUnit | string): number {
  const factor = gramsPer(unit);
  assertFinite(grams, 'weight in grams');
  return grams / factor;
}

/**
 * Writes a weight for people, always with its unit. Metric: grams below 1 kg, else kilograms with up
 * to 2 decimals. US: ounces (1 decimal) below 1 lb, else decimal pounds with up to 2 decimals — one
 * number per weight reads faster on a phone than "2 lb 12.1 oz" and matches how entries are typed.
 * Example: `formatWeight(1250, 'metric')` → '1.25 kg'; `formatWeight(1250, 'us')` → '2.76 lb'
 */
export function formatWeight(grams: number, system: UnitSystem): string {
  assertFinite(grams, 'weight in grams');
  const sign = grams < 0 ? '-' : '';
  const abs = Math.abs(grams);
  if (system === 'metric') {
    // Decide on the rounded value so that 999.7 g is written "1 kg", not "1000 g".
    const roundedGrams = abs < 10 ? Number(abs.toFixed(1)) : Math.round(abs);
    if (roundedGrams < 1000) return `${sign}${trimmedDecimal(abs, abs < 10 ? 1 : 0)} g`;
    return `${sign}${trimmedDecimal(abs / 1000, 2)} kg`;
  }
  if (system === 'us') {
    const ounces = abs / GRAMS_PER_UNIT.oz;
    if (Number(ounces.toFixed(1)) < 16) return `${sign}${trimmedDecimal(ounces, 1)} oz`;
    return `${sign}${trimmedDecimal(abs / GRAMS_PER_UNIT.lb, 2)} lb`;
  }
  throw new Error(`Unknown unit system "${String(system)}": use metric or us.`);
}

/** The system a weight unit belongs to. Example: `unitSystemOf('oz')` → 'us' */
export function unitSystemOf(unit: WeightUnit): UnitSystem {
  return unit === 'oz' || unit === 'lb' ? 'us' : 'metric';
}

/** The units that belong to each system, smaller first. Example: `SYSTEM_UNITS.us` → ['oz', 'lb'] */
export const SYSTEM_UNITS: Readonly<Record<UnitSystem, readonly [WeightUnit, WeightUnit]>> = { metric: ['g', 'kg'], us: ['oz', 'lb'] };

// Decimals a weight is written with in each unit: grams whole, ounces to a tenth, kg and lb to a hundredth.
const DECIMALS: Readonly<Record<WeightUnit, number>> = { g: 0, oz: 1, kg: 2, lb: 2 };

/** Grams in a given unit, trailing zeros dropped. Example: `formatWeightIn(396, 'kg')` → '0.4 kg' */
export function formatWeightIn(grams: number, unit: WeightUnit): string {
  return `${trimmedDecimal(fromGrams(grams, unit), DECIMALS[unit])} ${unit}`;
}

/**
 * A weight and its edible portion in one unit of the household's system, so the pair reads at a
 * glance: the entry's own unit when it belongs to the system, else the unit formatWeight picks for
 * the larger figure. Example: `formatWeightPair(450, 396, 'metric', 'kg')` →
 * { weight: '0.45 kg', edible: '0.4 kg', unit: 'kg' }; `formatWeightPair(450, 396, 'metric')` → '450 g' and '396 g'.
 */
export function formatWeightPair(grams: number, edibleGrams: number, system: UnitSystem, entryUnit?: string): { weight: string; edible: string; unit: WeightUnit } {
  const [small, large] = SYSTEM_UNITS[system];
  // A count or volume (entry-units.ts) is no unit of the system: the pair takes the one that suits the figure.
  const unit = isWeightUnit(entryUnit) && SYSTEM_UNITS[system].includes(entryUnit) ? entryUnit : formatWeight(Math.max(grams, edibleGrams), system).endsWith(` ${large}`) ? large : small;
  return { weight: formatWeightIn(grams, unit), edible: formatWeightIn(edibleGrams, unit), unit };
}

/** The pair as one line, e.g. `weightPairText(450, 396, 'metric', 'kg')` → '0.45 kg · edible 0.4 kg'. */
export function weightPairText(grams: number, edibleGrams: number, system: UnitSystem, entryUnit?: string): string {
  const p = formatWeightPair(grams, edibleGrams, system, entryUnit);
  return `${p.weight} · edible ${p.edible}`;
}
