/**
 * Reading harvest logs and bought-food lists from spreadsheet CSV files. Pure: text in, checked rows
 * and numbered errors out. Each row is validated with the schemas in entry-schemas.ts; matching crop
 * names and food codes to records is done by the caller's lookups (resolveHarvestRows).
 *
 * The rules, in the words the import page can show:
 * - UTF-8 text, with or without a byte-order mark; at most 5 MB and 50,000 data rows.
 * - Comma or semicolon between cells, detected from the header row.
 * - A header row naming the columns, in any order and any case ("Spread months" = spread_months).
 *   Unknown columns are ignored and listed.
 * - Dates as YYYY-MM-DD.
 * - Numbers: in a semicolon file the decimal mark is a comma (1,5) and a point is read as a decimal
 *   point too (1.5), except "1.500", which could be 1500 or 1.5 and is refused. In a comma file the
 *   decimal mark is a point; a comma inside a number ("1,5" in quotes) could be a decimal comma or a
 *   thousands separator and is refused. Thousands separators and spaces inside numbers are refused.
 * - Yes/no cells: true/false, yes/no, 1/0 (any case); blank takes the default.
 * - Units: the API codes (g kg oz lb piece bunch head ml l cup fl_oz pint_us pint_imp) or common
 *   spellings (lbs, pcs, each, bunches, litre, cups, fl oz…); a bare "pint" or "pt" is the
 *   household's own pint (US for a household in US units, else imperial).
 * - A food by its dataset code (food_code); where two datasets share the code, the dataset column
 *   or a code written "slug:code" (ifct2017:F006) says which, else the household's dataset order.
 * - Row numbers are as a spreadsheet shows them: the header is row 1, the first data row is row 2,
 *   blank rows count, and a quoted note with line breaks is one row. Row 0 means the whole file.
 */
import Papa from 'papaparse';
import type { z } from 'zod';
import {
  cropUseError,
  harvestDetailsInput,
  harvestInput,
  purchaseDetailsInput,
  purchaseInput,
  type HarvestDetails,
  type HarvestInput,
  type PurchaseDetails,
  type PurchaseInput,
} from './entry-schemas';
import { parseEntryUnit, type PintMeaning } from './entry-units';
import { readFoodCodeRef, type FoodCodeRef } from './food-code-ref';

// ---------------------------------------------------------------------------------------------
// Format

/** Size limits for an uploaded file. Example: `CSV_LIMITS.maxRows` → 50000 */
export const CSV_LIMITS = { maxBytes: 5 * 1024 * 1024, maxRows: 50_000 } as const;

/** Columns of a harvest log, in the order an export writes them. Example: `HARVEST_CSV_COLUMNS[0]` → 'date' */
export const HARVEST_CSV_COLUMNS = [
  'date',
  'crop',
  'variety',
  'food_code',
  'dataset',
  'quantity',
  'unit',
  'use',
  'spread_months',
  'preserve_method',
  'trimmed',
  'note',
] as const;

/** Columns of a bought-food list, in export order. Example: `PURCHASE_CSV_COLUMNS[1]` → 'food_code' */
export const PURCHASE_CSV_COLUMNS = [
  'date',
  'food_code',
  'dataset',
  'quantity',
  'unit',
  'price',
  'currency',
  'spread_months',
  'trimmed',
  'note',
] as const;

export type HarvestCsvColumn = (typeof HARVEST_CSV_COLUMNS)[number];
export type PurchaseCsvColumn = (typeof PURCHASE_CSV_COLUMNS)[number];
export type CsvDelimiter = ',' | ';';

/** How a file's words are read beyond the file itself: a bare "pint" or "pt" is the household's pint (US or imperial). */
export interface CsvReadOptions {
  pint?: PintMeaning;
}

/** One problem: spreadsheet row (header = 1, 0 = whole file), the column if one, and what to fix. */
export interface CsvError {
  row: number;
  column?: string;
  message: string;
}

// Other header spellings found in hand-made logs.
const COLUMN_ALIASES: Readonly<Record<string, string>> = {
  crop_name: 'crop',
  code: 'food_code',
  ndb: 'food_code',
  ndb_no: 'food_code',
  food_dataset: 'dataset',
  dataset_slug: 'dataset',
  qty: 'quantity',
  weight: 'quantity',
  units: 'unit',
  spread: 'spread_months',
  months: 'spread_months',
  preserving_method: 'preserve_method',
  preserved_by: 'preserve_method',
  notes: 'note',
};

