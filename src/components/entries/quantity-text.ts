/** Reading what people type into a weight field, and writing weights back in the unit they used. */
import { entryQuantityText, type EntryUnit } from '@/lib/entry-units';
import { formatWeight, fromGrams, isWeightUnit, type UnitSystem } from '@/lib/units';

/**
 * Reads a typed number; a lone decimal comma counts as a point ("1,5" → 1.5), spaces are ignored.
 * Blank is undefined; anything else that is not a number is NaN (so the schema says so).
 * Example: `parseDecimal(' 2,25 ')` → 2.25
 */
export function parseDecimal(text: string): number | undefined {
  const t = text.trim().replace(/\s+/g, '');
  if (t === '') return undefined;
  const normal = /^-?\d*,\d+$/.test(t) ? t.replace(',', '.') : t;
  if (!/^-?(\d+\.?\d*|\.\d+)$/.test(normal)) return Number.NaN;
  return Number(normal);
}

/** A number with at most `decimals` decimals, trailing zeros dropped. Example: `trimNumber(1.50, 2)` → '1.5' */
export function trimNumber(value: number, decimals = 2): string {
  const s = value.toFixed(decimals);
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

/** A quantity with its unit. Example: `formatQuantity(1.2, 'kg')` → '1.2 kg'; `formatQuantity(12, 'piece')` → '12 pieces' */
export function formatQuantity(quantity: number, unit: EntryUnit): string {
  if (!isWeightUnit(unit)) return entryQuantityText(quantity, unit);
  return `${trimNumber(quantity, unit === 'g' ? 0 : 2)} ${unit}`;
}

/**
 * Grams written in the entry's unit when it is a weight, else as a weight of the household's system
 * (a count or volume has no grams of its own unit). Example: `formatInUnit(900, 'kg')` → '0.9 kg'; `formatInUnit(600, 'piece')` → '600 g'
 */
export function formatInUnit(grams: number, unit: EntryUnit, system: UnitSystem = 'metric'): string {
  if (!isWeightUnit(unit)) return formatWeight(grams, system);
  return formatQuantity(fromGrams(grams, unit), unit);
}
