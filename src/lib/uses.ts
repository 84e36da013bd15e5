/**
 * What happens to a harvest or a purchase: eaten fresh, stored, preserved, or not eaten at all
 * (seed, given, sold, lost). The list lives here, on its own, because the entry rules, the crop
 * kinds, the allocation over months and the database schema all need it and none of them owns it.
 */

/** What happens to a harvest or purchase. Example: `USES[0]` → 'fresh' */
export const USES = ['fresh', 'stored', 'preserved', 'seed', 'given', 'sold', 'lost'] as const;

export type Use = (typeof USES)[number];

/** Display names for the uses, in our own words. Example: `USE_LABELS.lost` → 'Lost or composted' */
export const USE_LABELS: Readonly<Record<Use, string>> = {
  fresh: 'Eaten fresh',
  stored: 'Stored (cellar, clamp, shelf)',
  preserved: 'Preserved (dried, frozen, bottled)',
  seed: 'Kept as seed',
  given: 'Given away',
  sold: 'Sold',
  lost: 'Lost or composted',
};

/** Uses the household eats. Example: `EATEN_USES.includes('stored')` → true */
export const EATEN_USES = ['fresh', 'stored', 'preserved'] as const satisfies readonly Use[];

/** Uses the household does not eat. Example: `NOT_EATEN_USES.includes('sold')` → true */
export const NOT_EATEN_USES = ['seed', 'given', 'sold', 'lost'] as const satisfies readonly Use[];

/** Uses whose food is eaten over several months. Example: `SPREAD_USES.includes('fresh')` → false */
export const SPREAD_USES = ['stored', 'preserved'] as const satisfies readonly Use[];

/** True for one of the uses (exact, lower case). Example: `isUse('stored')` → true */
export function isUse(value: unknown): value is Use {
  return typeof value === 'string' && (USES as readonly string[]).includes(value);
}

/** True when the household eats food with this use. Example: `isEatenUse('given')` → false */
export function isEatenUse(use: Use): boolean {
  return (EATEN_USES as readonly Use[]).includes(use);
}

/** True when food with this use is spread over months. Example: `isSpreadUse('preserved')` → true */
export function isSpreadUse(use: Use): boolean {
  return (SPREAD_USES as readonly Use[]).includes(use);
}
