/**
 * The words and checks of the household settings page that are rules rather than layout: what a
 * change of time zone or growing-year start does to the records, what deleting a household
 * removes, and when the typed confirmation of a deletion counts. Pure, so the page and its tests
 * read the same sentences.
 */
import { monthName } from './months';

/** What deleting a household removes, in the order the page lists it. */
export const DELETION_REMOVES = [
  'every harvest and bought-food entry, with what the larder recorded about them',
  'the crops, beds and plantings',
  'the people who eat in it',
  'every member’s access, and invitations not yet accepted',
  'the monthly letters’ record',
] as const;

/**
 * True when the typed text is the household's exact name (spaces around it ignored, case not).
 * Example: `deletionConfirmed('Hillside plot ', 'Hillside plot')` → true; `deletionConfirmed('hillside plot', 'Hillside plot')` → false
 */
export function deletionConfirmed(typed: string, householdName: string): boolean {
  const name = householdName.trim();
  return name.length > 0 && typed.trim() === name;
}

/** The settings a change note compares. */
export interface ZoneAndYear {
  timezone: string;
  yearStartMonth: number;
}

/**
 * One sentence per setting that changes in a way worth explaining before it is saved: a new time
 * zone or a new growing-year start. Empty when neither changes.
 * Example: `settingsChangeNotes({ timezone: 'UTC', yearStartMonth: 1 }, { timezone: 'UTC', yearStartMonth: 3 })`
 *   → ['The growing year will run March to February: yearly totals and the default report follow. No entry changes.']
 */
export function settingsChangeNotes(before: ZoneAndYear, after: ZoneAndYear): string[] {
  const notes: string[] = [];
  if (after.timezone !== before.timezone) {
    notes.push(
      `Dates already logged stay as logged. From now on “today”, the newest date an entry may have and the turn of each month follow ${after.timezone.replaceAll('_', ' ')}.`,
    );
  }
  if (after.yearStartMonth !== before.yearStartMonth && after.yearStartMonth >= 1 && after.yearStartMonth <= 12) {
    const last = ((after.yearStartMonth + 10) % 12) + 1;
    notes.push(
      `The growing year will run ${monthName(after.yearStartMonth)} to ${monthName(last)}: yearly totals and the default report follow. No entry changes.`,
    );
  }
  return notes;
}
