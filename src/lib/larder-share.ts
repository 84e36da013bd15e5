/**
 * A stored or preserved lot with larder records as the share report reads it: one group row per
 * eaten segment (eaten evenly by day over [from, until)) and one per lost part under the 'lost'
 * use, so spoiled food leaves "eaten" and shows among the losses. Every row keeps the harvest's own
 * month, so the uses of the harvest still add up to what was harvested that month.
 */
import { lotSchedule, type OutcomeRecord } from './larder';
import { monthOf } from './months';
import type { PreserveMethod } from './retention';
import type { GroupRow } from './share-groups';
import type { Use } from './uses';

/** One harvest with outcomes, as share-data.ts reads it. */
export interface OutcomeLot {
  date: string;
  use: Use;
  spread: number;
  preserveMethod: PreserveMethod | null;
  cropId: number | null;
  foodId: number | null;
  name: string | null;
  grams: number;
  edibleGrams: number;
}

/**
 * The group rows of a lot after its outcomes; the entry is counted once per use it ends up in,
 * e.g. lotGroupRows(potatoes, [{ kind: 'spoiled', date: '2026-12-01', lostFraction: 0.25 }]).map((r) => r.use) → ['stored', 'stored', 'lost'].
 */
export function lotGroupRows(lot: OutcomeLot, outcomes: readonly OutcomeRecord[]): GroupRow[] {
  const month = monthOf(lot.date);
  if (!(lot.edibleGrams > 0)) return [{ ...lot, month, entries: 1 }];
  const schedule = lotSchedule({ date: lot.date, spreadMonths: Math.max(1, lot.spread), edibleGrams: lot.edibleGrams }, outcomes);
  const wholeOf = (edible: number) => (lot.grams * edible) / lot.edibleGrams;
  const eaten: GroupRow[] = schedule.segments.map((s, i) => ({
    ...lot,
    month,
    eatenFrom: s.from,
    until: s.until,
    grams: wholeOf(s.edibleGrams),
    edibleGrams: s.edibleGrams,
    entries: i === 0 ? 1 : 0,
  }));
  const lost: GroupRow[] = schedule.lost.map((l, i) => ({
    month,
    date: `${month}-01`,
    use: 'lost',
    spread: 1,
    preserveMethod: null,
    cropId: lot.cropId,
    foodId: lot.foodId,
    name: lot.name,
    grams: wholeOf(l.edibleGrams),
    edibleGrams: l.edibleGrams,
    entries: i === 0 ? 1 : 0,
  }));
  return [...eaten, ...lost];
}
