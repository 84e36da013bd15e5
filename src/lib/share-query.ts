/**
 * The months a share report may be asked for: `from` and `to` as 'YYYY-MM', both included, `to`
 * not before `from`, at most 120 months (10 years). Either end alone asks for the 12 months that
 * start (or end) there; neither asks for the household's default range.
 */
import { z } from 'zod';
import { addMonths, isMonth, listMonths, MAX_RANGE_MONTHS } from './months';

/** Years a report can reach (the entries' own limits). Example: `SHARE_YEARS.min` → 1900 */
export const SHARE_YEARS = { min: 1900, max: 2199 } as const;

const month = z
  .string({ error: 'Give the month as YYYY-MM.' })
  .trim()
  .refine(isMonth, { error: 'Write the month as YYYY-MM with a month from 01 to 12, for example 2026-03.', abort: true })
  .refine((m) => Number(m.slice(0, 4)) >= SHARE_YEARS.min && Number(m.slice(0, 4)) <= SHARE_YEARS.max, {
    error: `The year must be between ${SHARE_YEARS.min} and ${SHARE_YEARS.max}.`,
  });

/**
 * Query parameters of GET …/share, e.g. shareQuery.parse({ from: '2026-01' }) → { from: '2026-01', to: '2026-12' };
 * shareQuery.parse({}) → {} (the caller fills in its default).
 */
export const shareQuery = z
  .object({ from: month.optional(), to: month.optional() })
  .transform((q) => {
    if (q.from && !q.to) return { from: q.from, to: addMonths(q.from, 11) };
    if (q.to && !q.from) return { from: addMonths(q.to, -11), to: q.to };
    return q;
  })
  .superRefine((q, ctx) => {
    if (!q.from || !q.to) return;
    if (q.to < q.from) {
      ctx.addIssue({ code: 'custom', path: ['to'], message: `The range ends (${q.to}) before it starts (${q.from}).` });
      return;
    }
    try {
      listMonths(q.from, q.to);
    } catch {
      ctx.addIssue({ code: 'custom', path: ['to'], message: `A report covers at most ${MAX_RANGE_MONTHS} months (10 years).` });
    }
  });

export type ShareQuery = z.output<typeof shareQuery>;