/** A header cell as a column key: trimmed, lower case, spaces and dashes as underscores. Example: `columnKey(' Spread Months ')` → 'spread_months' */
export function columnKey(header: string): string {
  const key = header.replace(/^\uFEFF/, '').trim().toLowerCase().replace(/[\s-]+/g, '_');
  return COLUMN_ALIASES[key] ?? key;
}

/** How crop names are compared: trimmed, inner spaces collapsed, case-folded. Example: `cropNameKey(' Red  Kuri ')` → 'red kuri' */
export function cropNameKey(name: string): string {
  return name.trim().replace(/\s+/g, ' ').toLocaleLowerCase();
}

/** The cell separator of a file, from its header row: ';' if it has more semicolons than commas. Example: `detectDelimiter('date;quantity;unit')` → ';' */
export function detectDelimiter(text: string): CsvDelimiter {
  const firstLine = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/, 1)[0] ?? '';
  const count = (ch: string) => firstLine.split(ch).length - 1;
  return count(';') > count(',') ? ';' : ',';
}

export type NumberCell = { ok: true; value: number } | { ok: false; message: string };

/**
 * Reads a number as written in a file with this delimiter (rules in the module comment).
 * Example: `parseCsvNumber('1,5', ';')` → { ok: true, value: 1.5 }; `parseCsvNumber('1,5', ',')` → { ok: false, … }
 */
export function parseCsvNumber(text: string, delimiter: CsvDelimiter): NumberCell {
  const s = text.trim();
  if (/\s/.test(s)) return { ok: false, message: `"${s}" has a space inside; write numbers without spaces or thousands separators.` };
  let normal = s;
  if (s.includes(',') && s.includes('.')) {
    return { ok: false, message: `"${s}" uses a thousands separator; write the number without one (for example ${delimiter === ';' ? '1234,5' : '1234.5'}).` };
  }
  if (s.includes(',')) {
    if (delimiter === ',') {
      return { ok: false, message: `"${s}" is ambiguous in a comma-separated file (decimal comma or thousands?); write decimals with a point, like 1.5, and no thousands separator.` };
    }
    if (s.split(',').length > 2) return { ok: false, message: `"${s}" is not a number; write decimals like 1,5 and no thousands separator.` };
    normal = s.replace(',', '.');
  } else if (delimiter === ';' && /^[+-]?[1-9]\d{0,2}(\.\d{3})+$/.test(s)) {
    // In a semicolon (decimal-comma) file "1.500" is most likely 1500 written with a thousands point.
    return { ok: false, message: `"${s}" could mean ${s.replace(/\./g, '')} or ${s.replace(/\.?0+$/, '')}; write decimals with a comma (1,5) and no thousands separator (1500).` };
  }
  if (!/^[+-]?(\d+(\.\d*)?|\.\d+)$/.test(normal)) return { ok: false, message: `"${s}" is not a number.` };
  return { ok: true, value: Number(normal) };
}

/** Reads a yes/no cell; undefined when blank or not one of true/false/yes/no/1/0. Example: `parseCsvBoolean('Yes')` → true */
export function parseCsvBoolean(text: string): boolean | undefined {
  const s = text.trim().toLowerCase();
  if (s === 'true' || s === 'yes' || s === '1') return true;
  if (s === 'false' || s === 'no' || s === '0') return false;
  return undefined;
}

// Exports put an apostrophe before text starting with = + - @ (so spreadsheets do not run it as a
// formula), and before text already starting with apostrophes and then one of those, so that
// "'=x" written by a person survives too; take one off again so an export re-imports as it was.
/** Text the export guards with one apostrophe (csv-export.ts uses it too). */
export const FORMULA_START = /^'*[=+\-@\t\r]/;

/** Text of a cell, trimmed, with the export's formula guard taken off. Example: `textCell("'=1+1")` → '=1+1' */
export function textCell(text: string): string {
  const s = text.trim();
  return s.startsWith("'") && FORMULA_START.test(s.slice(1)) ? s.slice(1) : s;
}

// ---------------------------------------------------------------------------------------------
// Reading the table

interface Table {
  delimiter: CsvDelimiter;
  /** Column key → index in a record. */
  columns: Map<string, number>;
  ignoredColumns: string[];
  /** Data records with their spreadsheet row numbers; blank rows left out. */
  records: { row: number; cells: string[] }[];
  errors: CsvError[];
}

function fileError(message: string, delimiter: CsvDelimiter = ','): Table {
  return { delimiter, columns: new Map(), ignoredColumns: [], records: [], errors: [{ row: 0, message }] };
}

