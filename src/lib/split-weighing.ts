/**
 * A split weighing: one harvest weighed once and divided between uses (20 kg stored, 2 kg eaten
 * fresh) is stored as one entry per part, sharing a split group id. These are the rules that keep
 * the parts one weighing when a part is changed or deleted, and the grouping the harvest log shows.
 *
 * - One weighing is one crop (or reference food), from one planting, on one day: changing a part's
 *   crop, food, planting or date changes every part of the group.
 * - A part's amount (quantity and unit), use, months in store, preserving method, trimmed and note
 *   are its own: changing them changes that part only.
 * - Deleting a part keeps the others; when a single part is left it is an ordinary harvest again
 *   (its split group is cleared).
 */

/** The fields one weighing shares across its parts. */
export const SPLIT_SHARED_FIELDS = ['cropId', 'foodId', 'plantingId', 'date'] as const;

type SharedField = (typeof SPLIT_SHARED_FIELDS)[number];

/**
 * The part of a patch that every part of the group takes (crop, food, planting, date), or undefined
 * when the patch changes only the edited part.
 * Example: `sharedSplitPatch({ date: '2026-09-21', use: 'fresh' })` → { date: '2026-09-21' };
 *   `sharedSplitPatch({ quantity: 3 })` → undefined
 */
export function sharedSplitPatch<P extends object>(patch: P): Partial<P> | undefined {
  const shared: Record<string, unknown> = {};
  for (const key of SPLIT_SHARED_FIELDS) {
    const value = (patch as Partial<Record<SharedField, unknown>>)[key];
    if (value !== undefined) shared[key] = value;
  }
  return Object.keys(shared).length > 0 ? (shared as Partial<P>) : undefined;
}

/**
 * What happens to the group of a deleted part, given how many parts are left.
 * Example: `groupAfterDelete(2)` → 'keep'; `groupAfterDelete(1)` → 'clear'; `groupAfterDelete(0)` → 'gone'
 */
export function groupAfterDelete(partsLeft: number): 'keep' | 'clear' | 'gone' {
  if (partsLeft >= 2) return 'keep';
  return partsLeft === 1 ? 'clear' : 'gone';
}

/** An entry as far as the grouping needs it. */
export interface SplitRowLike {
  id: number;
  splitGroup: string | null;
  grams: number;
}

/** A line of the harvest log: one entry, or one split weighing with its parts (in list order). */
export type WeighingLine<T extends SplitRowLike> = { kind: 'single'; entry: T } | { kind: 'split'; group: string; parts: T[]; grams: number };

/**
 * The list's rows as weighings: the parts of a split group become one line where its first part
 * stands, with the grams of its parts on the page summed. Entries without a group stay as they are.
 * Example: rows a(g1, 20 000 g), b(–), c(g1, 2 000 g) → [split g1 [a, c] 22 000 g, single b]
 */
export function groupWeighings<T extends SplitRowLike>(rows: readonly T[]): WeighingLine<T>[] {
  const lines: WeighingLine<T>[] = [];
  const byGroup = new Map<string, Extract<WeighingLine<T>, { kind: 'split' }>>();
  for (const row of rows) {
    if (row.splitGroup === null) {
      lines.push({ kind: 'single', entry: row });
      continue;
    }
    const line = byGroup.get(row.splitGroup);
    if (line) {
      line.parts.push(row);
      line.grams += row.grams;
    } else {
      const fresh = { kind: 'split' as const, group: row.splitGroup, parts: [row], grams: row.grams };
      byGroup.set(row.splitGroup, fresh);
      lines.push(fresh);
    }
  }
  return lines;
}

/**
 * The split groups of a page of the log, each once, in the order they first appear.
 * Example: rows a(g1), b(–), c(g2), d(g1) → ['g1', 'g2']
 */
export function splitGroupsOf(rows: readonly Pick<SplitRowLike, 'splitGroup'>[]): string[] {
  return [...new Set(rows.flatMap((r) => (r.splitGroup === null ? [] : [r.splitGroup])))];
}

/**
 * A page of the log made whole: the parts of its split weighings that fell on another page
 * (`parts`, every part of the page's groups) are added after the page's rows, each entry once, so
 * that groupWeighings shows every weighing whole where its first part on the page stands.
 * Example: page [a(g1), b(–)], parts [a(g1), z(g1)] → [a, b, z]
 */
export function withMissingParts<T extends SplitRowLike>(page: readonly T[], parts: readonly T[]): T[] {
  const onPage = new Set(page.map((r) => r.id));
  const groups = new Set(splitGroupsOf(page));
  return [...page, ...parts.filter((p) => !onPage.has(p.id) && p.splitGroup !== null && groups.has(p.splitGroup))];
}
