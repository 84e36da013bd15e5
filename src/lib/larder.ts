/**
 * The larder's arithmetic: how a stored or preserved lot is eaten once the grower has recorded what
 * really happened to it. A lot of G edible grams from day d0 is eaten evenly per day over
 * [d0, end0), end0 = d0 + spreadMonths months (date-fns addMonths, as spread.ts). Outcomes apply in
 * date order, each on its day r to what remained that morning, R(r), under the schedule so far:
 *
 * - used_up(r): R(r) is eaten on day r; the first day with nothing left is r + 1.
 * - lasted_longer(r, until e > r): R(r) is eaten evenly over [r, e) instead.
 * - spoiled(r, f ∈ (0, 1], default 1): f·R(r) is lost that morning (not eaten); the rest goes on
 *   being eaten evenly over [r, current end). With f = 1 the lot is empty from day r.
 *
 * The result is the lot's eaten segments (each evenly by day over [from, until)) and its lost
 * parts, from which the share report allocates and the larder page reads what is left on any day.
 * "Remaining on day t" is what is in store that morning, before the day's eating.
 */
import { ENTRY_LIMITS } from './entry-schemas';
import type { LarderOutcomeKind } from './larder-outcomes';
import { addDays, daysBetween, monthOf, addMonths as addMonthsTo } from './months';
import { spreadEnd } from './spread';

/** What the model needs of a lot. */
export interface LotBasis {
  /** 'YYYY-MM-DD' it went into store. */
  date: string;
  spreadMonths: number;
  edibleGrams: number;
}

/** One recorded outcome, as stored. */
export interface OutcomeRecord {
  id?: number;
  kind: LarderOutcomeKind;
  date: string;
  lostFraction?: number | null;
  until?: string | null;
}

/** Grams eaten evenly per day over [from, until). */
export interface EatenSegment {
  from: string;
  until: string;
  edibleGrams: number;
}

/** Grams lost (spoiled or thrown out) on a day. */
export interface LostPart {
  date: string;
  edibleGrams: number;
}

export interface LotSchedule {
  segments: EatenSegment[];
  lost: LostPart[];
  /** The first day with nothing left. */
  runsOut: string;
}

/** An outcome that cannot apply to its lot; `outcomeId` names the stored one when there is one. */
export class LarderOutcomeError extends RangeError {
  constructor(
    message: string,
    readonly outcomeId?: number,
  ) {
    super(message);
    this.name = 'LarderOutcomeError';
  }
}

/** Below this share of a lot, what remains counts as nothing (floating-point dust). */
const DUST = 1e-9;

/** The latest day a lot may be eaten up by: ENTRY_LIMITS.maxSpreadMonths after it went into store. */
export function latestEnd(lotDate: string): string {
  return spreadEnd(lotDate, ENTRY_LIMITS.maxSpreadMonths);
}

interface Running {
  from: string;
  until: string;
  grams: number;
}

/** Grams of a running segment not yet eaten on the morning of `day` (from ≤ day). */
function leftOf(run: Running, day: string): number {
  if (day >= run.until) return 0;
  if (day <= run.from) return run.grams;
  return (run.grams * daysBetween(day, run.until)) / daysBetween(run.from, run.until);
}

/**
 * The eaten segments, lost parts and run-out day of a lot after its outcomes (any order; applied
 * by date, then id). `today`, when given, refuses outcomes dated after it. Throws
 * LarderOutcomeError for an outcome before the lot, after today, past the lot's 24-month limit,
 * or on a day with nothing left (naming the day it ran out),
 * e.g. lotSchedule({ date: '2026-10-01', spreadMonths: 3, edibleGrams: 9200 }, [{ kind: 'used_up', date: '2026-11-15' }]).runsOut → '2026-11-16'.
 */