function utf8Length(text: string): number {
  // Each UTF-16 unit is at most 3 UTF-8 bytes: skip the count for small texts.
  if (text.length * 3 <= CSV_LIMITS.maxBytes) return text.length;
  return new TextEncoder().encode(text).length;
}

/** Text of an upload: a string, or bytes that must be UTF-8. */
export type CsvSource = string | Uint8Array | ArrayBuffer;

function decode(source: CsvSource): { text: string } | { error: string } {
  if (typeof source === 'string') {
    if (utf8Length(source) > CSV_LIMITS.maxBytes) return { error: tooBig() };
    return { text: source };
  }
  const bytes = source instanceof Uint8Array ? source : new Uint8Array(source);
  if (bytes.byteLength > CSV_LIMITS.maxBytes) return { error: tooBig() };
  try {
    return { text: new TextDecoder('utf-8', { fatal: true }).decode(bytes) };
  } catch {
    return { error: 'The file is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8" and try again.' };
  }
}

function tooBig(): string {
  return `The file is larger than ${CSV_LIMITS.maxBytes / 1024 / 1024} MB; split it into smaller files.`;
}

function readTable(source: CsvSource, known: readonly string[], required: readonly string[]): Table {
  const decoded = decode(source);
  if ('error' in decoded) return fileError(decoded.error);
  const text = decoded.text.replace(/^\uFEFF/, '');
  if (text.includes('\u0000')) return fileError('This is not a CSV text file (it contains binary data).');
  if (text.trim() === '') return fileError('The file is empty.');
  const delimiter = detectDelimiter(text);

  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: false, quoteChar: '"' });
  const [header = [], ...data] = parsed.data;
  const errors: CsvError[] = [];
  const badRecords = new Set<number>();
  for (const e of parsed.errors) {
    const index = e.row ?? 0;
    badRecords.add(index);
    const message = e.code === 'MissingQuotes' ? 'A quoted cell is never closed (a " is missing); the rest of the file was read into it.' : `The row could not be read: ${e.message}.`;
    errors.push({ row: index + 1, message });
  }

  const columns = new Map<string, number>();
  const ignoredColumns: string[] = [];
  header.forEach((cell, index) => {
    if (cell.trim() === '') return;
    const key = columnKey(cell);
    if (columns.has(key)) errors.push({ row: 1, column: key, message: `The column "${key}" appears twice in the header.` });
    else if (known.includes(key)) columns.set(key, index);
    else ignoredColumns.push(cell.trim());
  });
  const missing = required.filter((c) => !columns.has(c));
  if (missing.length > 0) {
    errors.push({
      row: 1,
      message: `The header row is missing ${missing.map((c) => `"${c}"`).join(', ')}. The first row must name the columns: ${known.join(', ')}.`,
    });
  }
  if (errors.some((e) => e.row <= 1)) return { delimiter, columns, ignoredColumns, records: [], errors };

  const isBlank = (cells: string[]) => cells.every((c) => c.trim() === '');
  const dataRows = data.reduce((n, cells) => (isBlank(cells) ? n : n + 1), 0);
  if (dataRows > CSV_LIMITS.maxRows) {
    return fileError(`The file has ${dataRows.toLocaleString('en')} data rows, more than the ${CSV_LIMITS.maxRows.toLocaleString('en')} one import takes; split it into smaller files.`, delimiter);
  }

  const records: Table['records'] = [];
  const width = Math.max(...columns.values()) + 1;
  const tooManyCells =
    delimiter === ','
      ? 'This row has more cells than the header: a comma inside a note (or a decimal comma) needs the cell in double quotes.'
      : 'This row has more cells than the header: a semicolon inside a note needs the note in double quotes.';
  data.forEach((cells, i) => {
    const row = i + 2;
    if (badRecords.has(i + 1) || isBlank(cells)) return;
    if (cells.slice(header.length).some((c) => c.trim() !== '')) {
      errors.push({ row, message: tooManyCells });
      return;
    }
    records.push({ row, cells: cells.length >= width ? cells : [...cells, ...Array<string>(width - cells.length).fill('')] });
  });
  return { delimiter, columns, ignoredColumns, records, errors };
}

// ---------------------------------------------------------------------------------------------
// Rows → schema input

// Schema field → CSV column, to put each validation message on the column the user sees.
const COLUMN_OF_FIELD: Readonly<Record<string, string>> = {
  date: 'date',
  quantity: 'quantity',
  unit: 'unit',
  use: 'use',
  spreadMonths: 'spread_months',
  preserveMethod: 'preserve_method',
  trimmed: 'trimmed',
  note: 'note',
  price: 'price',
  currency: 'currency',
  cropId: 'crop',
  foodId: 'food_code',
};

