import { gapsQuery } from '@/lib/gaps-schemas';
import { householdRoute } from '@/server/authz';
import { householdGaps } from '@/server/gaps';
import { HttpError, json } from '@/server/http';

/**
 * GET /api/households/{id}/gaps?year=YYYY: for each key nutrient the growing year's need, home
 * supply and shortfall, the months where the home share of need is lowest, the crops that supply
 * it on the least area and those that carry food into the lean months. `year` is the calendar
 * year the growing year starts in; without it, the growing year containing today.
 */
export const GET = householdRoute('read', async (ctx, a) => {
  const q = gapsQuery.parse({ year: ctx.url.searchParams.get('year') ?? undefined });
  try {
    return json(await householdGaps(a.household, q.year));
  } catch (e) {
    if (e instanceof RangeError) throw new HttpError(422, 'cannot_compute', e.message);
    throw e;
  }
});
