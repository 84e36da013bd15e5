/**
 * Importing old harvest logs and bought-food lists from CSV files: reading the upload (size- and
 * type-checked before it is parsed), matching crop names and food codes to this household's crops
 * and the reference foods, and writing every row in one transaction — or none, with each rejected
 * row named. The rules for the file itself live in src/lib/csv-import.ts.
 */
import type { CropCategory } from '@/lib/crop-categories';
import { asc, eq, inArray } from 'drizzle-orm';
import { z } from 'zod';
import { getDb } from '@/db/client';
import { datasets, foods, harvests, purchases, type Crop } from '@/db/schema';
import type { ImportAnswer, PreviewRow } from '@/lib/api-types';
import {
  CSV_LIMITS,
  parseHarvestCsv,
  parsePurchaseCsv,
  type CsvError,
} from '@/lib/csv-import';
import { resolveHarvestRows, resolvePurchaseRows } from '@/lib/csv-match';
import { pickFood } from '@/lib/food-code-ref';
import { type HarvestInput, type PurchaseInput } from '@/lib/entry-schemas';
import { cropInput, type CropInput } from '@/lib/crop-schemas';
import { isCountOrVolume, type PintMeaning } from '@/lib/entry-units';
import type { MeasuredFood } from '@/lib/count-volume';
import { cropKeyer } from './crop-keys';
import { cropDisplayName } from '@/lib/crop-name';
import { cropRows, insertCrop, newCropCategory } from './crops';
import { loadRows } from './bulk-load';
import { HttpError, readBodyBytes } from './http';
import { parseInput, type Executor, type Tx } from './entry-input';
import { cropBasis, foodBasis, harvestValues, type HarvestBasis } from './harvests';
import { adoptCurrency, purchaseValues } from './purchases';
import { measuredFoods, NoUnitWeight } from './unit-weights';


/** Rows shown in a preview answer; the counts and totals always cover the whole file. */
export const PREVIEW_ROW_LIMIT = 500;

/** Room for the multipart envelope and the small fields around the file. */
const FORM_OVERHEAD_BYTES = 256 * 1024;


export const importFields = z.object({
  kind: z.enum(['harvests', 'purchases'], { error: 'Say what the file holds: kind=harvests or kind=purchases.' }),
  mode: z.enum(['preview', 'commit'], { error: 'The mode must be preview or commit.' }).default('preview'),
  createCrops: z
    .array(cropInput, { error: 'createCrops must be a list of crops.' })
    .max(500, { error: 'At most 500 new crops in one import.' })
    .default([]),
});

export type ImportRequest = z.output<typeof importFields> & { file: Uint8Array; fileName: string };

/** The household an import writes to, as far as reading the file goes. */
export interface ImportHousehold {
  id: number;
  /** A bare "pint" in the file: US for a household in US units, else imperial. */
  pint: PintMeaning;
  /** The household's dataset slugs, first first: which food a code two datasets share means. */
  datasetOrder: readonly string[];
}

async function readLimited(request: Request, maxBytes: number): Promise<Uint8Array> {
  return readBodyBytes(request, maxBytes, () =>
    new HttpError(413, 'too_large', `The file is larger than ${CSV_LIMITS.maxBytes / 1024 / 1024} MB; split it into smaller files.`),
  );
}

// Files people pick by mistake, by their first bytes.
const NOT_CSV: { magic: number[]; message: string }[] = [
  { magic: [0x50, 0x4b, 0x03, 0x04], message: 'This is a spreadsheet workbook (xlsx or ods), not a CSV file. Save it as "CSV UTF-8" and upload that.' },
  { magic: [0xd0, 0xcf, 0x11, 0xe0], message: 'This is an old Excel workbook (xls), not a CSV file. Save it as "CSV UTF-8" and upload that.' },
  { magic: [0x25, 0x50, 0x44, 0x46], message: 'This is a PDF, not a CSV file.' },
];

const CSV_TYPES = new Set(['', 'text/csv', 'text/plain', 'application/csv', 'text/x-csv', 'application/vnd.ms-excel', 'application/octet-stream', 'text/comma-separated-values']);

function checkFile(file: File, bytes: Uint8Array): void {
  const fileError = (message: string, status = 400) => new HttpError(status, 'invalid_file', message, { file: message });
  for (const { magic, message } of NOT_CSV) {
    if (magic.every((b, i) => bytes[i] === b)) throw fileError(message, 415);
  }
  const type = file.type.split(';')[0]!.trim().toLowerCase();
  const name = file.name.toLowerCase();
  const csvName = /\.(csv|txt)$/.test(name);
  if (!CSV_TYPES.has(type) && !csvName) throw fileError(`A file of type ${type} cannot be imported; upload a .csv file.`, 415);
}

