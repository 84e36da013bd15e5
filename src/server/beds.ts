/**
 * The household's beds in the database. Areas are stored in m² and answered in m² and in the
 * household's own unit (ft² for a US household). Every function takes the household id and reads
 * or writes only that household's rows; deleting a bed leaves its plantings without a bed.
 */
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { beds, type Household } from '@/db/schema';
import { areaUnitFor, fromM2, toM2, type AreaUnit, type BedInput, type BedPatch } from '@/lib/bed-schemas';
import type { BedJson } from '@/lib/bed-types';
import type { UnitSystem } from '@/lib/units';
import { isDuplicateKey } from './db-errors';
import type { Executor } from './entry-input';
import { HttpError } from './http';

type Bed = typeof beds.$inferSelect;

export function bedJson(b: Bed, units: UnitSystem): BedJson {
  const unit = areaUnitFor(units);
  return { id: b.id, name: b.name, areaM2: b.areaM2, area: fromM2(b.areaM2, unit), areaUnit: unit, notes: b.notes };
}

/** The m² of an area sent in `unit`, or in the household's unit when none is named. Example: `areaM2Of(100, undefined, 'us')` → 9.290304 */
export function areaM2Of(area: number, unit: AreaUnit | undefined, units: UnitSystem): number {
  return toM2(area, unit ?? areaUnitFor(units));
}

function duplicate(name: string): HttpError {
  return new HttpError(409, 'duplicate', `There is already a bed called ${name} in this household.`, { name: 'This household already has a bed with this name.' });
}

/** The household's beds by name. Example: `(await listBeds(h)).map((b) => b.name)` → ['North bed', 'Orchard strip'] */
export async function listBeds(h: Pick<Household, 'id' | 'units'>): Promise<BedJson[]> {
  const rows = await getDb().select().from(beds).where(eq(beds.householdId, h.id)).orderBy(asc(beds.name), asc(beds.id));
  return rows.map((b) => bedJson(b, h.units));
}

/** One bed row of the household, or 404. */
export async function bedRow(ex: Executor, householdId: number, bedId: number): Promise<Bed> {
  const [row] = await ex.select().from(beds).where(and(eq(beds.householdId, householdId), eq(beds.id, bedId))).limit(1);
  if (!row) throw new HttpError(404, 'not_found', 'No such bed in this household.');
  return row;
}

/** One bed as JSON, or 404. */
export async function getBed(h: Pick<Household, 'id' | 'units'>, bedId: number): Promise<BedJson> {
  return bedJson(await bedRow(getDb(), h.id, bedId), h.units);
}

/** Adds a bed; 409 when the household has one of that name. Example: `await createBed(h, bedInput.parse({ name: 'North', area: 12 }))` */
export async function createBed(h: Pick<Household, 'id' | 'units'>, input: BedInput): Promise<BedJson> {
  try {
    const [res] = await getDb()
      .insert(beds)
      .values({ householdId: h.id, name: input.name, areaM2: areaM2Of(input.area, input.areaUnit, h.units), notes: input.notes ?? null });
    return getBed(h, res.insertId);
  } catch (e) {
    if (isDuplicateKey(e)) throw duplicate(input.name);
    throw e;
  }
}

/** Changes a bed; 404 when the household has none with this id, 409 for a name already used. */
export async function updateBed(h: Pick<Household, 'id' | 'units'>, bedId: number, patch: BedPatch): Promise<BedJson> {
  await bedRow(getDb(), h.id, bedId);
  try {
    await getDb()
      .update(beds)
      .set({
        ...(patch.name !== undefined ? { name: patch.name } : {}),
        ...(patch.area !== undefined ? { areaM2: areaM2Of(patch.area, patch.areaUnit, h.units) } : {}),
        ...(patch.notes !== undefined ? { notes: patch.notes } : {}),
      })
      .where(and(eq(beds.householdId, h.id), eq(beds.id, bedId)));
  } catch (e) {
    if (isDuplicateKey(e)) throw duplicate(patch.name ?? '');
    throw e;
  }
  return getBed(h, bedId);
}

/** Deletes a bed; its plantings stay, without a bed. 404 when the household has none with this id. */
export async function deleteBed(householdId: number, bedId: number): Promise<void> {
  const [res] = await getDb().delete(beds).where(and(eq(beds.householdId, householdId), eq(beds.id, bedId)));
  if (res.affectedRows === 0) throw new HttpError(404, 'not_found', 'No such bed in this household.');
}