class RowReader {
  readonly errors: CsvError[] = [];
  constructor(
    private readonly table: Table,
    private readonly record: { row: number; cells: string[] },
    private readonly options: CsvReadOptions = {},
  ) {}

  /** The raw cell, or undefined when the column is absent or the cell blank. */
  cell(column: string): string | undefined {
    const index = this.table.columns.get(column);
    if (index === undefined) return undefined;
    const value = this.record.cells[index] ?? '';
    return value.trim() === '' ? undefined : value;
  }

  fail(column: string, message: string): void {
    this.errors.push({ row: this.record.row, column, message });
  }

  number(column: string): number | undefined {
    const raw = this.cell(column);
    if (raw === undefined) return undefined;
    const result = parseCsvNumber(raw, this.table.delimiter);
    if (result.ok) return result.value;
    this.fail(column, result.message);
    return undefined;
  }

  boolean(column: string): boolean | undefined {
    const raw = this.cell(column);
    if (raw === undefined) return undefined;
    const value = parseCsvBoolean(raw);
    if (value === undefined) this.fail(column, `"${raw.trim()}" is not yes or no; write true/false, yes/no or 1/0.`);
    return value;
  }

  text(column: string): string | undefined {
    const raw = this.cell(column);
    return raw === undefined ? undefined : textCell(raw);
  }

  /** The row's food: food_code, with its dataset from the dataset column or a "slug:code" code; undefined when blank or wrong (noted). */
  food(): FoodCodeRef | undefined {
    const code = this.cell('food_code');
    if (code === undefined) return undefined;
    const read = readFoodCodeRef(code, this.cell('dataset'));
    if ('ref' in read) return read.ref;
    this.fail(read.column, read.message);
    return undefined;
  }

  /** Common entry fields, with the unit (weights, counts, volumes: units.ts, entry-units.ts) and use read leniently (case, plurals). */
  entryFields(): Record<string, unknown> {
    const unitText = this.cell('unit');
    const useText = this.cell('use');
    return {
      date: this.cell('date')?.trim(),
      quantity: this.number('quantity'),
      unit: unitText === undefined ? undefined : (parseEntryUnit(unitText, this.options.pint) ?? unitText.trim()),
      use: useText?.trim().toLowerCase(),
      spreadMonths: this.number('spread_months'),
      trimmed: this.boolean('trimmed'),
      note: this.text('note'),
    };
  }

  /** Validates with a schema; messages on columns that already failed to read are left out. */
  validate<S extends z.ZodType>(schema: S, raw: Record<string, unknown>): z.output<S> | undefined {
    const result = schema.safeParse(dropUndefined(raw));
    if (result.success) return this.errors.length === 0 ? result.data : undefined;
    addIssues(this.errors, this.record.row, result.error);
    return undefined;
  }
}

function dropUndefined(raw: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(raw).filter(([, v]) => v !== undefined));
}

/** Puts each schema issue of a row on the CSV column the user sees. */
export function addIssues(errors: CsvError[], row: number, error: z.ZodError): void {
  const failed = new Set(errors.filter((e) => e.row === row).map((e) => e.column));
  for (const issue of error.issues) {
    const field = issue.path[0];
    const column = field === undefined ? undefined : (COLUMN_OF_FIELD[String(field)] ?? String(field));
    if (column !== undefined && failed.has(column)) continue;
    failed.add(column);
    errors.push(column === undefined ? { row, message: issue.message } : { row, column, message: issue.message });
  }
}

/** Rows read from a file: checked rows, numbered errors, and what was detected. */
export interface CsvParseResult<Row> {
  rows: Row[];
  errors: CsvError[];
  delimiter: CsvDelimiter;
  /** Header cells that are not columns Selfsown reads (kept as written). */
  ignoredColumns: string[];
}

/** A checked harvest row; `crop` (with `variety`) or `foodCode` (with `foodDataset` when the row names one) is left for the caller to match. */
export interface ParsedHarvestRow {
  row: number;
  crop?: string;
  variety?: string;
  foodCode?: string;
  foodDataset?: string;
  entry: HarvestDetails;
}

/** A checked bought-food row; `foodCode` (and `foodDataset`) is left for the caller to match. */
export interface ParsedPurchaseRow {
  row: number;
  foodCode: string;
  foodDataset?: string;
  entry: PurchaseDetails;
}

/** Errors in row order. */
export function byRow(errors: CsvError[]): CsvError[] {
  return [...errors].sort((a, b) => a.row - b.row);
}

