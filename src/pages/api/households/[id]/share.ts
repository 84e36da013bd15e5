import { acceptsGzip } from '@/lib/accept-encoding';
import { growingYear } from '@/lib/growing-year';
import { shareQuery } from '@/lib/share-query';
import { householdRouteWith } from '@/server/authz';
import { HttpError, jsonText } from '@/server/http';
import { currentMonth } from '@/server/people';
import { householdShareJson, requestKey, storedAnswerColumns } from '@/server/share-cache';

const askedKey = (url: URL) => requestKey(url.searchParams.get('from'), url.searchParams.get('to'));

/**
 * GET /api/households/{id}/share?from=YYYY-MM&to=YYYY-MM: the home share per month and nutrient,
 * totals, the FAO self-sufficiency ratio, the crops that supplied most and the harvest's uses.
 * Without a range: the household's growing year containing today (in its time zone). Answers are
 * stored and sent again until a write changes what they rest on (share-cache.ts), gzip-compressed
 * to a client that accepts it; the stored one is looked up in the membership check's own query.
 */
export const GET = householdRouteWith(
  'read',
  { columns: storedAnswerColumns, values: (ctx) => ({ answerKey: askedKey(ctx.url), gzip: acceptsGzip(ctx.request.headers.get('accept-encoding')) ? 1 : 0 }) },
  async (ctx, a, stored) => {
    const params = ctx.url.searchParams;
    const q = shareQuery.parse({ from: params.get('from') ?? undefined, to: params.get('to') ?? undefined });
    const now = new Date();
    const month = currentMonth(a.household.timezone, now);
    const range = q.from && q.to ? { from: q.from, to: q.to } : growingYear(month, a.household.yearStartMonth);
    try {
      const answer = await householdShareJson(a.household, { ...range, currentMonth: month }, askedKey(ctx.url), stored, now);
      // A stored answer goes out compressed to a client that takes gzip (every browser does).
      // A new answer is stored once it has gone out.
      return jsonText(answer.body, 200, answer.gzip ? { 'content-encoding': 'gzip', vary: 'Accept-Encoding' } : { vary: 'Accept-Encoding' }, answer.store);
    } catch (e) {
      // The pure code refuses what it cannot count (a person older than the tables, …) with a sentence.
      if (e instanceof RangeError) throw new HttpError(422, 'cannot_compute', e.message);
      throw e;
    }
  },
);