/**
 * Reads an import request (multipart/form-data: file, kind, mode, createCrops as JSON), refusing a
 * body over the size limit before reading it and a file that is not CSV text.
 */
export async function readImportRequest(request: Request): Promise<ImportRequest> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('multipart/form-data')) {
    throw new HttpError(415, 'unsupported_media_type', 'Send the file as multipart/form-data with the fields file, kind and mode.');
  }
  const body = await readLimited(request, CSV_LIMITS.maxBytes + FORM_OVERHEAD_BYTES);
  let form: FormData;
  try {
    form = await new Response(body as Uint8Array<ArrayBuffer>, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new HttpError(400, 'invalid_form', 'The upload could not be read as multipart/form-data.');
  }
  const file = form.get('file');
  if (!(file instanceof File)) throw new HttpError(400, 'invalid_input', 'file: Choose a CSV file to import.', { file: 'Choose a CSV file to import.' });
  if (file.size > CSV_LIMITS.maxBytes) {
    throw new HttpError(413, 'too_large', `The file is larger than ${CSV_LIMITS.maxBytes / 1024 / 1024} MB; split it into smaller files.`);
  }
  const bytes = new Uint8Array(await file.arrayBuffer());
  checkFile(file, bytes);

  let createCrops: unknown = [];
  const rawCrops = form.get('createCrops');
  if (typeof rawCrops === 'string' && rawCrops.trim() !== '') {
    try {
      createCrops = JSON.parse(rawCrops) as unknown;
    } catch {
      throw new HttpError(400, 'invalid_input', 'createCrops: This is not valid JSON.', { createCrops: 'This is not valid JSON.' });
    }
  }
  const text = (k: string) => {
    const v = form.get(k);
    return typeof v === 'string' && v.trim() !== '' ? v.trim() : undefined;
  };
  const fields = parseInput(importFields, { kind: text('kind'), mode: text('mode'), createCrops });
  return { ...fields, file: bytes, fileName: file.name };
}

// ---------------------------------------------------------------------------------------------

interface FoodRef {
  id: number;
  code: string;
  name: string;
  refusePct: number | null;
}

/** Reference foods by dataset code, each code with the foods of every dataset that has it. */
async function foodsByCodes(ex: Executor, codes: readonly string[]): Promise<FoodsByCode> {
  const found = new Map<string, (FoodRef & { dataset: string })[]>();
  const unique = [...new Set(codes)];
  for (let i = 0; i < unique.length; i += 1000) {
    const rows = await ex
      .select({ id: foods.id, code: foods.code, name: foods.name, refusePct: foods.refusePct, dataset: datasets.slug })
      .from(foods)
      .innerJoin(datasets, eq(datasets.id, foods.datasetId))
      .where(inArray(foods.code, unique.slice(i, i + 1000)))
      .orderBy(asc(foods.datasetId), asc(foods.id));
    for (const r of rows) found.set(r.code, [...(found.get(r.code) ?? []), r]);
  }
  return found;
}

type FoodsByCode = Map<string, (FoodRef & { dataset: string })[]>;

/** The food a row's code (and dataset, when it names one) means for this household (src/lib/food-code-ref.ts). */
function foodFinder(codes: FoodsByCode, household: ImportHousehold) {
  const byId = new Map([...codes.values()].flat().map((f) => [f.id, f]));
  return {
    foodByCode: (code: string, dataset?: string) => pickFood(codes.get(code) ?? [], { code, ...(dataset !== undefined ? { dataset } : {}) }, household.datasetOrder)?.id,
    byId,
  };
}

async function foodsByIds(ex: Executor, ids: readonly number[]): Promise<Map<number, FoodRef>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const rows = await ex
    .select({ id: foods.id, code: foods.code, name: foods.name, refusePct: foods.refusePct })
    .from(foods)
    .where(inArray(foods.id, unique));
  return new Map(rows.map((r) => [r.id, r]));
}


/** A crop as the importer sees it; new ones of a preview have stand-in ids above the INT range. */
type ImportCrop = Pick<Crop, 'id' | 'name' | 'variety' | 'foodId' | 'category' | 'edibleFraction' | 'defaultSpreadMonths' | 'notFood' | 'countGrams'>;

