/**
 * Sending the monthly letters, at most once each, with any number of app servers (or a CLI run
 * beside them) on one database — a Galera cluster included.
 *
 * Each letter (household, month, member) is first CLAIMED: a row is inserted into `letters` under
 * its unique key with status 'sending' and this run's random id. A duplicate key means another run
 * has it, and it is skipped — except a 'failed' row, which is re-claimed by a conditional UPDATE
 * whose affected-row count says who won. Only then is the mail sent; afterwards the row becomes
 * 'sent' (or 'failed' with the SMTP error, tried again by the next run, at most MAX_ATTEMPTS times).
 * A unique-key insert is certified cluster-wide on Galera, where GET_LOCK is local to one node; a
 * deadlock or certification conflict on the claim means "not ours". A row left 'sending' by a crash
 * is never sent again by itself (the mail may have gone out): the CLI lists it as uncertain.
 */
import { randomUUID } from 'node:crypto';
import { and, eq, inArray, lt, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { households, letters, type Household, type Letter } from '@/db/schema';
import { dueLetterMonthIn } from '@/lib/letter-due';
import { letterText } from '@/lib/letter-text';
import { isDuplicateKey, isRetryableLock } from './db-errors';
import { householdLetterFigures, letterRecipients, memberLetterData, type LetterRecipient } from './letter-data';
import { sendMail } from './mail';

/** A failed letter is tried again by later runs until it has been tried this many times. */
export const MAX_ATTEMPTS = 5;
/** A 'sending' row older than this was left by a run that stopped midway: uncertain, not in progress. */
export const UNCERTAIN_AFTER_MS = 15 * 60_000;

export interface LetterRef {
  householdId: number;
  householdName: string;
  month: string;
  email: string;
}

export interface LetterRunResult {
  runId: string;
  sent: LetterRef[];
  failed: (LetterRef & { error: string })[];
  /** Letters already sent, being sent by another run, or given up after MAX_ATTEMPTS. */
  skipped: number;
  /** Left 'sending' by a run that stopped midway: they may or may not have gone out. */
  uncertain: LetterRef[];
  /** Households with members to write to but nothing eaten in the month: no letter. */
  quietHouseholds: number;
}

export interface LetterRunOptions {
  /** Only these households (an operator re-running one household; the tests). */
  householdIds?: readonly number[];
  /** The instant the figures are reckoned at (default: now). */
  now?: Date;
  /** Called with one line per letter sent or failed. */
  log?: (line: string) => void;
}

interface Run {
  result: LetterRunResult;
  now: Date;
  log: (line: string) => void;
}

function newRun(opts: LetterRunOptions): Run {
  return {
    result: { runId: randomUUID(), sent: [], failed: [], skipped: 0, uncertain: [], quietHouseholds: 0 },
    now: opts.now ?? new Date(),
    log: opts.log ?? (() => {}),
  };
}

async function householdsFor(ids: readonly number[] | undefined): Promise<Household[]> {
  const db = getDb();
  if (ids && ids.length === 0) return [];
  const q = db.select().from(households);
  return ids ? q.where(inArray(households.id, [...ids])).orderBy(households.id) : q.orderBy(households.id);
}

/**
 * Claims one letter for this run: the id of its row when ours to send, null when another run has
 * it (or it is sent, or given up). Never sends anything itself.
 */
export async function claimLetter(householdId: number, userId: string, month: string, runId: string): Promise<number | null> {
  const db = getDb();
  try {
    const [r] = await db.insert(letters).values({ householdId, userId, month, status: 'sending', claimedBy: runId, attempts: 1 });
    return r.insertId;
  } catch (e) {
    // A Galera certification conflict arrives as a deadlock: someone else's insert won.
    if (isRetryableLock(e)) return null;
    if (!isDuplicateKey(e)) throw e;
  }
  const [row] = await db
    .select({ id: letters.id, status: letters.status, attempts: letters.attempts })
    .from(letters)
    .where(and(eq(letters.householdId, householdId), eq(letters.month, month), eq(letters.userId, userId)));
  if (!row || row.status !== 'failed' || row.attempts >= MAX_ATTEMPTS) return null;
  try {
    const [u] = await db
      .update(letters)
      .set({ status: 'sending', claimedBy: runId, attempts: sql`${letters.attempts} + 1`, claimedAt: sql`CURRENT_TIMESTAMP`, error: null })
      .where(and(eq(letters.id, row.id), eq(letters.status, 'failed'), lt(letters.attempts, MAX_ATTEMPTS)));
    return u.affectedRows === 1 ? row.id : null;
  } catch (e) {
    if (isRetryableLock(e)) return null;
    throw e;
  }
}

async function markSent(id: number, runId: string): Promise<void> {
  await getDb()
    .update(letters)
    .set({ status: 'sent', sentAt: sql`CURRENT_TIMESTAMP`, error: null })
    .where(and(eq(letters.id, id), eq(letters.claimedBy, runId)));
}

async function markFailed(id: number, runId: string, error: string): Promise<void> {
  await getDb()
    .update(letters)
    .set({ status: 'failed', error: error.slice(0, 500) })
    .where(and(eq(letters.id, id), eq(letters.claimedBy, runId)));
}

function errorText(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}

/** The members whose letter this run should try, counting the others as skipped or uncertain. */
function lettersToTry(run: Run, household: Household, month: string, recipients: LetterRecipient[], existing: Letter[]): LetterRecipient[] {
  const byUser = new Map(existing.map((l) => [l.userId, l]));
  return recipients.filter((r) => {
    const row = byUser.get(r.userId);
    if (!row || (row.status === 'failed' && row.attempts < MAX_ATTEMPTS)) return true;
    if (row.status === 'sending' && Date.now() - row.claimedAt.getTime() > UNCERTAIN_AFTER_MS) {
      run.result.uncertain.push({ householdId: household.id, householdName: household.name, month, email: r.email });
    } else {
      run.result.skipped += 1;
    }
    return false;
  });
}

/** Sends one household's letters for `month` to every opted-in member not yet written to. */
async function sendHouseholdLetters(run: Run, household: Household, month: string): Promise<void> {
  const recipients = await letterRecipients(household.id);
  if (recipients.length === 0) return;
  const existing = await getDb()
    .select()
    .from(letters)
    .where(and(eq(letters.householdId, household.id), eq(letters.month, month)));
  const pending = lettersToTry(run, household, month, recipients, existing);
  if (pending.length === 0) return;

  const ref = (r: LetterRecipient): LetterRef => ({ householdId: household.id, householdName: household.name, month, email: r.email });
  let figures;
  try {
    figures = await householdLetterFigures(household, month, run.now);
  } catch (e) {
    // Nothing was claimed: the next run tries the whole household again.
    for (const r of pending) run.result.failed.push({ ...ref(r), error: `the letter could not be written: ${errorText(e)}` });
    return;
  }
  if (!figures) {
    run.result.quietHouseholds += 1;
    return;
  }
  for (const r of pending) {
    const id = await claimLetter(household.id, r.userId, month, run.result.runId);
    if (id === null) {
      run.result.skipped += 1;
      continue;
    }
    const data = memberLetterData(household, month, figures, r.userId);
    const body = letterText(data);
    try {
      await sendMail({
        to: r.email,
        ...body,
        // RFC 2369 and RFC 8058: mail programs offer a one-click "unsubscribe" that POSTs to the link.
        headers: { 'List-Unsubscribe': `<${data.links.unsubscribe}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
      });
    } catch (e) {
      await markFailed(id, run.result.runId, errorText(e));
      run.result.failed.push({ ...ref(r), error: errorText(e) });
      run.log(`failed ${month} to ${r.email} for ${household.name}: ${errorText(e)}`);
      continue;
    }
    await markSent(id, run.result.runId);
    run.result.sent.push(ref(r));
    run.log(`sent ${month} to ${r.email} for ${household.name}`);
  }
}

/** Sends the letters of `month` ('YYYY-MM') for every household (or those in opts), whatever the date. */
export async function sendLettersFor(month: string, opts: LetterRunOptions = {}): Promise<LetterRunResult> {
  const run = newRun(opts);
  for (const h of await householdsFor(opts.householdIds)) await sendHouseholdLetters(run, h, month);
  return run.result;
}

/**
 * Sends every letter due at `now`: last month's, for each household whose local date is in the
 * first LETTER_DUE_LAST_DAY days of a month (src/lib/letter-due.ts). What the scheduler runs hourly.
 */
export async function sendDueLetters(now: Date, opts: Omit<LetterRunOptions, 'now'> = {}): Promise<LetterRunResult> {
  const run = newRun({ ...opts, now });
  for (const h of await householdsFor(opts.householdIds)) {
    const month = dueLetterMonthIn(h.timezone, now);
    if (month) await sendHouseholdLetters(run, h, month);
  }
  return run.result;
}
