/**
 * Who gets the monthly letter: each member's own switch (memberships.monthly_letter), set from the
 * account page, or turned off from the letter's own unsubscribe link without signing in.
 */
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { households, memberships, user, type Role } from '@/db/schema';
import type { LetterTokenSubject } from './letter-token';

/** Sets one member's monthly letter on or off; the value now stored. */
export async function setMonthlyLetter(householdId: number, userId: string, on: boolean): Promise<boolean> {
  const db = getDb();
  await db
    .update(memberships)
    .set({ monthlyLetter: on })
    .where(and(eq(memberships.householdId, householdId), eq(memberships.userId, userId)));
  return on;
}

/** One of a person's households as the account page lists it. */
export interface AccountHousehold {
  id: number;
  name: string;
  role: Role;
  monthlyLetter: boolean;
}

/** Every household the person belongs to, with their role and letter switch, by name. */
export async function accountHouseholds(userId: string): Promise<AccountHousehold[]> {
  return getDb()
    .select({ id: households.id, name: households.name, role: memberships.role, monthlyLetter: memberships.monthlyLetter })
    .from(memberships)
    .innerJoin(households, eq(households.id, memberships.householdId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(households.name), asc(households.id));
}

/** What an unsubscribe link stops: the household, the address and whether the letter is on now. */
export interface LetterSubscription {
  householdId: number;
  householdName: string;
  email: string;
  monthlyLetter: boolean;
}

/** The membership a valid token names, or null when it is gone (left the household, account deleted). */
export async function subscriptionOf(subject: LetterTokenSubject): Promise<LetterSubscription | null> {
  const [row] = await getDb()
    .select({ householdId: households.id, householdName: households.name, email: user.email, monthlyLetter: memberships.monthlyLetter })
    .from(memberships)
    .innerJoin(households, eq(households.id, memberships.householdId))
    .innerJoin(user, eq(user.id, memberships.userId))
    .where(and(eq(memberships.householdId, subject.householdId), eq(memberships.userId, subject.userId)));
  return row ?? null;
}

/** Stops the letter a token names; the subscription as it now stands, or null when the membership is gone. */
export async function unsubscribe(subject: LetterTokenSubject): Promise<LetterSubscription | null> {
  const current = await subscriptionOf(subject);
  if (!current) return null;
  await setMonthlyLetter(subject.householdId, subject.userId, false);
  return { ...current, monthlyLetter: false };
}
