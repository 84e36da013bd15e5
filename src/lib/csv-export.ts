/**
 * Writing the household's records as CSV. Harvests and bought food use exactly the columns the
 * importer reads (csv-import.ts), so an export re-imports to the same entries. Text that starts
 * with = + - @ gets an apostrophe in front so that spreadsheets show it instead of running it as a
 * formula; the importer takes the apostrophe off again.
 */
import Papa from 'papaparse';
import type { CropCategory } from './crop-categories';
import { FORMULA_START, HARVEST_CSV_COLUMNS, PURCHASE_CSV_COLUMNS, type CsvDelimiter } from './csv-import';
import type { HarvestInput, PurchaseInput, Use } from './entry-schemas';
import type { EntryUnit } from './entry-units';

export interface CsvExportOptions {
  /** ',' (default) writes decimal points; ';' writes decimal commas, for decimal-comma spreadsheets. */
  delimiter?: CsvDelimiter;
  /** Start with a UTF-8 byte-order mark so spreadsheet programs read accents right (default true). */
  bom?: boolean;
  /** Write the header line (default true); false for the later parts of a file written part by part. */
  header?: boolean;
}

type Cell = string | number | boolean | null | undefined;

/** Number as a cell: never in exponent form, decimal comma in a semicolon file. Example: `numberCell(1.5, ';')` → '1,5' */
export function numberCell(value: number | null | undefined, delimiter: CsvDelimiter = ','): string {
  if (value === null || value === undefined) return '';
  if (!Number.isFinite(value)) throw new Error(`Cannot write ${String(value)} as a number in a CSV file.`);
  let text = String(value);
  // String(1e-7) is "1e-7", which spreadsheets and the importer do not read as a plain number.
  if (/e/i.test(text)) text = value.toFixed(20).replace(/\.?0+$/, '');
  return delimiter === ';' ? text.replace('.', ',') : text;
}

function cellText(value: Cell, delimiter: CsvDelimiter): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return numberCell(value, delimiter);
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  return value;
}

/**
 * A CSV text from a header and rows of cells (CRLF after every line, quotes only where needed).
 * Example: `toCsv(['a', 'b'], [['x', 1.5]], { bom: false })` → 'a,b\r\nx,1.5\r\n'
 */
export function toCsv(columns: readonly string[], rows: readonly (readonly Cell[])[], options: CsvExportOptions = {}): string {
  const delimiter = options.delimiter ?? ',';
  const text = Papa.unparse(
    { fields: [...columns], data: rows.map((r) => r.map((c) => cellText(c, delimiter))) },
    { delimiter, newline: '\r\n', escapeFormulae: FORMULA_START, header: options.header ?? true },
  );
  // Every line, the last included, ends with CRLF (papaparse leaves the last one open unless no rows).
  const lines = text === '' ? '' : `${text.replace(/\r\n$/, '')}\r\n`;
  return (options.bom ?? true) ? `\uFEFF${lines}` : lines;
}

// ---------------------------------------------------------------------------------------------
// Harvests

/** One harvest as it is written: the crop by name (and variety) or the food by its dataset code. */
export interface HarvestCsvRecord {
  date: string;
  crop?: string;
  variety?: string;
  foodCode?: string;
  /** The food's dataset slug, so a code two datasets share re-imports as the same food. */
  foodDataset?: string;
  quantity: number;
  unit: EntryUnit;
  use: Use;
  spreadMonths?: number | null;
  /** How a preserved harvest was kept; empty otherwise. */
  preserveMethod?: string | null;
  trimmed: boolean;
  note?: string | null;
}

/** Names for the ids in an entry. */
export interface ExportLookups {
  crop(id: number): { name: string; variety?: string | null } | undefined;
  foodCode(id: number): string | undefined;
  /** The slug of the food's dataset (written in the dataset column). */
  foodDataset?(id: number): string | undefined;
}

const datasetOf = (lookups: Pick<ExportLookups, 'foodDataset'>, foodId: number) => {
  const slug = lookups.foodDataset?.(foodId);
  return slug === undefined ? {} : { foodDataset: slug };
};

/** A harvest entry as an export record, naming its crop or food. Example: `harvestRecord(entry, lookups).crop` → 'Potato' */
export function harvestRecord(entry: HarvestInput, lookups: ExportLookups): HarvestCsvRecord {
  const { cropId, foodId, ...rest } = entry;
  if (cropId !== undefined) {
    const crop = lookups.crop(cropId);
    if (!crop) throw new Error(`Harvest of ${entry.date} names crop ${cropId}, which was not found.`);
    return { ...rest, crop: crop.name, ...(crop.variety ? { variety: crop.variety } : {}) };
  }
  if (foodId !== undefined) {
    const foodCode = lookups.foodCode(foodId);
    if (foodCode === undefined) throw new Error(`Harvest of ${entry.date} names food ${foodId}, which was not found.`);
    return { ...rest, foodCode, ...datasetOf(lookups, foodId) };
  }
  throw new Error(`Harvest of ${entry.date} names neither a crop nor a food.`);
}

/** Harvests as CSV with the importer's columns. Example: `harvestsToCsv([record]).split('\r\n')[0]` → '\uFEFFdate,crop,variety,food_code,dataset,quantity,unit,use,spread_months,preserve_method,trimmed,note' */
export function harvestsToCsv(records: readonly HarvestCsvRecord[], options: CsvExportOptions = {}): string {
  const cells = (r: HarvestCsvRecord): Record<(typeof HARVEST_CSV_COLUMNS)[number], Cell> => ({
    date: r.date,
    crop: r.crop,
    variety: r.variety,
    food_code: r.foodCode,
    dataset: r.foodDataset,
    quantity: r.quantity,
    unit: r.unit,
    use: r.use,
    spread_months: r.spreadMonths,
    preserve_method: r.preserveMethod,
    trimmed: r.trimmed,
    note: r.note,
  });
  return toCsv(HARVEST_CSV_COLUMNS, records.map((r) => HARVEST_CSV_COLUMNS.map((c) => cells(r)[c])), options);
}

