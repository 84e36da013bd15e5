/**
 * The reference crop table (reference-data/crops.csv): for each common food crop, and for eggs and
 * honey, the yield a home grower can expect, when it is harvested, how long it keeps and how much
 * seed it takes, each row matched to the USDA SR28 food of its harvested form and naming its source.
 * The planner turns these rows into "nutrient per m²" and the gap finder into "what would carry food
 * into February". This module only reads and checks the CSV text (no files): every problem is
 * reported with its line and column, so a wrong edit to the table is caught before anything uses it.
 * Column meanings are in reference-data/README.md.
 */
import Papa from 'papaparse';
import { CROP_CATEGORIES, isCropCategory, type CropCategory } from './crop-categories';
import { edibleFactor } from './edible';
import { ENTRY_LIMITS } from './entry-schemas';
import { NUTRIENT_KEYS, type NutrientKey } from './nutrients';

/** Finer groups than the crop categories, as growers plan them. Example: `CROP_GROUPS.includes('brassica')` → true */
export const CROP_GROUPS = [
  'grain',
  'legume', // dry pulses
  'root', // roots, tubers
  'squash', // winter squash and pumpkins
  'brassica',
  'green', // salad and cooking greens
  'allium',
  'fruiting', // fruiting and green-pod vegetables: tomato, pepper, cucumber, summer squash, sweet corn, green beans, fresh peas
  'perennial_veg',
  'herb',
  'fruit', // tree, bush and vine fruit
  'nut_oilseed',
  'egg',
  'honey',
] as const;
export type CropGroup = (typeof CROP_GROUPS)[number];

/** What a yield is counted per: a square metre of ground per season, a laying hen or a hive per year. */
export const YIELD_BASES = ['m2', 'hen', 'hive'] as const;
export type YieldBasis = (typeof YIELD_BASES)[number];

export const SEASONS = ['cool', 'warm'] as const;
export type CropSeason = (typeof SEASONS)[number];

export const LIFE_CYCLES = ['annual', 'biennial', 'perennial'] as const;
export type LifeCycle = (typeof LIFE_CYCLES)[number];

/** Where `days_to_harvest` counts from: sowing seed, planting out a raised plant, or planting tubers, sets or cloves. */
export const DAYS_FROM = ['sowing', 'transplant', 'planting'] as const;
export type DaysFrom = (typeof DAYS_FROM)[number];

/** The frost date a harvest week counts from: the last spring frost or the first autumn frost. */
export const FROSTS = ['spring', 'autumn'] as const;
export type Frost = (typeof FROSTS)[number];

/** Seed by weight (seed, seed tubers, cloves, sets) or by count of raised plants, crowns, canes or trees. */
export const SEED_UNITS = ['g', 'plants'] as const;
export type SeedUnit = (typeof SEED_UNITS)[number];

/** The columns of crops.csv, in order. */
export const CROP_TABLE_COLUMNS = [
  'key',
  'name',
  'category',
  'crop_group',
  'sr28_code',
  'sr28_description',
  'edible_fraction',
  'yield_basis',
  'yield_low_kg_m2',
  'yield_typical_kg_m2',
  'yield_high_kg_m2',
  'days_to_harvest',
  'days_from',
  'season',
  'life',
  'years_to_first_crop',
  'harvest_from_frost',
  'harvest_from_weeks',
  'harvest_to_frost',
  'harvest_to_weeks',
  'storage_months',
  'default_spread_months',
  'seed_per_m2',
  'seed_unit',
  'winter_loss_fraction',
  'caution',
  'source',
  'notes',
] as const;
type Column = (typeof CROP_TABLE_COLUMNS)[number];

/** Source text that every row quoting field averages must carry. */
export const FIELD_STATISTICS_MARK = 'field statistics: gardens differ';

/** A week relative to a frost date; negative is before it. Example: `{ frost: 'autumn', weeks: -4 }` → four weeks before the first autumn frost */
export interface HarvestWeek {
  frost: Frost;
  weeks: number;
}

export type YieldLevel = 'low' | 'typical' | 'high';

/** One checked row of the crop table. Yields are kg per `yieldBasis` (per m² per season, or per hen or hive per year). */
export interface CropTableRow {
  key: string;
  name: string;
  category: CropCategory;
  group: CropGroup;
  sr28Code: string;
  sr28Description: string;
  /** The share of the harvested weight that is eaten, when SR28's refuse does not fit the harvested form; null = use SR28's refuse. */
  edibleFraction: number | null;
  yieldBasis: YieldBasis;
  yieldKg: Record<YieldLevel, number>;
  daysToHarvest: number | null;
  daysFrom: DaysFrom | null;
  season: CropSeason | null;
  life: LifeCycle | null;
  yearsToFirstCrop: number;
  harvestFrom: HarvestWeek;
  harvestTo: HarvestWeek;
  storageMonths: number;
  defaultSpreadMonths: number;
  seedPerM2: number | null;
  seedUnit: SeedUnit | null;
  winterLossFraction: number | null;
  caution: string | null;
  source: string;
  notes: string | null;
}

