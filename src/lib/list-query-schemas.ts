/**
 * The list queries of the harvest log and bought food: URL search parameters (everything arrives
 * as a string, blank means absent) checked into filters, sort and page, by the endpoints and the
 * tables alike.
 */
import { z } from 'zod';
import { mustBeNumber, mustBeWhole, oneOf } from './zod-messages';
import { ENTRY_LIMITS, isoDate, recordId, use } from './entry-schemas';

const L = ENTRY_LIMITS;

const blankToUndefined = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? undefined : value);

const queryId = z.preprocess(
  blankToUndefined,
  z.coerce.number({ error: 'An id is a whole number.' }).pipe(recordId).optional(),
);
const queryDate = z.preprocess(blankToUndefined, isoDate.optional());
const page = z.preprocess(
  blankToUndefined,
  z.coerce.number({ error: mustBeNumber('The page') }).int({ error: mustBeWhole('The page') }).min(1, { error: 'Pages start at 1.' }).default(1),
);
const pageSize = z.preprocess(
  blankToUndefined,
  z.coerce
    .number({ error: mustBeNumber('The page size') })
    .int({ error: mustBeWhole('The page size') })
    .min(1, { error: 'The page size must be at least 1.' })
    .max(L.maxPageSize, { error: `The page size can be at most ${L.maxPageSize}.` })
    .default(L.defaultPageSize),
);

// Split weighings by their group ids, comma-separated (the harvest log fetches the parts of a
// weighing that fall on another page). At most one group per row of the largest page.
const splitGroups = z.preprocess(
  blankToUndefined,
  z
    .string({ error: 'List split groups as ids separated by commas.' })
    .transform((s) => s.split(',').map((g) => g.trim()).filter((g) => g !== ''))
    .pipe(
      z
        .array(z.string().regex(/^[0-9a-f-]{36}$/i, { error: 'A split group is a 36-character id, as the harvests answer it.' }))
        .max(L.maxPageSize, { error: `At most ${L.maxPageSize} split groups at once.` }),
    )
    .optional(),
);

function checkDateOrder(value: { from?: string | undefined; to?: string | undefined }, ctx: z.RefinementCtx): void {
  // ISO dates compare correctly as strings.
  if (value.from !== undefined && value.to !== undefined && value.from > value.to) {
    ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end date is before the start date.' });
  }
}

/** Orders a harvest list can take ('-' = descending; the default is -date, newest first). Example: `HARVEST_SORTS[1]` → '-date' */
export const HARVEST_SORTS = ['date', '-date', 'grams', '-grams', 'crop'] as const;

/** Orders a bought-food list can take. Example: `PURCHASE_SORTS[4]` → 'food' */
export const PURCHASE_SORTS = ['date', '-date', 'grams', '-grams', 'food'] as const;

export type HarvestSort = (typeof HARVEST_SORTS)[number];
export type PurchaseSort = (typeof PURCHASE_SORTS)[number];

/**
 * Filters for listing harvests, read from URL search parameters (both ends of from/to included).
 * Example: `harvestQuery.parse(Object.fromEntries(new URLSearchParams('use=stored&page=2')))`
 *   → { use: 'stored', page: 2, pageSize: 50 }
 */
export const harvestQuery = z
  .object({
    from: queryDate,
    to: queryDate,
    cropId: queryId,
    foodId: queryId,
    use: z.preprocess(blankToUndefined, use.optional()),
    splitGroup: splitGroups,
    sort: z.preprocess(blankToUndefined, z.enum(HARVEST_SORTS, { error: oneOf('The sort', HARVEST_SORTS) }).optional()),
    page,
    pageSize,
  })
  .superRefine(checkDateOrder);

export type HarvestQuery = z.output<typeof harvestQuery>;

/** Filters for listing bought food. Example: `purchaseQuery.parse({ from: '2026-01-01' })` → { from: '2026-01-01', page: 1, pageSize: 50 } */
export const purchaseQuery = z
  .object({
    from: queryDate,
    to: queryDate,
    foodId: queryId,
    sort: z.preprocess(blankToUndefined, z.enum(PURCHASE_SORTS, { error: oneOf('The sort', PURCHASE_SORTS) }).optional()),
    page,
    pageSize,
  })
  .superRefine(checkDateOrder);

export type PurchaseQuery = z.output<typeof purchaseQuery>;