// ---------------------------------------------------------------------------------------------
// Bought food

/** One purchase as it is written: the food by its dataset code. */
export interface PurchaseCsvRecord {
  date: string;
  foodCode: string;
  foodDataset?: string;
  quantity: number;
  unit: EntryUnit;
  price?: number | null;
  currency?: string | null;
  spreadMonths: number;
  trimmed: boolean;
  note?: string | null;
}

/** A purchase entry as an export record. Example: `purchaseRecord(entry, lookups).foodCode` → '20081' */
export function purchaseRecord(entry: PurchaseInput, lookups: Pick<ExportLookups, 'foodCode' | 'foodDataset'>): PurchaseCsvRecord {
  const { foodId, ...rest } = entry;
  const foodCode = lookups.foodCode(foodId);
  if (foodCode === undefined) throw new Error(`Purchase of ${entry.date} names food ${foodId}, which was not found.`);
  return { ...rest, foodCode, ...datasetOf(lookups, foodId) };
}

/** Bought food as CSV with the importer's columns. Example: `purchasesToCsv([record], { delimiter: ';' })` */
export function purchasesToCsv(records: readonly PurchaseCsvRecord[], options: CsvExportOptions = {}): string {
  const cells = (r: PurchaseCsvRecord): Record<(typeof PURCHASE_CSV_COLUMNS)[number], Cell> => ({
    date: r.date,
    food_code: r.foodCode,
    dataset: r.foodDataset,
    quantity: r.quantity,
    unit: r.unit,
    price: r.price,
    currency: r.currency,
    spread_months: r.spreadMonths,
    trimmed: r.trimmed,
    note: r.note,
  });
  return toCsv(PURCHASE_CSV_COLUMNS, records.map((r) => PURCHASE_CSV_COLUMNS.map((c) => cells(r)[c])), options);
}

// ---------------------------------------------------------------------------------------------
// Crops and people (records to keep; not read back by the importer yet)

/** Columns of the crop list. Example: `CROP_CSV_COLUMNS[0]` → 'name' */
export const CROP_CSV_COLUMNS = [
  'name',
  'variety',
  'category',
  'food_code',
  'edible_fraction',
  'default_use',
  'default_spread_months',
  'not_food',
] as const;

export interface CropCsvRecord {
  name: string;
  variety?: string | null;
  category: CropCategory;
  foodCode?: string | null;
  edibleFraction?: number | null;
  defaultUse?: Use | null;
  defaultSpreadMonths?: number | null;
  notFood: boolean;
}

/** The household's crops as CSV. Example: `cropsToCsv([{ name: 'Potato', category: 'root_tuber', notFood: false }])` */
export function cropsToCsv(records: readonly CropCsvRecord[], options: CsvExportOptions = {}): string {
  return toCsv(
    CROP_CSV_COLUMNS,
    records.map((r) => [r.name, r.variety, r.category, r.foodCode, r.edibleFraction, r.defaultUse, r.defaultSpreadMonths, r.notFood]),
    options,
  );
}

/** Columns of the people list (who eats), as the people table holds them. Example: `PEOPLE_CSV_COLUMNS[1]` → 'sex' */
export const PEOPLE_CSV_COLUMNS = [
  'name',
  'sex',
  'age_years',
  'birth_year',
  'height_cm',
  'weight_kg',
  'activity',
  'condition',
  'kcal_per_day',
  'at_home_pct',
  'present_from',
  'present_to',
  'birth_month',
  'pregnancy_due_month',
  'lactation_from',
  'lactation_to',
  'fed_from_household',
  'diet',
] as const;

export interface PersonCsvRecord {
  name: string;
  sex?: string | null;
  ageYears?: number | null;
  birthYear?: number | null;
  heightCm?: number | null;
  weightKg?: number | null;
  activity?: string | null;
  condition?: string | null;
  kcalPerDay?: number | null;
  /** Share of meals eaten at home, 0–100. */
  atHomePct?: number | null;
  /** First and last day the person eats in the household (YYYY-MM-DD), when not always. */
  presentFrom?: string | null;
  presentTo?: string | null;
  /** Dated age, pregnancy and breastfeeding (YYYY-MM), when given. */
  birthMonth?: string | null;
  pregnancyDueMonth?: string | null;
  lactationFrom?: string | null;
  lactationTo?: string | null;
  /** A baby under 6 months fed from the household's food (not only breast milk). */
  fedFromHousehold?: boolean | null;
  diet?: string | null;
}

/** The household's people as CSV. Example: `peopleToCsv([{ name: 'Ana', sex: 'female' }])` */
export function peopleToCsv(records: readonly PersonCsvRecord[], options: CsvExportOptions = {}): string {
  return toCsv(
    PEOPLE_CSV_COLUMNS,
    records.map((r) => [
      r.name,
      r.sex,
      r.ageYears,
      r.birthYear,
      r.heightCm,
      r.weightKg,
      r.activity,
      r.condition,
      r.kcalPerDay,
      r.atHomePct,
      r.presentFrom,
      r.presentTo,
      r.birthMonth,
      r.pregnancyDueMonth,
      r.lactationFrom,
      r.lactationTo,
      r.fedFromHousehold,
      r.diet,
    ]),
    options,
  );
}