/** One problem in the table: `line` counts the header as line 1. */
export interface CropTableProblem {
  line: number;
  column: string | null;
  message: string;
}

/** Thrown by parseCropTable with every problem found, not only the first. */
export class CropTableError extends Error {
  readonly problems: readonly CropTableProblem[];
  constructor(problems: readonly CropTableProblem[]) {
    const shown = problems.slice(0, 5).map((p) => `line ${p.line}${p.column ? `, ${p.column}` : ''}: ${p.message}`);
    const more = problems.length > 5 ? ` (and ${problems.length - 5} more)` : '';
    super(`The crop table has ${problems.length} problem${problems.length === 1 ? '' : 's'}: ${shown.join(' ')}${more}`);
    this.name = 'CropTableError';
    this.problems = problems;
  }
}

const ANIMAL_BASIS: Partial<Record<CropGroup, YieldBasis>> = { egg: 'hen', honey: 'hive' };
const SLUG = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;
const DECIMAL = /^-?\d+(?:\.\d+)?$/;
const FIELD_STATS_HINT = /FAOSTAT|national (?:average|statistics)|field average/i;

function isOneOf<T extends string>(list: readonly T[], value: string): value is T {
  return (list as readonly string[]).includes(value);
}

/** Reads one data line; `problem` collects messages so every bad cell of the table is reported together. */
function readRow(cells: Record<string, string>, line: number, problems: CropTableProblem[]): CropTableRow | null {
  const before = problems.length;
  const problem = (column: Column | null, message: string) => problems.push({ line, column, message });
  const text = (column: Column): string => (cells[column] ?? '').trim();
  const optionalText = (column: Column): string | null => text(column) || null;

  const required = (column: Column, what: string): string => {
    const value = text(column);
    if (value === '') problem(column, `${what} is missing: fill in ${column}.`);
    return value;
  };
  const number = (column: Column, opts: { optional?: boolean; integer?: boolean; min?: number; max?: number; above?: number } = {}): number | null => {
    const raw = text(column);
    if (raw === '') {
      if (!opts.optional) problem(column, `${column} is missing: give a number.`);
      return null;
    }
    if (!DECIMAL.test(raw)) {
      problem(column, `"${raw}" is not a number: write it with digits and a decimal point, e.g. 2.5.`);
      return null;
    }
    const n = Number(raw);
    if (opts.integer && !Number.isInteger(n)) problem(column, `${raw} must be a whole number.`);
    else if (opts.above !== undefined && !(n > opts.above)) problem(column, `${raw} must be more than ${opts.above}.`);
    else if (opts.min !== undefined && n < opts.min) problem(column, `${raw} must be at least ${opts.min}.`);
    else if (opts.max !== undefined && n > opts.max) problem(column, `${raw} must be at most ${opts.max}.`);
    return n;
  };
  const choice = <T extends string>(column: Column, list: readonly T[], optional = false): T | null => {
    const raw = text(column);
    if (raw === '') {
      if (!optional) problem(column, `${column} is missing: use one of ${list.join(', ')}.`);
      return null;
    }
    if (!isOneOf(list, raw)) {
      problem(column, `"${raw}" is not a known ${column}: use one of ${list.join(', ')}.`);
      return null;
    }
    return raw;
  };

  const key = required('key', 'The key');
  if (key !== '' && !SLUG.test(key)) problem('key', `"${key}" is not a slug: use lower-case letters, digits and single hyphens, e.g. winter-squash.`);
  const name = required('name', 'The name');

  const categoryRaw = text('category');
  let category: CropCategory | null = null;
  if (categoryRaw === '') problem('category', `category is missing: use one of ${CROP_CATEGORIES.join(', ')}.`);
  else if (!isCropCategory(categoryRaw)) problem('category', `"${categoryRaw}" is not a crop category: use one of ${CROP_CATEGORIES.join(', ')}.`);
  else category = categoryRaw;
  const group = choice('crop_group', CROP_GROUPS);

  const sr28Code = required('sr28_code', 'The SR28 food code');
  if (sr28Code !== '' && !/^\d{5}$/.test(sr28Code)) problem('sr28_code', `"${sr28Code}" is not an SR28 NDB number: write its 5 digits, with leading zeros, e.g. 09003.`);
  const sr28Description = required('sr28_description', 'The SR28 description');
  const edibleFraction = number('edible_fraction', { optional: true, above: 0, max: 1 });

  const yieldBasis = choice('yield_basis', YIELD_BASES);
  if (group && yieldBasis) {
    const expected = ANIMAL_BASIS[group] ?? 'm2';
    if (yieldBasis !== expected) problem('yield_basis', `A ${group} row counts its yield per ${expected}, not per ${yieldBasis}.`);
  }
  const low = number('yield_low_kg_m2', { above: 0 });
  const typical = number('yield_typical_kg_m2', { above: 0 });
  const high = number('yield_high_kg_m2', { above: 0 });
  if (low !== null && typical !== null && high !== null && !(low <= typical && typical <= high)) {
    problem('yield_typical_kg_m2', `Yields must rise from low to typical to high, got ${low}, ${typical}, ${high}.`);
  }

  const isPlant = yieldBasis === 'm2';
  const daysToHarvest = number('days_to_harvest', { optional: true, integer: true, above: 0, max: 400 });
  const daysFrom = choice('days_from', DAYS_FROM, true);
  if ((daysToHarvest === null) !== (daysFrom === null)) {
    problem('days_from', 'days_to_harvest and days_from go together: give both (e.g. 70 and transplant) or neither.');
  }
  const season = choice('season', SEASONS, !isPlant);
  const life = choice('life', LIFE_CYCLES, !isPlant);
  if (isPlant && life !== 'perennial' && daysToHarvest === null) {
    problem('days_to_harvest', `An ${life ?? 'annual'} crop needs days_to_harvest: give the days from sowing or planting to the first harvest.`);
  }
  const yearsToFirstCrop = number('years_to_first_crop', { integer: true, min: 0, max: 15 });
  if (life !== null && life !== 'perennial' && yearsToFirstCrop !== null && yearsToFirstCrop !== 0) {
    problem('years_to_first_crop', `An ${life} crop is harvested in the season it is grown: years_to_first_crop must be 0.`);
  }

  const fromFrost = choice('harvest_from_frost', FROSTS);
  const fromWeeks = number('harvest_from_weeks', { integer: true, min: -52, max: 52 });
  const toFrost = choice('harvest_to_frost', FROSTS);
  const toWeeks = number('harvest_to_weeks', { integer: true, min: -52, max: 52 });
  if (fromFrost && toFrost && fromWeeks !== null && toWeeks !== null) {
    if (fromFrost === 'autumn' && toFrost === 'spring') {
      problem('harvest_to_frost', 'A harvest that starts from the autumn frost must end counted from it too: count weeks into winter after the autumn frost (e.g. autumn, 16).');
    } else if (fromFrost === toFrost && toWeeks < fromWeeks) {
      problem('harvest_to_weeks', `The harvest ends (week ${toWeeks}) before it starts (week ${fromWeeks}): swap them or fix one.`);
    }
  }

  const storageMonths = number('storage_months', { min: 0, max: 36 });
  const defaultSpreadMonths = number('default_spread_months', { integer: true, min: 1, max: ENTRY_LIMITS.maxSpreadMonths });
  if (storageMonths !== null && defaultSpreadMonths !== null && defaultSpreadMonths > Math.max(1, Math.ceil(storageMonths))) {
    problem('default_spread_months', `Food that keeps ${storageMonths} months cannot be eaten over ${defaultSpreadMonths}: lower default_spread_months or raise storage_months.`);
  }

  const seedPerM2 = number('seed_per_m2', { optional: true, above: 0 });
  const seedUnit = choice('seed_unit', SEED_UNITS, true);
  if ((seedPerM2 === null) !== (seedUnit === null)) problem('seed_unit', 'seed_per_m2 and seed_unit go together: give both (e.g. 250 and g) or neither.');
  if (isPlant && seedPerM2 === null) problem('seed_per_m2', 'A crop grown on ground needs a sowing rate: give seed_per_m2 and seed_unit.');
  if (!isPlant && seedPerM2 !== null) problem('seed_per_m2', 'An animal line has no sowing rate: leave seed_per_m2 and seed_unit empty.');
  const winterLossFraction = number('winter_loss_fraction', { optional: true, min: 0, max: 1 });

  const source = required('source', 'The source');
  if (FIELD_STATS_HINT.test(source) && !source.includes(FIELD_STATISTICS_MARK)) {
    problem('source', `A yield from field statistics must say so: add "${FIELD_STATISTICS_MARK}" to the source.`);
  }

  if (problems.length > before) return null;
  return {
    key,
    name,
    category: category!,
    group: group!,
    sr28Code,
    sr28Description,
    edibleFraction,
    yieldBasis: yieldBasis!,
    yieldKg: { low: low!, typical: typical!, high: high! },
    daysToHarvest,
    daysFrom,
    season,
    life,
    yearsToFirstCrop: yearsToFirstCrop!,
    harvestFrom: { frost: fromFrost!, weeks: fromWeeks! },
    harvestTo: { frost: toFrost!, weeks: toWeeks! },
    storageMonths: storageMonths!,
    defaultSpreadMonths: defaultSpreadMonths!,
    seedPerM2,
    seedUnit,
    winterLossFraction,
    caution: optionalText('caution'),
    source,
    notes: optionalText('notes'),
  };
}

