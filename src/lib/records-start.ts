/**
 * When a household's records start. A household made on 2 December has logged nothing for the
 * March to November before it, so charging those months' need would read as "<1 % of what you
 * need". Months before `recordsSince` are marked `beforeRecords`, carry no need and are left out of
 * every total and headline; the owner may move the start, and by default it is the earlier of the
 * month the household was created and the month of its first entry. Months after the current one
 * are future: shown apart, never in the default headline, which covers the growing year so far.
 */
import { compareMonths, isMonth, monthOf } from './months';

/**
 * The default start of records, 'YYYY-MM': the earlier of the creation month and the first
 * entry's month (a back-dated first harvest moves it back),
 * e.g. defaultRecordsSince('2026-12-02', '2026-08-14') → '2026-08'; defaultRecordsSince('2026-12-02', null) → '2026-12'.
 */
export function defaultRecordsSince(createdDate: string, firstEntryDate: string | null | undefined): string {
  const created = monthOf(createdDate);
  if (firstEntryDate == null) return created;
  const first = monthOf(firstEntryDate);
  return compareMonths(first, created) < 0 ? first : created;
}

/** Whether a month lies before the records start, e.g. isBeforeRecords('2026-11', '2026-12') → true. */
export function isBeforeRecords(month: string, recordsSince: string | null | undefined): boolean {
  if (recordsSince == null) return false;
  if (!isMonth(recordsSince)) throw new RangeError(`The records start must be a month written YYYY-MM, got "${recordsSince}".`);
  return compareMonths(month, recordsSince) < 0;
}

export interface RecordsMonth<N> {
  month: string;
  beforeRecords: boolean;
  /** null before the records start: nobody is charged for months with no records. */
  need: N | null;
}

/**
 * Marks each month of a report against the records start: months before it get
 * `beforeRecords: true` and need null; the others keep their need,
 * e.g. markRecordsStart([{ month: '2026-11', need: 900 }, { month: '2026-12', need: 930 }], '2026-12')
 * → [{ month: '2026-11', beforeRecords: true, need: null }, { month: '2026-12', beforeRecords: false, need: 930 }].
 */
export function markRecordsStart<N, M extends { month: string; need: N | null }>(
  months: readonly M[],
  recordsSince: string | null | undefined,
): (Omit<M, 'need'> & RecordsMonth<N>)[] {
  return months.map((m) =>
    isBeforeRecords(m.month, recordsSince) ? { ...m, beforeRecords: true, need: null } : { ...m, beforeRecords: false },
  );
}

/**
 * The months a total or headline counts: those from the records start on,
 * e.g. countedMonths(['2026-10', '2026-11', '2026-12'], '2026-11') → ['2026-11', '2026-12'].
 */
export function countedMonths(months: readonly string[], recordsSince: string | null | undefined): string[] {
  return months.filter((m) => !isBeforeRecords(m, recordsSince));
}

/**
 * The months a default headline counts: from the records start to the current month (the year so
 * far; future months are shown apart), e.g.
 * headlineMonths(['2026-11', '2026-12', '2027-01'], { recordsSince: '2026-11', currentMonth: '2026-12' }) → ['2026-11', '2026-12'].
 */
export function headlineMonths(
  months: readonly string[],
  { recordsSince, currentMonth }: { recordsSince: string | null | undefined; currentMonth: string },
): string[] {
  if (!isMonth(currentMonth)) throw new RangeError(`The current month must be written YYYY-MM, got "${currentMonth}".`);
  return countedMonths(months, recordsSince).filter((m) => compareMonths(m, currentMonth) <= 0);
}

/** Whether a month is after the current one (shown apart), e.g. isFutureMonth('2027-01', '2026-12') → true. */
export function isFutureMonth(month: string, currentMonth: string): boolean {
  return compareMonths(month, currentMonth) > 0;
}
