/**
 * Puts a generated demo household (generate-demo.ts) into the database through Drizzle, inside the
 * caller's transaction: the household, its people, beds, crops (each linked to its reference crop
 * and SR28 food), plantings, harvests, bought food, larder records and staples, in multi-row
 * batches. Grams and edible grams are worked out by the same helpers the API uses (harvestValues,
 * purchaseValues), from each entry parsed by the API's own schemas.
 */
import { and, eq, inArray } from 'drizzle-orm';
import * as schema from '@/db/schema';
import { harvestInput, purchaseInput } from '@/lib/entry-schemas';
import { personInput } from '@/lib/people-schemas';
import { cropBasis, foodBasis, harvestValues } from '@/server/harvests';
import { purchaseValues } from '@/server/purchases';
import type { Executor, Tx } from '@/server/entry-input';
import type { DemoData, DemoFood } from './demo-types';

const SR28 = 'usda-sr28';
const BATCH = 500;

export interface DbFood extends DemoFood {
  id: number;
}

/** The SR28 foods of `codes` as stored (id, refuse, energy). Codes not loaded are missing from the map. */
export async function loadDemoFoods(ex: Executor, codes: readonly string[]): Promise<Map<string, DbFood>> {
  const rows = await ex
    .select({ id: schema.foods.id, code: schema.foods.code, refusePct: schema.foods.refusePct, kcal: schema.foodNutrients.amount })
    .from(schema.foods)
    .innerJoin(schema.datasets, eq(schema.datasets.id, schema.foods.datasetId))
    .innerJoin(schema.foodNutrients, and(eq(schema.foodNutrients.foodId, schema.foods.id), eq(schema.foodNutrients.nutrientKey, 'energy_kcal')))
    .where(and(eq(schema.datasets.slug, SR28), inArray(schema.foods.code, [...codes])));
  return new Map(rows.map((r) => [r.code, { id: r.id, refusePct: r.refusePct, kcalPer100g: Number(r.kcal) }]));
}

async function inBatches<T>(rows: readonly T[], insert: (batch: T[]) => Promise<unknown>): Promise<void> {
  for (let i = 0; i < rows.length; i += BATCH) await insert(rows.slice(i, i + BATCH));
}

export interface DemoWriters {
  /** Harvests and purchases alternate between these as their `created_by` (the owner and the grower). */
  userIds: readonly string[];
}

export interface DemoWriteResult {
  householdId: number;
  harvests: number;
  purchases: number;
  plantings: number;
  outcomes: number;
}

/** Writes `data` as a new household and returns its id and counts. Memberships are the caller's. */
export async function writeDemo(tx: Tx, data: DemoData, foods: ReadonlyMap<string, DbFood>, writers: DemoWriters): Promise<DemoWriteResult> {
  const food = (code: string) => {
    const f = foods.get(code);
    if (!f) throw new Error(`SR28 food ${code} is not loaded; run npm run db:import-foods first.`);
    return f;
  };
  const by = (i: number) => writers.userIds[i % writers.userIds.length] ?? null;
  const [hh] = await tx.insert(schema.households).values(data.household);
  const householdId = hh.insertId;
  await tx.insert(schema.people).values(data.people.map((p) => ({ ...personInput.parse(p), householdId })));

  const bedIds = new Map<string, number>();
  for (const b of data.beds) bedIds.set(b.key, (await tx.insert(schema.beds).values({ householdId, name: b.name, areaM2: b.areaM2, notes: b.notes }))[0].insertId);
  const crops = new Map<string, { id: number; basis: ReturnType<typeof cropBasis> }>();
  for (const c of data.crops) {
    const f = food(c.code);
    const row = { householdId, name: c.name, variety: c.variety, foodId: f.id, category: c.category, edibleFraction: c.edibleFraction, defaultSpreadMonths: c.defaultSpreadMonths, notFood: false, referenceKey: c.referenceKey };
    const id = (await tx.insert(schema.crops).values(row))[0].insertId;
    crops.set(c.key, { id, basis: cropBasis({ ...row, id }, f) });
  }
  const plantingIds = new Map<string, number>();
  for (const p of data.plantings) {
    const values = { householdId, cropId: crops.get(p.crop)!.id, bedId: bedIds.get(p.bed)!, areaM2: p.areaM2, seasonYear: p.seasonYear, slot: p.slot, sowDate: p.sowDate, harvestFrom: p.harvestFrom, harvestTo: p.harvestTo };
    plantingIds.set(p.key, (await tx.insert(schema.plantings).values(values))[0].insertId);
  }

  const splitIds = new Map<string, string>();
  const harvestRows = data.harvests.map((h, i) => {
    const crop = h.crop ? crops.get(h.crop)! : null;
    const plantingId = h.planting ? plantingIds.get(h.planting) : undefined;
    const input = harvestInput.parse({ ...h.entry, ...(crop ? { cropId: crop.id } : { foodId: food(h.food).id }), ...(plantingId ? { plantingId } : {}) });
    let splitGroup: string | null = null;
    if (h.split) {
      if (!splitIds.has(h.split)) splitIds.set(h.split, crypto.randomUUID());
      splitGroup = splitIds.get(h.split)!;
    }
    return { ...harvestValues(input, crop ? crop.basis : foodBasis(food(h.food))), householdId, createdBy: by(i), splitGroup };
  });
  // Lots with larder records go in one by one (their ids are needed); ids of a multi-row insert are not
  // consecutive on a Galera cluster.
  const withRecords = new Set(data.outcomes.map((o) => o.harvest));
  const lotIds = new Map<number, number>();
  for (const i of withRecords) lotIds.set(i, (await tx.insert(schema.harvests).values(harvestRows[i]!))[0].insertId);
  await inBatches(harvestRows.filter((_, i) => !withRecords.has(i)), (b) => tx.insert(schema.harvests).values(b));

  const purchaseRows = data.purchases.map((p, i) => {
    const f = food(p.food);
    return { ...purchaseValues(purchaseInput.parse({ ...p.entry, foodId: f.id }), { refusePct: f.refusePct }), householdId, createdBy: by(i) };
  });
  await inBatches(purchaseRows, (b) => tx.insert(schema.purchases).values(b));
  if (data.outcomes.length > 0) {
    await tx.insert(schema.larderOutcomes).values(
      data.outcomes.map((o) => ({ householdId, harvestId: lotIds.get(o.harvest)!, kind: o.kind, date: o.date, lostFraction: o.lostFraction, note: o.note, createdBy: by(0) })),
    );
  }
  if (data.staples.length > 0) await tx.insert(schema.staples).values(data.staples.map((s) => ({ householdId, foodId: food(s.code).id, label: s.label, quantity: s.quantity, unit: s.unit, spreadMonths: s.spreadMonths })));
  return { householdId, harvests: harvestRows.length, purchases: purchaseRows.length, plantings: plantingIds.size, outcomes: data.outcomes.length };
}
