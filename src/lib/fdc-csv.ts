/**
 * USDA FoodData Central (FDC) CSV downloads — "SR Legacy" and "Foundation Foods" — read row by row
 * into Selfsown's foods, nutrient amounts and household measures, every bad row named by file, line
 * and column. The reader is fed one parsed row at a time (the server streams each uploaded file
 * through papaparse), so a large food_nutrient.csv is never held as text.
 *
 * Files, as FDC's download documentation lays them out (column names are matched by header):
 *   required  nutrient.csv       id, name, unit_name, nutrient_nbr
 *             food.csv           fdc_id, data_type, description, food_category_id
 *             food_nutrient.csv  fdc_id, nutrient_id, amount
 *   optional  food_category.csv  id, description              → the food's group
 *             sr_legacy_food.csv fdc_id, NDB_number            → SR Legacy foods keep their NDB number as code
 *             measure_unit.csv   id, name                     → unit names for food_portion.csv
 *             food_portion.csv   fdc_id, amount, measure_unit_id, portion_description, modifier, gram_weight
 * Only foods of data_type sr_legacy_food or foundation_food are loaded (a Foundation download also
 * holds its samples and sub-samples, which are skipped with their amounts). FDC gives no refuse
 * percentage in these files: refuse stays unknown (null).
 */
import type { NutrientKey } from './nutrients';
import { rawnessRank } from './food-rows';

import type { FdcFormat } from './dataset-jobs';

export type { FdcFormat };

export const FDC_REQUIRED_FILES = ['nutrient.csv', 'food.csv', 'food_nutrient.csv'] as const;
export const FDC_OPTIONAL_FILES = ['food_category.csv', 'sr_legacy_food.csv', 'measure_unit.csv', 'food_portion.csv'] as const;
export type FdcFile = (typeof FDC_REQUIRED_FILES)[number] | (typeof FDC_OPTIONAL_FILES)[number];
/** The order files must be read in: each one's look-ups come from the files before it. */
export const FDC_FILE_ORDER: readonly FdcFile[] = ['nutrient.csv', 'food_category.csv', 'sr_legacy_food.csv', 'measure_unit.csv', 'food.csv', 'food_nutrient.csv', 'food_portion.csv'];

/** The columns each file must have (others are ignored). */
export const FDC_COLUMNS: Record<FdcFile, readonly string[]> = {
  'nutrient.csv': ['id', 'name', 'unit_name', 'nutrient_nbr'],
  'food.csv': ['fdc_id', 'data_type', 'description', 'food_category_id'],
  'food_nutrient.csv': ['fdc_id', 'nutrient_id', 'amount'],
  'food_category.csv': ['id', 'description'],
  'sr_legacy_food.csv': ['fdc_id', 'NDB_number'],
  'measure_unit.csv': ['id', 'name'],
  'food_portion.csv': ['fdc_id', 'amount', 'measure_unit_id', 'portion_description', 'modifier', 'gram_weight'],
};

/**
 * FDC nutrient numbers (the SR "nutrient_nbr") for each key, best first, with the unit FDC gives.
 * Foundation Foods report energy as Atwater specific (958) or general (957) factors instead of 208,
 * and carbohydrate and sugars by summation (205.2, 269.3). From memory: FDC nutrient.csv / SR28 NUTR_DEF.
 */
