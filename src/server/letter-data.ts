/**
 * What the monthly letter of one household and month rests on, read through the modules that
 * make the same figures for the app's pages: the share report of the month (householdShare), the
 * gap finder over the growing year holding it (householdGaps) and the larder today
 * (householdLarder). Nothing here computes a share; src/lib/letter-content.ts only picks from them.
 */
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { memberships, user, type Household } from '@/db/schema';
import type { GapsResponse } from '@/lib/gap-types';
import { growingYear } from '@/lib/growing-year';
import type { LarderResponse } from '@/lib/larder-types';
import { letterData, nothingEaten, type LetterData, type LetterInput } from '@/lib/letter-content';
import { parseMonth } from '@/lib/months';
import type { ShareResponse } from '@/lib/share-types';
import { publicOrigin } from './config';
import { householdGaps } from './gaps';
import { householdLarder } from './larder';
import { letterToken } from './letter-token';
import { householdShare } from './share-data';

/** A member who gets the letter: opted in, with a confirmed address. */
export interface LetterRecipient {
  userId: string;
  email: string;
  name: string;
}

/** The household's members who get the letter: monthly letter on and e-mail address confirmed. */
export async function letterRecipients(householdId: number): Promise<LetterRecipient[]> {
  return getDb()
    .select({ userId: user.id, email: user.email, name: user.name })
    .from(memberships)
    .innerJoin(user, eq(user.id, memberships.userId))
    .where(and(eq(memberships.householdId, householdId), eq(memberships.monthlyLetter, true), eq(user.emailVerified, true)))
    .orderBy(user.email);
}

export interface HouseholdLetterFigures {
  share: ShareResponse;
  yearGaps: GapsResponse | null;
  larder: LarderResponse;
}

/**
 * The figures of a household's letter for `month`, reckoned at `now`; null when the month's
 * records show nothing eaten (no letter is sent then).
 */
export async function householdLetterFigures(household: Household, month: string, now: Date): Promise<HouseholdLetterFigures | null> {
  const share = await householdShare(household, month, month, undefined, now);
  if (nothingEaten(share, month)) return null;
  const year = parseMonth(growingYear(month, household.yearStartMonth).from).year;
  const [yearGaps, larder] = await Promise.all([
    // The suggestion is a nicety: a year the gap finder cannot weigh leaves it out, not the letter.
    householdGaps(household, year, now).catch((e: unknown) => {
      if (e instanceof RangeError) return null;
      throw e;
    }),
    householdLarder(household, now),
  ]);
  return { share, yearGaps, larder };
}

/** The links of one member's letter: the month on the share page, the account page, unsubscribe. */
export function letterLinks(householdId: number, userId: string, month: string): LetterInput['links'] {
  const origin = publicOrigin();
  return {
    share: `${origin}/households/${householdId}/share?from=${month}&to=${month}`,
    account: `${origin}/account`,
    unsubscribe: `${origin}/letters/unsubscribe?t=${letterToken({ householdId, userId })}`,
  };
}

/** One member's letter data from the household's figures. */
export function memberLetterData(household: Household, month: string, figures: HouseholdLetterFigures, userId: string): LetterData {
  return letterData({
    householdName: household.name,
    month,
    share: figures.share,
    yearGaps: figures.yearGaps,
    larder: figures.larder,
    links: letterLinks(household.id, userId, month),
  });
}