/**
 * Parses and checks the text of crops.csv; throws a CropTableError listing every problem with its
 * line and column. Example: `parseCropTable(csvText).find((r) => r.key === 'potatoes')?.sr28Code` → '11352'
 */
export function parseCropTable(text: string): CropTableRow[] {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy' });
  const problems: CropTableProblem[] = [];
  // The header first: with a column missing there, every data line also has one field too many.
  const header = parsed.meta.fields ?? [];
  const missing = CROP_TABLE_COLUMNS.filter((c) => !header.includes(c));
  const unknown = header.filter((c) => !isOneOf(CROP_TABLE_COLUMNS, c));
  if (missing.length > 0) problems.push({ line: 1, column: null, message: `The header lacks ${missing.join(', ')}: add those columns.` });
  if (unknown.length > 0) problems.push({ line: 1, column: null, message: `The header has unknown columns ${unknown.join(', ')}: rename or remove them.` });
  for (const e of parsed.errors) {
    problems.push({
      line: (e.row ?? 0) + 2,
      column: null,
      message: `The CSV cannot be read here (${e.message}): check the quotes and commas of this line.`,
    });
  }
  if (problems.length > 0) throw new CropTableError(problems);

  const rows: CropTableRow[] = [];
  const lineOfKey = new Map<string, number>();
  parsed.data.forEach((cells, index) => {
    const line = index + 2;
    const row = readRow(cells, line, problems);
    if (!row) return;
    const seen = lineOfKey.get(row.key);
    if (seen !== undefined) {
      problems.push({ line, column: 'key', message: `The key "${row.key}" is already used on line ${seen}: give each crop its own key.` });
      return;
    }
    lineOfKey.set(row.key, line);
    rows.push(row);
  });
  if (rows.length === 0 && problems.length === 0) problems.push({ line: 2, column: null, message: 'The table has no crops: add at least one row.' });
  if (problems.length > 0) throw new CropTableError(problems);
  return rows;
}