const NUTRIENT_NUMBERS: { key: NutrientKey; nbrs: string[]; unit: string }[] = [
  { key: 'energy_kcal', nbrs: ['208', '958', '957'], unit: 'KCAL' },
  { key: 'protein_g', nbrs: ['203'], unit: 'G' },
  { key: 'fat_g', nbrs: ['204'], unit: 'G' },
  { key: 'carbohydrate_g', nbrs: ['205', '205.2'], unit: 'G' },
  { key: 'fiber_g', nbrs: ['291'], unit: 'G' },
  { key: 'sugars_g', nbrs: ['269', '269.3'], unit: 'G' },
  { key: 'saturated_fat_g', nbrs: ['606'], unit: 'G' },
  { key: 'monounsaturated_fat_g', nbrs: ['645'], unit: 'G' },
  { key: 'polyunsaturated_fat_g', nbrs: ['646'], unit: 'G' },
  { key: 'water_g', nbrs: ['255'], unit: 'G' },
  { key: 'calcium_mg', nbrs: ['301'], unit: 'MG' },
  { key: 'iron_mg', nbrs: ['303'], unit: 'MG' },
  { key: 'magnesium_mg', nbrs: ['304'], unit: 'MG' },
  { key: 'phosphorus_mg', nbrs: ['305'], unit: 'MG' },
  { key: 'potassium_mg', nbrs: ['306'], unit: 'MG' },
  { key: 'sodium_mg', nbrs: ['307'], unit: 'MG' },
  { key: 'zinc_mg', nbrs: ['309'], unit: 'MG' },
  { key: 'copper_mg', nbrs: ['312'], unit: 'MG' },
  { key: 'manganese_mg', nbrs: ['315'], unit: 'MG' },
  { key: 'selenium_ug', nbrs: ['317'], unit: 'UG' },
  { key: 'vitamin_c_mg', nbrs: ['401'], unit: 'MG' },
  { key: 'thiamin_mg', nbrs: ['404'], unit: 'MG' },
  { key: 'riboflavin_mg', nbrs: ['405'], unit: 'MG' },
  { key: 'niacin_mg', nbrs: ['406'], unit: 'MG' },
  { key: 'pantothenic_acid_mg', nbrs: ['410'], unit: 'MG' },
  { key: 'vitamin_b6_mg', nbrs: ['415'], unit: 'MG' },
  { key: 'folate_dfe_ug', nbrs: ['435'], unit: 'UG' },
  { key: 'choline_mg', nbrs: ['421'], unit: 'MG' },
  { key: 'vitamin_b12_ug', nbrs: ['418'], unit: 'UG' },
  { key: 'vitamin_a_rae_ug', nbrs: ['320'], unit: 'UG' },
  { key: 'vitamin_e_mg', nbrs: ['323'], unit: 'MG' },
  { key: 'vitamin_d_ug', nbrs: ['328'], unit: 'UG' },
  { key: 'vitamin_k_ug', nbrs: ['430'], unit: 'UG' },
  { key: 'cholesterol_mg', nbrs: ['601'], unit: 'MG' },
];
const BY_NUMBER = new Map(NUTRIENT_NUMBERS.flatMap((n) => n.nbrs.map((nbr, rank) => [nbr, { key: n.key, unit: n.unit, rank }] as const)));

const KEPT_TYPES: Record<string, FdcFormat> = { sr_legacy_food: 'sr_legacy', foundation_food: 'foundation' };
const MAX_ERRORS = 100;
const MAX_PORTIONS = 100;

/** A rejected row: file, line in the file (the header is line 1), column, and what is wrong. */
export interface FdcRowError {
  file: string;
  line: number;
  column: string;
  message: string;
}

export interface FdcFood {
  code: string;
  fdcId: string;
  name: string;
  group: string;
  rawness: number;
  weights: { description: string; grams: number }[];
}

export interface FdcResult {
  format: FdcFormat | null;
  foods: FdcFood[];
  amounts: { code: string; key: NutrientKey; amount: number }[];
  errors: FdcRowError[];
  /** Rows past the first 100 errors, counted but not listed. */
  moreErrors: number;
  /** Foods of other data types (samples, sub-samples) left out, with their amounts. */
  skippedFoods: number;
}

/**
 * Reads FDC rows file by file: `start(file, headers)`, then `row(file, line, values)` for each row,
 * then `finish()`. Files come in FDC_FILE_ORDER. Example: see tests/unit/fdc-csv.test.ts.
 */
