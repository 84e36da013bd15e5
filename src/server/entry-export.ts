/**
 * Exporting a household's records: harvests, bought food, crops and people as CSV (harvests and
 * bought food in exactly the importer's columns, so an export re-imports to the same entries), and
 * the whole household as one JSON backup. Every query is scoped by the household id.
 */
import { and, asc, eq, gt, or } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { datasets, foods, harvests, people, purchases, type Household } from '@/db/schema';
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

/** The code and dataset slug of each food the household's harvests or purchases name. */
async function foodCodes(householdId: number, table: 'harvests' | 'purchases'): Promise<Pick<ExportLookups, 'foodCode' | 'foodDataset'>> {
  const db = getDb();
  const columns = { id: foods.id, code: foods.code, slug: datasets.slug };
  const rows =
    table === 'harvests'
      ? await db.selectDistinct(columns).from(harvests).innerJoin(foods, eq(foods.id, harvests.foodId)).innerJoin(datasets, eq(datasets.id, foods.datasetId)).where(eq(harvests.householdId, householdId))
      : await db.selectDistinct(columns).from(purchases).innerJoin(foods, eq(foods.id, purchases.foodId)).innerJoin(datasets, eq(datasets.id, foods.datasetId)).where(eq(purchases.householdId, householdId));
  const byId = new Map(rows.map((r) => [r.id, r]));
  return { foodCode: (id) => byId.get(id)?.code, foodDataset: (id) => byId.get(id)?.slug };
}

/** Rows read and written per part of a streamed export: the whole log never sits in memory at once. */
const PAGE_ROWS = 2000;

/**
 * The rows of one household's harvests or purchases, oldest first, a page at a time (keyset on
 * date and id along the household's date index, so each page costs the same).
 */
async function* pages<T extends typeof harvests | typeof purchases>(table: T, householdId: number): AsyncGenerator<T['$inferSelect'][]> {
  let after: { date: string; id: number } | null = null;
  for (;;) {
    const next = after ? or(gt(table.date, after.date), and(eq(table.date, after.date), gt(table.id, after.id))) : undefined;
    const rows = (await getDb()
      .select()
      .from(table as typeof harvests)
      .where(and(eq(table.householdId, householdId), next))
      .orderBy(asc(table.date), asc(table.id))
      .limit(PAGE_ROWS)) as T['$inferSelect'][];
    if (rows.length === 0) return;
    yield rows;
    const last = rows[rows.length - 1]!;
    after = { date: last.date, id: last.id };
  }
}

/** The harvest log as CSV text in parts (the first with the BOM and header), oldest first. */
export async function* harvestsCsvParts(householdId: number, delimiter: CsvDelimiter = ','): AsyncGenerator<string> {
  const db = getDb();
  const cropsById = new Map((await cropRows(db, householdId)).map((c) => [c.id, c]));
  const codes = await foodCodes(householdId, 'harvests');
  const lookups: ExportLookups = { crop: (id) => cropsById.get(id), ...codes };
  let first = true;
  for await (const rows of pages(harvests, householdId)) {
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
    yield harvestsToCsv(records, { delimiter, bom: first, header: first });
    first = false;
  }
  if (first) yield harvestsToCsv([], { delimiter });
}

/** Bought food as CSV text in parts, oldest first. */
export async function* purchasesCsvParts(householdId: number, delimiter: CsvDelimiter = ','): AsyncGenerator<string> {
  const codes = await foodCodes(householdId, 'purchases');
  let first = true;
  for await (const rows of pages(purchases, householdId)) {
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
      return purchaseRecord(entry, codes);
    });
    yield purchasesToCsv(records, { delimiter, bom: first, header: first });
    first = false;
  }
  if (first) yield purchasesToCsv([], { delimiter });
}

/** Parts of text as a byte stream, read one part ahead of the client at most. */
function streamOf(parts: AsyncGenerator<string>): ReadableStream<Uint8Array> {
  const utf8 = new TextEncoder();
  return new ReadableStream({
    async pull(controller) {
      const next = await parts.next();
      if (next.done) controller.close();
      else controller.enqueue(utf8.encode(next.value));
    },
    async cancel() {
      await parts.return(undefined);
    },
  });
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

/** The body and content type of one export file; the harvest and purchase logs stream page by page. */
export async function exportFile(household: Household, file: ExportFile, delimiter: CsvDelimiter = ','): Promise<{ body: string | ReadableStream<Uint8Array>; contentType: string }> {
  const csv = (body: string | ReadableStream<Uint8Array>) => ({ body, contentType: 'text/csv; charset=utf-8' });
  switch (file) {
    case 'harvests.csv':
      return csv(streamOf(harvestsCsvParts(household.id, delimiter)));
    case 'purchases.csv':
      return csv(streamOf(purchasesCsvParts(household.id, delimiter)));
    case 'crops.csv':
      return csv(await cropsCsv(household.id, delimiter));
    case 'people.csv':
      return csv(await peopleCsv(household.id, delimiter));
    case 'backup.json':
      return { body: JSON.stringify(await householdBackup(household), null, 2), contentType: 'application/json; charset=utf-8' };
  }
}
