/**
 * What a household's Overview picks from the reports it already has: the next steps of a new
 * household, ticked from its own records, and the gap to mind next. Nothing is computed here
 * that the share, gaps or larder reports do not already say; this only chooses what to show.
 */

export interface StepCounts {
  people: number;
  crops: number;
  harvests: number;
  /** The home share of need is known for some nutrient (people, and a harvest matched to a food). */
  shareKnown: boolean;
}

export interface NextStep {
  key: 'people' | 'crops' | 'harvest' | 'share';
  label: string;
  /** Path after /households/{id}. */
  path: string;
  done: boolean;
}

/**
 * A new household's steps in order — who eats, what grows, the first harvest, the home share —
 * each done when the records say so.
 * @example nextSteps({ people: 2, crops: 0, harvests: 0, shareKnown: false }).map((s) => s.done) // [true, false, false, false]
 */
export function nextSteps(c: StepCounts): NextStep[] {
  return [
    { key: 'people', label: 'Add the people who eat here', path: '/people', done: c.people > 0 },
    { key: 'crops', label: 'List the crops you grow', path: '/crops', done: c.crops > 0 },
    { key: 'harvest', label: 'Log your first harvest', path: '/log', done: c.harvests > 0 },
    { key: 'share', label: 'See your home share', path: '/share', done: c.harvests > 0 && c.shareKnown },
  ];
}

export interface GapCandidate {
  name: string;
  shareOfNeed: number | null;
  shortfall: number | null;
  months: { month: string; shareOfNeed: number | null; counted: boolean }[];
}

export interface NextGap {
  name: string;
  shareOfNeed: number;
  /** The leanest month of this nutrient from the current month on, else the leanest of the year; null when none has a share. */
  month: string | null;
}

/**
 * The nutrient furthest from need over the year (a shortfall, the lowest home share of need),
 * with its leanest month still ahead when there is one; null when no nutrient falls short.
 * @example nextGap([{ name: 'Vitamin C', shareOfNeed: 0.4, shortfall: 9000, months: [] }], '2026-11')?.name // 'Vitamin C'
 */
export function nextGap(nutrients: readonly GapCandidate[], currentMonth: string): NextGap | null {
  const short = nutrients.filter((n) => n.shortfall !== null && n.shortfall > 0 && n.shareOfNeed !== null);
  if (short.length === 0) return null;
  const worst = short.reduce((a, b) => (b.shareOfNeed! < a.shareOfNeed! ? b : a));
  const withShare = worst.months.filter((m) => m.shareOfNeed !== null);
  const leanest = (ms: typeof withShare) => (ms.length ? ms.reduce((a, b) => (b.shareOfNeed! < a.shareOfNeed! ? b : a)).month : null);
  const ahead = withShare.filter((m) => m.month >= currentMonth);
  return { name: worst.name, shareOfNeed: worst.shareOfNeed!, month: leanest(ahead) ?? leanest(withShare) };
}