function cropFromInput(id: number, input: CropInput): ImportCrop {
  return {
    id,
    name: input.name,
    variety: input.variety ?? '',
    foodId: input.foodId ?? null,
    category: newCropCategory(input),
    edibleFraction: input.edibleFraction ?? null,
    defaultSpreadMonths: input.defaultSpreadMonths ?? null,
    notFood: input.notFood,
    countGrams: input.countGrams ?? null,
  };
}

/** The household measures of the foods the count and volume rows rest on (read only when the file has such rows). */
async function measuresFor(ex: Executor, rows: readonly { input: { unit: string } }[], foodOf: (row: { input: { unit: string } }) => number | null | undefined): Promise<Map<number, MeasuredFood>> {
  const ids = rows.flatMap((r) => {
    const id = isCountOrVolume(r.input.unit) ? foodOf(r) : undefined;
    return id == null ? [] : [id];
  });
  return measuredFoods(ex, ids);
}

/** The stored values of a row, or the row's problem when a count or volume has no weight. */
function weighRow<V>(row: number, errors: CsvError[], make: () => V): V | undefined {
  try {
    return make();
  } catch (e) {
    if (!(e instanceof NoUnitWeight)) throw e;
    errors.push({ row, column: 'unit', message: e.message });
    return undefined;
  }
}

const byRow = (errors: CsvError[]) => [...errors].sort((a, b) => a.row - b.row);

/** Thrown inside the commit transaction to roll it back and answer 422 with the rows to fix. */
class RowsRefused extends Error {
  constructor(readonly answer: ImportAnswer) {
    super('import refused');
  }
}

function refusedError(errors: CsvError[]): { code: string; message: string; fields: Record<string, string> } {
  const first = errors[0];
  const where = first ? (first.row === 0 ? '' : `Row ${first.row}${first.column ? `, ${first.column}` : ''}: `) : '';
  const more = errors.length - 1;
  return {
    code: 'invalid_rows',
    message: `Nothing was imported. ${where}${first?.message ?? 'The file could not be read.'}${more > 0 ? ` (and ${more} more problem${more === 1 ? '' : 's'})` : ''}`,
    fields: {},
  };
}

interface Prepared<V> {
  values: (V & { row: number })[];
  errors: CsvError[];
  /** Crops the file names that the household lacks, each with the kind its name suggests. */
  unknownCrops: { name: string; variety?: string; category: CropCategory }[];
  unknownFoodCodes: string[];
  ignoredColumns: string[];
  preview: PreviewRow[];
}