export class FdcReader {
  private errors: FdcRowError[] = [];
  private moreErrors = 0;
  private nutrients = new Map<string, { key: NutrientKey; rank: number }>();
  private categories = new Map<string, string>();
  private ndbByFdc = new Map<string, string>();
  private units = new Map<string, string>();
  private foods = new Map<string, FdcFood>();
  private skipped = new Set<string>();
  private codes = new Set<string>();
  private format: FdcFormat | null = null;
  private amounts = new Map<string, Map<NutrientKey, { rank: number; amount: number }>>();

  private fail(file: string, line: number, column: string, message: string): void {
    if (this.errors.length < MAX_ERRORS) this.errors.push({ file, line, column, message });
    else this.moreErrors++;
  }

  /** Checks a file's header; false (with an error on line 1) when a needed column is missing. */
  start(file: FdcFile, headers: readonly string[]): boolean {
    const missing = FDC_COLUMNS[file].filter((c) => !headers.includes(c));
    for (const c of missing) this.fail(file, 1, c, `The column "${c}" is missing; ${file} needs ${FDC_COLUMNS[file].join(', ')}.`);
    return missing.length === 0;
  }

  row(file: FdcFile, line: number, r: Record<string, string | undefined>): void {
    const v = (c: string) => (r[c] ?? '').trim();
    switch (file) {
      case 'nutrient.csv': {
        const known = BY_NUMBER.get(v('nutrient_nbr'));
        if (!known) return;
        const def = NUTRIENT_NUMBERS.find((n) => n.key === known.key)!;
        if (v('unit_name').toUpperCase() !== def.unit) {
          this.fail(file, line, 'unit_name', `Nutrient ${v('nutrient_nbr')} (${v('name')}) should be in ${def.unit}, not "${v('unit_name')}".`);
          return;
        }
        this.nutrients.set(v('id'), { key: known.key, rank: known.rank });
        return;
      }
      case 'food_category.csv':
        this.categories.set(v('id'), v('description'));
        return;
      case 'sr_legacy_food.csv':
        if (!/^\d{1,10}$/.test(v('NDB_number'))) this.fail(file, line, 'NDB_number', `"${v('NDB_number')}" is not an NDB number.`);
        else this.ndbByFdc.set(v('fdc_id'), v('NDB_number'));
        return;
      case 'measure_unit.csv':
        this.units.set(v('id'), v('name'));
        return;
      case 'food.csv':
        return this.foodRow(line, v);
      case 'food_nutrient.csv':
        return this.amountRow(line, v);
      case 'food_portion.csv':
        return this.portionRow(line, v);
    }
  }

  private foodRow(line: number, v: (c: string) => string): void {
    const file = 'food.csv';
    const fdcId = v('fdc_id');
    if (!/^\d{1,10}$/.test(fdcId)) return this.fail(file, line, 'fdc_id', `"${fdcId}" is not an FDC id (digits).`);
    if (this.foods.has(fdcId) || this.skipped.has(fdcId)) return this.fail(file, line, 'fdc_id', `FDC id ${fdcId} is listed twice.`);
    const format = KEPT_TYPES[v('data_type')];
    if (!format) {
      this.skipped.add(fdcId);
      return;
    }
    if (this.format && this.format !== format) {
      return this.fail(file, line, 'data_type', `"${v('data_type')}" mixed with ${this.format} foods: upload one format at a time.`);
    }
    this.format = format;
    const name = v('description');
    if (!name) return this.fail(file, line, 'description', 'The food has no description.');
    if (name.length > 255) return this.fail(file, line, 'description', 'The description is longer than 255 characters.');
    const code = format === 'sr_legacy' ? (this.ndbByFdc.get(fdcId) ?? fdcId) : fdcId;
    if (this.codes.has(code)) return this.fail(file, line, 'fdc_id', `Code ${code} is used by two foods.`);
    this.codes.add(code);
    const group = (this.categories.get(v('food_category_id')) ?? '').slice(0, 80) || 'FoodData Central';
    this.foods.set(fdcId, { code, fdcId, name, group, rawness: rawnessRank(name, group), weights: [] });
  }