/** The composition a crop's nutrients are worked out from: an SR28 food's refuse and amounts per 100 g edible portion. */
export interface CropFood {
  refusePct: number | null;
  per100g: Partial<Record<NutrientKey, number | null>>;
}

export interface YieldOptions {
  /** Which of the table's yields to use; 'typical' unless said. */
  level?: YieldLevel;
  /** A yield to use instead of the table's, e.g. the household's own measured kg per m². */
  yieldKg?: number;
}

/**
 * Nutrients per yield unit (per m², hen or hive): yield kg × edible fraction × amount per 100 g × 10
 * (10 hundred-gram portions in a kilogram). The edible fraction is the row's own when it has one, else
 * 1 − refuse/100. A nutrient the food has no amount for stays null (unknown, never zero).
 * Example: for potatoes (3 kg/m², 25 % refuse, 77 kcal/100 g) → energy_kcal 3 × 0.75 × 77 × 10 = 1732.5
 */
export function nutrientPerYieldUnit(row: CropTableRow, food: CropFood, options: YieldOptions = {}): Record<NutrientKey, number | null> {
  const kg = options.yieldKg ?? row.yieldKg[options.level ?? 'typical'];
  if (!Number.isFinite(kg) || kg < 0) {
    throw new Error(`The yield for ${row.name} must be zero or more kg, got ${String(kg)}.`);
  }
  const edible = edibleFactor({ refusePercent: food.refusePct, edibleFraction: row.edibleFraction });
  const out = {} as Record<NutrientKey, number | null>;
  for (const key of NUTRIENT_KEYS) {
    const amount = food.per100g[key];
    out[key] = amount == null ? null : kg * edible * amount * 10;
  }
  return out;
}

/**
 * Nutrients per m² of bed for a crop grown on ground (see nutrientPerYieldUnit); refuses the animal
 * lines, whose yield is per hen or hive. Example: `nutrientPerM2(potatoes, sr28Potatoes).protein_g` → 3 × 0.75 × 2.05 × 10 = 46.125
 */
export function nutrientPerM2(row: CropTableRow, food: CropFood, options: YieldOptions = {}): Record<NutrientKey, number | null> {
  if (row.yieldBasis !== 'm2') {
    throw new Error(`${row.name} yields per ${row.yieldBasis}, not per m²: use nutrientPerYieldUnit for animal lines.`);
  }
  return nutrientPerYieldUnit(row, food, options);
}