async function prepareHarvests(ex: Executor, req: ImportRequest, household: ImportHousehold, householdCrops: ImportCrop[], today: string): Promise<Prepared<ReturnType<typeof harvestValues>>> {
  const parsed = parseHarvestCsv(req.file, { pint: household.pint });
  const finder = foodFinder(await foodsByCodes(ex, parsed.rows.flatMap((r) => (r.foodCode === undefined ? [] : [r.foodCode]))), household);
  // Names match by the database's collation (crop-keys.ts), so the preview sees the crops the commit will.
  const cropKey = await cropKeyer(ex, [...householdCrops.flatMap((c) => [c.name, c.variety]), ...parsed.rows.flatMap((r) => [r.crop ?? '', r.variety ?? ''])]);
  const cropsByKey = new Map<string, ImportCrop>();
  for (const c of householdCrops) if (!cropsByKey.has(cropKey(c.name, c.variety))) cropsByKey.set(cropKey(c.name, c.variety), c);
  const cropsById = new Map(householdCrops.map((c) => [c.id, c]));
  const resolved = resolveHarvestRows(parsed.rows, {
    cropByName: (name, variety) => {
      const c = cropsByKey.get(cropKey(name, variety));
      return c === undefined ? undefined : { id: c.id, name: cropDisplayName(c.name, c.variety), notFood: c.notFood };
    },
    foodByCode: finder.foodByCode,
    cropKey,
  });
  const cropFoods = await foodsByIds(ex, householdCrops.flatMap((c) => (c.foodId === null ? [] : [c.foodId])));
  const foodsById = finder.byId;
  const measured = await measuresFor(ex, resolved.inputs, ({ input }) => {
    const i = input as HarvestInput;
    return i.cropId === undefined ? i.foodId : cropsById.get(i.cropId)?.foodId;
  });
  const unweighed: CsvError[] = [];
  const values: Prepared<ReturnType<typeof harvestValues>>['values'] = [];
  const preview: PreviewRow[] = [];
  // A harvest is weighed, so it cannot be dated after today in the household's zone (as the harvest API rules).
  const future: CsvError[] = resolved.inputs
    .filter(({ input }) => input.date > today)
    .map(({ row, input }) => ({ row, column: 'date', message: `The harvest date ${input.date} is after today (${today} in the household's time zone); enter the day it was picked.` }));
  for (const { row, input } of resolved.inputs) {
    const crop = input.cropId === undefined ? undefined : cropsById.get(input.cropId);
    const food = crop ? (crop.foodId === null ? undefined : cropFoods.get(crop.foodId)) : foodsById.get(input.foodId!);
    const basis: HarvestBasis = crop ? cropBasis(crop, food, measured.get(crop.foodId ?? 0)) : foodBasis(food!, measured.get(food!.id));
    const v = weighRow(row, unweighed, () => harvestValues(input as HarvestInput, basis));
    if (v === undefined) continue;
    values.push({ ...v, row });
    if (preview.length < PREVIEW_ROW_LIMIT) {
      preview.push({
        row,
        date: v.date,
        crop: crop ? cropDisplayName(crop.name, crop.variety) : null,
        foodCode: food?.code ?? null,
        foodName: food?.name ?? null,
        quantity: v.quantity,
        unit: v.unit,
        grams: v.grams,
        edibleGrams: v.edibleGrams,
        weightSource: v.weightSource,
        use: v.use,
        spreadMonths: v.spreadMonths,
        trimmed: v.trimmed,
        note: v.note,
      });
    }
  }
  return {
    values,
    preview,
    errors: byRow([...parsed.errors, ...resolved.errors, ...future, ...unweighed]),
    unknownCrops: resolved.unknownCrops.map((c) => ({ ...c, category: newCropCategory({ name: c.name }) })),
    unknownFoodCodes: resolved.unknownFoodCodes,
    ignoredColumns: parsed.ignoredColumns,
  };
}

async function preparePurchases(ex: Executor, req: ImportRequest, household: ImportHousehold): Promise<Prepared<ReturnType<typeof purchaseValues>>> {
  const parsed = parsePurchaseCsv(req.file, { pint: household.pint });
  const finder = foodFinder(await foodsByCodes(ex, parsed.rows.map((r) => r.foodCode)), household);
  const resolved = resolvePurchaseRows(parsed.rows, { foodByCode: finder.foodByCode });
  const foodsById = finder.byId;
  const measured = await measuresFor(ex, resolved.inputs, ({ input }) => (input as PurchaseInput).foodId);
  const unweighed: CsvError[] = [];
  const values: Prepared<ReturnType<typeof purchaseValues>>['values'] = [];
  const preview: PreviewRow[] = [];
  for (const { row, input } of resolved.inputs) {
    const food = foodsById.get(input.foodId)!;
    const v = weighRow(row, unweighed, () => purchaseValues(input as PurchaseInput, { refusePct: food.refusePct, measured: measured.get(food.id) ?? null }));
    if (v === undefined) continue;
    values.push({ ...v, row });
    if (preview.length < PREVIEW_ROW_LIMIT) {
      preview.push({
        row,
        date: v.date,
        crop: null,
        foodCode: food.code,
        foodName: food.name,
        quantity: v.quantity,
        unit: v.unit,
        grams: v.grams,
        edibleGrams: v.edibleGrams,
        weightSource: v.weightSource,
        spreadMonths: v.spreadMonths,
        trimmed: v.trimmed,
        note: v.note,
        price: v.price === null ? null : Number(v.price),
        currency: v.currency,
      });
    }
  }
  return {
    values,
    preview,
    errors: byRow([...parsed.errors, ...resolved.errors, ...unweighed]),
    unknownCrops: [],
    unknownFoodCodes: resolved.unknownFoodCodes,
    ignoredColumns: parsed.ignoredColumns,
  };
}

function answer<V extends { grams: number; edibleGrams: number }>(req: ImportRequest, p: Prepared<V>, status: number, extra: Partial<ImportAnswer['body']> = {}): ImportAnswer {
  const totals = p.values.reduce((t, v) => ({ grams: t.grams + v.grams, edibleGrams: t.edibleGrams + v.edibleGrams }), { grams: 0, edibleGrams: 0 });
  return {
    status,
    body: {
      ok: p.errors.length === 0,
      kind: req.kind,
      mode: req.mode,
      rows: p.preview,
      rowCount: p.values.length,
      totals,
      errors: p.errors,
      unknownCrops: p.unknownCrops,
      unknownFoodCodes: p.unknownFoodCodes,
      ignoredColumns: p.ignoredColumns,
      ...(p.errors.length > 0 ? { error: refusedError(p.errors) } : {}),
      ...extra,
    },
  };
}

