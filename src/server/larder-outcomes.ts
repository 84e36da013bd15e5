/**
 * Records and removes what happened to a stored or preserved lot. Each write runs in one
 * transaction that locks the harvest row, so two growers recording at once see each other's
 * outcomes, and the whole list is checked by lotSchedule() (src/lib/larder.ts) before it commits:
 * an outcome that cannot apply is refused with the day the lot ran out.
 */
import { and, asc, eq, inArray } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { harvests, larderOutcomes, type Household } from '@/db/schema';
import { LarderOutcomeError, lotSchedule } from '@/lib/larder';
import { LARDER_OUTCOME_LABELS } from '@/lib/larder-outcomes';
import { larderLot } from '@/lib/larder-report';
import type { LarderLot, LarderOutcomeJson } from '@/lib/larder-types';
import type { LarderOutcomeInput } from '@/lib/larder-schemas';
import { todayIn } from '@/lib/months';
import { HttpError } from './http';
import type { Executor } from './entry-input';
import { larderInputs, larderLotRows, outcomeJson } from './larder';

/** The lot of a harvest of this household, locked for the transaction; 404 when it is not a stored or preserved lot here. */
async function lockedLot(tx: Executor, householdId: number, harvestId: number, today: string) {
  const [h] = await tx
    .select({ id: harvests.id, use: harvests.use })
    .from(harvests)
    .where(and(eq(harvests.id, harvestId), eq(harvests.householdId, householdId)))
    .for('update');
  if (!h) throw new HttpError(404, 'not_found', `No harvest #${harvestId} in this household.`);
  const rows = h.use === 'stored' || h.use === 'preserved' ? await larderLotRows(tx, householdId, today, [harvestId]) : [];
  if (rows.length === 0) {
    throw new HttpError(404, 'not_in_larder', `Harvest #${harvestId} is not a stored or preserved lot of food, so it has no place in the larder.`);
  }
  const [input] = await larderInputs(tx, householdId, rows);
  return input!;
}

/** 422 for an outcome that cannot apply to its lot. */
function notPossible(e: LarderOutcomeError): HttpError {
  return new HttpError(422, 'outcome_not_possible', e.message, { date: e.message });
}

/**
 * Records an outcome (owner or grower) and answers it with the lot as it stands today.
 * Throws HttpError 404 (not a lot of this household) or 422 (cannot apply).
 */
export async function recordOutcome(household: Household, userId: string, input: LarderOutcomeInput, now = new Date()): Promise<{ outcome: LarderOutcomeJson; lot: LarderLot }> {
  const today = todayIn(household.timezone, now);
  return getDb().transaction(async (tx) => {
    const lot = await lockedLot(tx, household.id, input.harvestId, today);
    const candidate = { kind: input.kind, date: input.date, lostFraction: input.lostFraction ?? null, until: input.until ?? null };
    try {
      // Existing outcomes carry their ids; the new one sorts after them on the same day.
      lotSchedule(lot, [...lot.outcomes, { ...candidate, id: Number.MAX_SAFE_INTEGER }], { today });
    } catch (e) {
      if (e instanceof LarderOutcomeError) throw notPossible(e);
      throw e;
    }
    const [inserted] = await tx
      .insert(larderOutcomes)
      .values({ householdId: household.id, harvestId: input.harvestId, ...candidate, note: input.note ?? null, createdBy: userId })
      .$returningId();
    const [row] = await tx.select().from(larderOutcomes).where(eq(larderOutcomes.id, inserted!.id));
    const outcome = outcomeJson(row!);
    return { outcome, lot: larderLot({ ...lot, outcomes: [...lot.outcomes, outcome] }, today)! };
  });
}

/**
 * Removes a recorded outcome (undo). 404 when it is not this household's; 409 when a later
 * outcome of the lot rests on it (that one has to go first).
 */
