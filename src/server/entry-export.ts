/**
 * Exporting a household's records: harvests, bought food, crops and people as CSV (harvests and
 * bought food in exactly the importer's columns, so an export re-imports to the same entries), and
 * the whole household as one JSON backup. Every query is scoped by the household id.
 */
import { asc, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { foods, harvests, people, purchases, type Household } from '@/db/schema';
import type { CsvDelimiter } from '@/lib/csv-import';
import {
  cropsToCsv,
  harvestRecord,
  harvestsToCsv,
  peopleToCsv,
  purchaseRecord,
  purchasesToCsv,
  type ExportLookups,
} from '@/lib/csv-export';
import type { HarvestInput, PurchaseInput } from '@/lib/entry-schemas';
import { cropRows, listCrops } from './crops';
import { todayIn } from '@/lib/months';
import { householdJson } from './households';
import { everyHarvest } from './harvests';
import { outcomesForBackup } from './larder-outcomes';
import { everyPurchase } from './purchases';
import { listStaples } from './staples';

/** Files the export route serves. Example: `EXPORT_FILES.includes('backup.json')` → true */
export const EXPORT_FILES = ['harvests.csv', 'purchases.csv', 'crops.csv', 'people.csv', 'backup.json'] as const;
export type ExportFile = (typeof EXPORT_FILES)[number];

/** Identifies the backup format, so a later version can read older files. */
export const BACKUP_FORMAT = { format: 'selfsown-household-backup', version: 1 } as const;

async function foodCodes(householdId: number, table: 'harvests' | 'purchases'): Promise<Map<number, string>> {
  const db = getDb();
  const rows =
    table === 'harvests'
      ? await db.selectDistinct({ id: foods.id, code: foods.code }).from(harvests).innerJoin(foods, eq(foods.id, harvests.foodId)).where(eq(harvests.householdId, householdId))
      : await db.selectDistinct({ id: foods.id, code: foods.code }).from(purchases).innerJoin(foods, eq(foods.id, purchases.foodId)).where(eq(purchases.householdId, householdId));
  return new Map(rows.map((r) => [r.id, r.code]));
}

/** The harvest log as CSV, oldest first. Example: `(await harvestsCsv(7)).split('\r\n')[0]` → '\uFEFFdate,crop,variety,…' */
export async function harvestsCsv(householdId: number, delimiter: CsvDelimiter = ','): Promise<string> {
  const db = getDb();
  const rows = await db.select().from(harvests).where(eq(harvests.householdId, householdId)).orderBy(asc(harvests.date), asc(harvests.id));
  const cropsById = new Map((await cropRows(db, householdId)).map((c) => [c.id, c]));
  const codes = await foodCodes(householdId, 'harvests');
  const lookups: ExportLookups = { crop: (id) => cropsById.get(id), foodCode: (id) => codes.get(id) };
  const records = rows.map((h) => {
    // A harvest of a crop is written by the crop's name; only a harvest without one names its food.
    const entry = {
      date: h.date,
      ...(h.cropId !== null ? { cropId: h.cropId } : { foodId: h.foodId ?? undefined }),
      quantity: h.quantity,
      unit: h.unit,
      use: h.use,
      spreadMonths: h.spreadMonths,
      ...(h.preserveMethod !== null ? { preserveMethod: h.preserveMethod } : {}),
      trimmed: h.trimmed,
      ...(h.note !== null ? { note: h.note } : {}),
    } as HarvestInput;
    return harvestRecord(entry, lookups);
  });
  return harvestsToCsv(records, { delimiter });
}

/** Bought food as CSV, oldest first. */
export async function purchasesCsv(householdId: number, delimiter: CsvDelimiter = ','): Promise<string> {
  const rows = await getDb().select().from(purchases).where(eq(purchases.householdId, householdId)).orderBy(asc(purchases.date), asc(purchases.id));
  const codes = await foodCodes(householdId, 'purchases');
  const records = rows.map((p) => {
    const entry: PurchaseInput = {
      date: p.date,
      foodId: p.foodId,
      quantity: p.quantity,
      unit: p.unit,
      ...(p.price !== null ? { price: Number(p.price) } : {}),
      ...(p.currency !== null ? { currency: p.currency } : {}),
      spreadMonths: p.spreadMonths,
      trimmed: p.trimmed,
      ...(p.note !== null ? { note: p.note } : {}),
    };
    return purchaseRecord(entry, { foodCode: (id) => codes.get(id) });
  });
  return purchasesToCsv(records, { delimiter });
}

/** The crop catalogue as CSV, archived crops included. */
export async function cropsCsv(householdId: number, delimiter: CsvDelimiter = ','): Promise<string> {
  const list = await listCrops(householdId, { includeArchived: true });
  const sorted = [...list].sort((a, b) => a.displayName.localeCompare(b.displayName));
  return cropsToCsv(
    sorted.map((c) => ({
      name: c.name,
      variety: c.variety,
      category: c.category,
      foodCode: c.food?.code ?? null,
      edibleFraction: c.edibleFraction,
      defaultUse: c.defaultUse,
      defaultSpreadMonths: c.defaultSpreadMonths,
      notFood: c.notFood,
    })),
    { delimiter },
  );
}

async function peopleRows(householdId: number) {
  return getDb().select().from(people).where(eq(people.householdId, householdId)).orderBy(asc(people.name), asc(people.id));
}

/** The people who eat in the household as CSV (read straight from the people table). */
export async function peopleCsv(householdId: number, delimiter: CsvDelimiter = ','): Promise<string> {
  // peopleToCsv reads only the person's fields (PersonCsvRecord), so the stored rows go in as they are.
  return peopleToCsv(await peopleRows(householdId), { delimiter });
}

/** The whole household as one JSON document: settings, crops, harvests, bought food, staples, people, larder records. */
export async function householdBackup(household: Household) {
  const hid = household.id;
  const [cropList, harvestList, purchaseList, stapleList, peopleList, outcomeRows] = await Promise.all([
    listCrops(hid, { includeArchived: true }),
    everyHarvest(hid),
    everyPurchase(hid),
    listStaples(hid),
    peopleRows(hid),
    outcomesForBackup(hid),
  ]);
  return {
    ...BACKUP_FORMAT,
    exportedAt: new Date().toISOString(),
    household: householdJson(household),
    crops: cropList,
    harvests: harvestList,
    purchases: purchaseList,
    staples: stapleList,
    people: peopleList.map(({ householdId: _h, ...p }) => ({ ...p, createdAt: p.createdAt.toISOString() })),
    // What happened to stored and preserved lots (the larder), by harvest id.
    larderOutcomes: outcomeRows.map(({ householdId: _h, createdBy: _c, ...o }) => ({ ...o, createdAt: o.createdAt.toISOString() })),
  };
}

/** A file name for a download: the household's name in plain letters, what it holds and today's date. */
export function exportFileName(household: Household, file: ExportFile): string {
  const slug =
    household.name
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 40) || `household-${household.id}`;
  const [base, ext] = file.split('.') as [string, string];
  return `${slug}-${base}-${todayIn(household.timezone)}.${ext}`;
}

/** The body and content type of one export file. */
export async function exportFile(household: Household, file: ExportFile, delimiter: CsvDelimiter = ','): Promise<{ body: string; contentType: string }> {
  const csv = (body: string) => ({ body, contentType: 'text/csv; charset=utf-8' });
  switch (file) {
    case 'harvests.csv':
      return csv(await harvestsCsv(household.id, delimiter));
    case 'purchases.csv':
      return csv(await purchasesCsv(household.id, delimiter));
    case 'crops.csv':
      return csv(await cropsCsv(household.id, delimiter));
    case 'people.csv':
      return csv(await peopleCsv(household.id, delimiter));
    case 'backup.json':
      return { body: JSON.stringify(await householdBackup(household), null, 2), contentType: 'application/json; charset=utf-8' };
  }
}