/**
 * Reads a harvest log: columns date, quantity, unit and crop (name, with optional variety) or
 * food_code; optional use (default fresh), spread_months, preserve_method (frozen, canned, dried or
 * fermented; only for use preserved), trimmed, note.
 * Example: `parseHarvestCsv('date;crop;quantity;unit\n2026-07-14;Potato;1,5;kg').rows[0]`
 *   → { row: 2, crop: 'Potato', entry: { date: '2026-07-14', quantity: 1.5, unit: 'kg', use: 'fresh', spreadMonths: 1, trimmed: false } }
 */
export function parseHarvestCsv(source: CsvSource, options: CsvReadOptions = {}): CsvParseResult<ParsedHarvestRow> {
  const table = readTable(source, HARVEST_CSV_COLUMNS, ['date', 'quantity', 'unit']);
  const errors = [...table.errors];
  if (table.records.length === 0 && errors.length === 0) errors.push({ row: 0, message: 'The file has a header but no data rows.' });
  if (errors.length === 0 && !table.columns.has('crop') && !table.columns.has('food_code')) {
    errors.push({ row: 1, message: 'The header row needs a "crop" column (or "food_code").' });
  }
  if (errors.some((e) => e.row <= 1)) return { rows: [], errors, delimiter: table.delimiter, ignoredColumns: table.ignoredColumns };

  const rows: ParsedHarvestRow[] = [];
  for (const record of table.records) {
    const reader = new RowReader(table, record, options);
    const crop = reader.text('crop');
    const variety = reader.text('variety');
    const foodCode = reader.cell('food_code')?.trim();
    if (crop === undefined && foodCode === undefined) reader.fail(table.columns.has('crop') ? 'crop' : 'food_code', 'Give the crop name (or a food_code).');
    if (crop !== undefined && foodCode !== undefined) reader.fail('food_code', 'Give either a crop or a food_code, not both.');
    if (foodCode === undefined && reader.cell('dataset') !== undefined) reader.fail('dataset', 'A dataset goes with a food_code; a crop names its food itself.');
    const food = crop === undefined ? reader.food() : undefined;
    if (variety !== undefined && crop === undefined) reader.fail('variety', 'A variety needs its crop name.');
    const method = reader.cell('preserve_method')?.trim().toLowerCase();
    const entry = reader.validate(harvestDetailsInput, { ...reader.entryFields(), preserveMethod: method });
    errors.push(...reader.errors);
    if (entry === undefined || reader.errors.length > 0) continue;
    rows.push({
      row: record.row,
      ...(crop !== undefined ? { crop } : {}),
      ...(variety !== undefined ? { variety } : {}),
      ...(food !== undefined ? { foodCode: food.code, ...(food.dataset !== undefined ? { foodDataset: food.dataset } : {}) } : {}),
      entry,
    });
  }
  return { rows, errors: byRow(errors), delimiter: table.delimiter, ignoredColumns: table.ignoredColumns };
}

/**
 * Reads a bought-food list: columns date, food_code, quantity, unit; optional price, currency,
 * spread_months (default 1), trimmed, note.
 * Example: `parsePurchaseCsv('date,food_code,quantity,unit\n2026-03-02,20081,25,kg').rows[0]?.foodCode` → '20081'
 */
export function parsePurchaseCsv(source: CsvSource, options: CsvReadOptions = {}): CsvParseResult<ParsedPurchaseRow> {
  const table = readTable(source, PURCHASE_CSV_COLUMNS, ['date', 'food_code', 'quantity', 'unit']);
  const errors = [...table.errors];
  if (table.records.length === 0 && errors.length === 0) errors.push({ row: 0, message: 'The file has a header but no data rows.' });
  if (errors.some((e) => e.row <= 1)) return { rows: [], errors, delimiter: table.delimiter, ignoredColumns: table.ignoredColumns };

  const rows: ParsedPurchaseRow[] = [];
  for (const record of table.records) {
    const reader = new RowReader(table, record, options);
    if (reader.cell('food_code') === undefined) reader.fail('food_code', 'Give the food_code of the reference food.');
    const food = reader.food();
    const fields = { ...reader.entryFields(), price: reader.number('price'), currency: reader.cell('currency')?.trim() };
    const entry = reader.validate(purchaseDetailsInput, fields);
    errors.push(...reader.errors);
    if (entry === undefined || food === undefined || reader.errors.length > 0) continue;
    rows.push({ row: record.row, foodCode: food.code, ...(food.dataset !== undefined ? { foodDataset: food.dataset } : {}), entry });
  }
  return { rows, errors: byRow(errors), delimiter: table.delimiter, ignoredColumns: table.ignoredColumns };
}