export async function deleteOutcome(household: Household, outcomeId: number, now = new Date()): Promise<void> {
  const today = todayIn(household.timezone, now);
  await getDb().transaction(async (tx) => {
    const [o] = await tx
      .select({ harvestId: larderOutcomes.harvestId })
      .from(larderOutcomes)
      .where(and(eq(larderOutcomes.id, outcomeId), eq(larderOutcomes.householdId, household.id)));
    if (!o) throw new HttpError(404, 'not_found', `No larder record #${outcomeId} in this household.`);
    const lot = await lockedLot(tx, household.id, o.harvestId, today);
    const rest = lot.outcomes.filter((x) => x.id !== outcomeId);
    try {
      lotSchedule(lot, rest);
    } catch (e) {
      if (!(e instanceof LarderOutcomeError)) throw e;
      throw new HttpError(409, 'outcome_depends', `The record of ${e.outcomeId ? dateOf(rest, e.outcomeId) : 'a later day'} rests on this one: ${e.message} Remove that one first.`);
    }
    await tx.delete(larderOutcomes).where(and(eq(larderOutcomes.id, outcomeId), eq(larderOutcomes.householdId, household.id)));
  });
}

/**
 * The recorded outcomes of one harvest of the household, in the order they apply (date, then id);
 * 404 when the household has no such harvest. Undo reads them before a delete or a change of use
 * removes them, to record them again.
 */
export async function harvestOutcomes(householdId: number, harvestId: number): Promise<LarderOutcomeJson[]> {
  const db = getDb();
  const [h] = await db.select({ id: harvests.id }).from(harvests).where(and(eq(harvests.id, harvestId), eq(harvests.householdId, householdId)));
  if (!h) throw new HttpError(404, 'not_found', `No harvest #${harvestId} in this household.`);
  const rows = await db
    .select()
    .from(larderOutcomes)
    .where(and(eq(larderOutcomes.householdId, householdId), eq(larderOutcomes.harvestId, harvestId)))
    .orderBy(asc(larderOutcomes.date), asc(larderOutcomes.id));
  return rows.map(outcomeJson);
}

function dateOf(list: readonly LarderOutcomeJson[], id: number): string {
  return list.find((x) => x.id === id)?.date ?? 'a later day';
}

/**
 * Keeps a harvest's outcomes true to an edit, inside the edit's transaction: a use other than
 * stored or preserved drops them (they no longer mean anything); a new date, spread or weight that
 * an outcome no longer fits is refused with 409 naming that outcome.
 */
export async function reconcileOutcomes(
  tx: Executor,
  householdId: number,
  harvestId: number,
  lot: { use: string; date: string; spreadMonths: number; edibleGrams: number },
): Promise<void> {
  const mine = and(eq(larderOutcomes.householdId, householdId), eq(larderOutcomes.harvestId, harvestId));
  if (lot.use !== 'stored' && lot.use !== 'preserved') {
    await tx.delete(larderOutcomes).where(mine);
    return;
  }
  const rows = await tx.select().from(larderOutcomes).where(mine);
  if (rows.length === 0) return;
  try {
    lotSchedule({ date: lot.date, spreadMonths: Math.max(1, lot.spreadMonths), edibleGrams: lot.edibleGrams }, rows.map(outcomeJson));
  } catch (e) {
    if (!(e instanceof LarderOutcomeError)) throw e;
    const o = rows.find((r) => r.id === e.outcomeId);
    const which = o ? `the larder record of ${o.date} (${LARDER_OUTCOME_LABELS[o.kind].toLowerCase()})` : 'a larder record';
    throw new HttpError(409, 'larder_outcome_conflict', `This change does not fit ${which}: ${e.message} Remove that record on the Larder page first.`);
  }
}

/** The outcomes of some harvests, for the JSON backup. */
export async function outcomesForBackup(householdId: number, harvestIds?: readonly number[]) {
  const where = harvestIds
    ? and(eq(larderOutcomes.householdId, householdId), inArray(larderOutcomes.harvestId, [...harvestIds]))
    : eq(larderOutcomes.householdId, householdId);
  return getDb().select().from(larderOutcomes).where(where).orderBy(larderOutcomes.harvestId, larderOutcomes.date, larderOutcomes.id);
}