/** Crops to create first, without those the household already has (same name and variety, by the database's collation). */
async function newCrops(ex: Executor, existing: ImportCrop[], wanted: CropInput[]): Promise<CropInput[]> {
  if (wanted.length === 0) return [];
  const cropKey = await cropKeyer(ex, [...existing, ...wanted].flatMap((c) => [c.name, c.variety ?? '']));
  const seen = new Set(existing.map((c) => cropKey(c.name, c.variety)));
  const out: CropInput[] = [];
  for (const c of wanted) {
    const key = cropKey(c.name, c.variety);
    if (seen.has(key)) continue;
    seen.add(key);
    out.push(c);
  }
  return out;
}

/** Every row in one bulk load (the database's fast path; see bulk-load.ts), in the import's transaction. */
async function insertRows(tx: Tx, householdId: number, userId: string | null, kind: ImportRequest['kind'], values: { row: number }[]): Promise<void> {
  const rows = values.map(({ row: _row, ...v }) => ({ ...v, householdId, createdBy: userId }));
  if (kind === 'harvests') await loadRows(tx, harvests, rows as (typeof harvests.$inferInsert)[]);
  else await loadRows(tx, purchases, rows as (typeof purchases.$inferInsert)[]);
}

/**
 * Previews or commits an import. Preview: 200 with the rows as they would be stored and every
 * problem by row. Commit: creates the requested crops and writes every row in one transaction,
 * 201 `{ ok: true, created }`; any problem rolls it all back and answers 422 with the problems.
 */
export async function importEntries(household: ImportHousehold, userId: string | null, req: ImportRequest, today: string): Promise<ImportAnswer> {
  const db = getDb();
  const householdId = household.id;
  if (req.mode === 'preview') {
    if (req.kind === 'purchases') return answer(req, await preparePurchases(db, req, household), 200);
    const existing = await cropRows(db, householdId);
    // Crops the grower chose to create are matched as if they existed. Their stand-in ids are
    // positive (the row rules want ids > 0) but far above any id an INT column can hold: never stored.
    const virtual = (await newCrops(db, existing, req.createCrops)).map((c, i) => cropFromInput(Number.MAX_SAFE_INTEGER - i, c));
    const missingFoods = virtual.flatMap((c) => (c.foodId === null ? [] : [c.foodId]));
    const known = await foodsByIds(db, missingFoods);
    const badFood = missingFoods.find((id) => !known.has(id));
    if (badFood !== undefined) throw new HttpError(400, 'invalid_input', `createCrops: There is no reference food with id ${badFood}.`, { createCrops: `There is no reference food with id ${badFood}.` });
    return answer(req, await prepareHarvests(db, req, household, [...existing, ...virtual], today), 200);
  }
  try {
    return await db.transaction(async (tx) => {
      let created = 0;
      let prepared: Prepared<{ grams: number; edibleGrams: number }>;
      if (req.kind === 'harvests') {
        const existing = await cropRows(tx, householdId);
        const toCreate = await newCrops(tx, existing, req.createCrops);
        for (const c of toCreate) await insertCrop(tx, householdId, c);
        prepared = await prepareHarvests(tx, req, household, toCreate.length > 0 ? await cropRows(tx, householdId) : existing, today);
      } else {
        const purchasesPrepared = await preparePurchases(tx, req, household);
        // A household without a currency takes that of the first row that names one, as from the form.
        const firstCurrency = purchasesPrepared.values.find((v) => v.currency !== null)?.currency;
        if (purchasesPrepared.errors.length === 0 && firstCurrency) await adoptCurrency(tx, householdId, firstCurrency);
        prepared = purchasesPrepared;
      }
      if (prepared.errors.length > 0 || prepared.values.length === 0) {
        throw new RowsRefused(answer(req, prepared, 422, { ok: false }));
      }
      await insertRows(tx, householdId, userId, req.kind, prepared.values);
      created = prepared.values.length;
      return answer(req, prepared, 201, { ok: true, created, rows: [] });
    });
  } catch (e) {
    if (e instanceof RowsRefused) return e.answer;
    throw e;
  }
}