export function lotSchedule(lot: LotBasis, outcomes: readonly OutcomeRecord[], options: { today?: string } = {}): LotSchedule {
  if (!Number.isFinite(lot.edibleGrams) || lot.edibleGrams < 0) throw new RangeError(`edible grams must be a number ≥ 0, got ${lot.edibleGrams}`);
  const segments: EatenSegment[] = [];
  const lost: LostPart[] = [];
  let run: Running | null = { from: lot.date, until: spreadEnd(lot.date, lot.spreadMonths), grams: lot.edibleGrams };
  // How the lot came to an end so far, for the message when a later outcome finds nothing left.
  let ended = '';
  let runsOut = run.until;
  const ordered = [...outcomes].sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : (a.id ?? 0) - (b.id ?? 0)));
  for (const o of ordered) {
    const r = o.date;
    if (r < lot.date) throw new LarderOutcomeError(`The lot went into store on ${lot.date}, so nothing can have happened to it on ${r}.`, o.id);
    if (options.today && r > options.today) {
      throw new LarderOutcomeError(`${r} is after today (${options.today}): record what has happened, not what is expected.`, o.id);
    }
    const left: number = run ? leftOf(run, r) : 0;
    if (!run || left <= DUST * Math.max(lot.edibleGrams, 1)) {
      const why = ended || `the last of it was eaten on ${addDays(runsOut, -1)}`;
      throw new LarderOutcomeError(`Nothing of this lot was left on ${r}: ${why}.`, o.id);
    }
    if (r > run.from) segments.push({ from: run.from, until: r, edibleGrams: run.grams - left });
    if (o.kind === 'used_up') {
      segments.push({ from: r, until: addDays(r, 1), edibleGrams: left });
      run = null;
      runsOut = addDays(r, 1);
      ended = `it was used up on ${r}`;
    } else if (o.kind === 'lasted_longer') {
      const until = o.until;
      if (!until || until <= r) throw new LarderOutcomeError(`A lot that lasts longer needs a new end after ${r}.`, o.id);
      const latest = latestEnd(lot.date);
      if (until > latest) {
        throw new LarderOutcomeError(
          `A lot can last at most ${ENTRY_LIMITS.maxSpreadMonths} months from the day it went into store (${lot.date}): the latest end is ${latest}.`,
          o.id,
        );
      }
      run = { from: r, until, grams: left };
      runsOut = until;
    } else {
      const fraction = o.lostFraction ?? 1;
      if (!(fraction > 0 && fraction <= 1)) throw new LarderOutcomeError(`The share lost must be more than 0 and at most 1, got ${fraction}.`, o.id);
      lost.push({ date: r, edibleGrams: fraction * left });
      const rest = (1 - fraction) * left;
      if (rest <= DUST * Math.max(lot.edibleGrams, 1)) {
        run = null;
        runsOut = r;
        ended = `the rest of it was lost on ${r}`;
      } else run = { from: r, until: run.until, grams: rest };
    }
  }
  if (run) segments.push({ from: run.from, until: run.until, edibleGrams: run.grams });
  return { segments: segments.filter((s) => s.edibleGrams > 0), lost, runsOut };
}

/**
 * Edible grams still in store on the morning of `day`: the uneaten part of every segment and
 * every loss still to come, e.g. remainingOn(lotSchedule(lot, []), lot.date) → lot.edibleGrams.
 */
export function remainingOn(schedule: LotSchedule, day: string): number {
  let left = 0;
  for (const s of schedule.segments) left += leftOf({ from: s.from, until: s.until, grams: s.edibleGrams }, day);
  for (const l of schedule.lost) if (l.date > day) left += l.edibleGrams;
  return left;
}

/** Edible grams recorded as lost up to and including `day`. */
export function lostBy(schedule: LotSchedule, day: string): number {
  return schedule.lost.filter((l) => l.date <= day).reduce((sum, l) => sum + l.edibleGrams, 0);
}

/**
 * The months of the next `count` (this month included) in which no lot has anything left to eat:
 * a month is empty when every lot runs out on or before its first day,
 * e.g. emptyMonths(['2027-02-10'], '2026-12-05', 4) → ['2027-03'].
 */
export function emptyMonths(runsOut: readonly string[], today: string, count = 12): string[] {
  const last = runsOut.reduce((a, b) => (b > a ? b : a), '');
  const start = monthOf(today);
  const out: string[] = [];
  for (let i = 0; i < count; i++) {
    const month = addMonthsTo(start, i);
    if (last <= `${month}-01`) out.push(month);
  }
  return out;
}