  private amountRow(line: number, v: (c: string) => string): void {
    const file = 'food_nutrient.csv';
    const fdcId = v('fdc_id');
    if (this.skipped.has(fdcId)) return;
    const food = this.foods.get(fdcId);
    if (!food) return this.fail(file, line, 'fdc_id', `No food with FDC id "${fdcId}" in food.csv.`);
    const nutrient = this.nutrients.get(v('nutrient_id'));
    if (!nutrient) return; // a nutrient Selfsown does not use
    const text = v('amount');
    if (text === '') return; // not reported: unknown, never 0
    const amount = Number(text);
    if (!Number.isFinite(amount) || amount < 0) return this.fail(file, line, 'amount', `"${text}" is not an amount of 0 or more.`);
    let perFood = this.amounts.get(food.code);
    if (!perFood) this.amounts.set(food.code, (perFood = new Map()));
    const had = perFood.get(nutrient.key);
    if (!had || nutrient.rank < had.rank) perFood.set(nutrient.key, { rank: nutrient.rank, amount });
  }

  private portionRow(line: number, v: (c: string) => string): void {
    const file = 'food_portion.csv';
    const fdcId = v('fdc_id');
    if (this.skipped.has(fdcId)) return;
    const food = this.foods.get(fdcId);
    if (!food) return this.fail(file, line, 'fdc_id', `No food with FDC id "${fdcId}" in food.csv.`);
    const grams = Number(v('gram_weight'));
    if (v('gram_weight') === '' || !Number.isFinite(grams) || grams <= 0) return this.fail(file, line, 'gram_weight', `"${v('gram_weight')}" is not a weight above 0 g.`);
    const unitId = v('measure_unit_id');
    // 9999 is FDC's "undetermined" unit: the modifier alone says what the portion is.
    const unit = unitId === '9999' ? '' : (this.units.get(unitId) ?? '');
    const description = (v('portion_description') || [v('amount'), unit, v('modifier')].filter(Boolean).join(' ')).slice(0, 200);
    if (!description) return this.fail(file, line, 'portion_description', 'The portion has no description, unit or modifier.');
    if (food.weights.length < MAX_PORTIONS) food.weights.push({ description, grams });
  }

  finish(): FdcResult {
    if (this.foods.size === 0 && this.errors.length === 0) {
      this.fail('food.csv', 1, 'data_type', 'No food of data_type sr_legacy_food or foundation_food: is this an SR Legacy or Foundation Foods download?');
    }
    if (this.nutrients.size === 0 && this.errors.length === 0) {
      this.fail('nutrient.csv', 1, 'nutrient_nbr', 'No nutrient Selfsown knows (energy 208, protein 203…): is this FDC nutrient.csv?');
    }
    const amounts = [...this.amounts].flatMap(([code, m]) => [...m].map(([key, a]) => ({ code, key, amount: a.amount })));
    return { format: this.format, foods: [...this.foods.values()], amounts, errors: this.errors, moreErrors: this.moreErrors, skippedFoods: this.skipped.size };
  }
}

/**
 * Reads whole files given as text (tests, small uploads) through the same FdcReader; a missing
 * required file is an error on its line 1. Example: readFdcTexts({ 'nutrient.csv': '…', … }, parse).
 */
export function readFdcTexts(
  texts: Partial<Record<FdcFile, string>>,
  parse: (text: string) => { headers: string[]; rows: Record<string, string>[] },
): FdcResult {
  const reader = new FdcReader();
  for (const file of FDC_FILE_ORDER) {
    const text = texts[file];
    if (text === undefined) {
      if ((FDC_REQUIRED_FILES as readonly string[]).includes(file)) reader.start(file, []);
      continue;
    }
    const { headers, rows } = parse(text);
    if (!reader.start(file, headers)) continue;
    rows.forEach((r, i) => reader.row(file, i + 2, r));
  }
  return reader.finish();
}
