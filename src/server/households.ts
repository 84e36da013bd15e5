/** Households and memberships in the database. Every function is scoped by user or household id. */
import { and, asc, eq, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { crops, harvests, households, memberships, plantings, purchases, staples, user, type Household, type Role } from '@/db/schema';
import { compareMonths, monthOf, todayIn } from '@/lib/months';
import { currentZoneName } from '@/lib/time-zones';
import { currencyForZone } from '@/lib/currency';
import { isRetryableLock } from './db-errors';
import { fieldError, type Tx } from './entry-input';
import { HttpError } from './http';

export interface HouseholdInput {
  name: string;
  timezone: string;
  units: 'metric' | 'us';
  yearStartMonth: number;
  /** ISO 4217 code new purchases start with; left out, it is guessed from the time zone; null = none. */
  currency?: string | null;
}

/** A change to a household (owner): the fields above and the month its records start (null = the default rule). */
export interface HouseholdPatch extends Partial<HouseholdInput> {
  recordsSince?: string | null;
}

/** A household as the API answers; recordsSince null = the default rule (src/lib/records-start.ts). */
export function householdJson(h: Household, role?: Role) {
  return {
    id: h.id,
    name: h.name,
    // A household stored with an old spelling (Asia/Calcutta) is shown under its current name.
    timezone: currentZoneName(h.timezone),
    units: h.units,
    yearStartMonth: h.yearStartMonth,
    recordsSince: h.recordsSince,
    currency: h.currency,
    ...(role ? { role } : {}),
  };
}

/** Creates a household with its creator as owner, in one transaction. */
export async function createHousehold(userId: string, input: HouseholdInput): Promise<Household> {
  return getDb().transaction(async (tx) => {
    const currency = input.currency === undefined ? currencyForZone(input.timezone) : input.currency;
    const [res] = await tx.insert(households).values({ ...input, currency });
    const id = res.insertId;
    await tx.insert(memberships).values({ householdId: id, userId, role: 'owner', monthlyLetter: true });
    const [h] = await tx.select().from(households).where(eq(households.id, id));
    return h!;
  });
}

export async function listHouseholds(userId: string) {
  return getDb()
    .select({ household: households, role: memberships.role })
    .from(memberships)
    .innerJoin(households, eq(households.id, memberships.householdId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(households.name), asc(households.id));
}

/**
 * Changes a household. A records start after the current month (in the household's time zone,
 * the new one if it changes too) is refused: it would leave every month so far uncharged.
 */
export async function updateHousehold(current: Household, patch: HouseholdPatch): Promise<Household> {
  const householdId = current.id;
  if (patch.recordsSince != null) {
    const now = monthOf(todayIn(patch.timezone ?? current.timezone));
    if (compareMonths(patch.recordsSince, now) > 0) {
      throw fieldError('recordsSince', `The records cannot start after the current month (${now}): choose ${now} or an earlier month.`);
    }
  }
  await getDb().update(households).set(patch).where(eq(households.id, householdId));
  const [h] = await getDb().select().from(households).where(eq(households.id, householdId));
  return h!;
}

/**
 * Deletes a household and everything that belongs to it, all or nothing. Entries go first: a
 * harvest keeps its crop from being deleted (crops in use are protected elsewhere too), so the
 * cascade from the household alone would be refused. Larder outcomes go with their harvests;
 * beds, people, memberships, invitations, idempotency keys and letters with the household (foreign
 * keys ON DELETE CASCADE, tested in tests/integration/household-delete.test.ts).
 */
export async function deleteHousehold(householdId: number): Promise<void> {
  // Writes racing the deletion can still deadlock with it on some rows: try again, then 409 (http.ts).
  for (let attempt = 1; ; attempt++) {
    try {
      return await getDb().transaction((tx) => deleteHouseholdRows(tx, householdId));
    } catch (e) {
      if (!isRetryableLock(e) || attempt >= 3) throw e;
    }
  }
}

/**
 * deleteHousehold's statements inside a transaction of the caller's (the demo reset uses its own pool).
 * The household's row is locked first: writes that began earlier (each holds it shared, see
 * lockHousehold) finish before anything is deleted, and later ones wait and then find it gone (404).
 * A household already deleted by a twin request is a 404.
 */
export async function deleteHouseholdRows(tx: Tx, householdId: number): Promise<void> {
  const [locked] = (await tx.execute(sql`SELECT id FROM households WHERE id = ${householdId} FOR UPDATE`)) as unknown as [unknown[]];
  if (locked.length === 0) throw new HttpError(404, 'not_found', 'No such household.');
  await tx.delete(harvests).where(eq(harvests.householdId, householdId));
  await tx.delete(purchases).where(eq(purchases.householdId, householdId));
  await tx.delete(staples).where(eq(staples.householdId, householdId));
  // Plantings point at crops (restrict), so they go first; beds go with the household (cascade).
  await tx.delete(plantings).where(eq(plantings.householdId, householdId));
  await tx.delete(crops).where(eq(crops.householdId, householdId));
  await tx.delete(households).where(eq(households.id, householdId));
}

export async function listMembers(householdId: number) {
  return getDb()
    .select({ userId: memberships.userId, role: memberships.role, name: user.name, email: user.email, since: memberships.createdAt })
    .from(memberships)
    .innerJoin(user, eq(user.id, memberships.userId))
    .where(eq(memberships.householdId, householdId))
    .orderBy(asc(user.name));
}

async function ownerCount(tx: Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0], householdId: number): Promise<number> {
  // FOR UPDATE: two owners demoting each other at once cannot both succeed.
  const rows = await tx.execute(sql`SELECT COUNT(*) AS n FROM memberships WHERE household_id = ${householdId} AND role = 'owner' FOR UPDATE`);
  return Number((rows[0] as unknown as { n: number }[])[0]!.n);
}

/** Changes a member's role; the last owner cannot be demoted. */
export async function setMemberRole(householdId: number, memberId: string, role: Role): Promise<void> {
  await getDb().transaction(async (tx) => {
    const [m] = await tx.select().from(memberships).where(and(eq(memberships.householdId, householdId), eq(memberships.userId, memberId)));
    if (!m) throw new HttpError(404, 'not_found', 'That person is not a member of this household.');
    if (m.role === 'owner' && role !== 'owner' && (await ownerCount(tx, householdId)) <= 1) {
      throw new HttpError(409, 'last_owner', 'A household needs at least one owner: make someone else owner first.');
    }
    await tx.update(memberships).set({ role }).where(and(eq(memberships.householdId, householdId), eq(memberships.userId, memberId)));
  });
}

/** Removes a member (or lets one leave); the last owner cannot go. Access ends at once. */
export async function removeMember(householdId: number, memberId: string): Promise<void> {
  await getDb().transaction(async (tx) => {
    const [m] = await tx.select().from(memberships).where(and(eq(memberships.householdId, householdId), eq(memberships.userId, memberId)));
    if (!m) throw new HttpError(404, 'not_found', 'That person is not a member of this household.');
    if (m.role === 'owner' && (await ownerCount(tx, householdId)) <= 1) {
      throw new HttpError(409, 'last_owner', 'The last owner cannot leave or be removed: make someone else owner first, or delete the household.');
    }
    await tx.delete(memberships).where(and(eq(memberships.householdId, householdId), eq(memberships.userId, memberId)));
  });
}
