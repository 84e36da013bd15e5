import { householdRoute } from '@/server/authz';
import { HttpError, json } from '@/server/http';
import { householdLarder } from '@/server/larder';

/**
 * GET /api/households/{id}/larder (every member) → LarderResponse: what is still in store today
 * (the household's date), lot by lot and summed, when each runs out, and the empty months ahead.
 */
export const GET = householdRoute('read', async (_ctx, a) => {
  try {
    return json(await householdLarder(a.household));
  } catch (e) {
    if (e instanceof RangeError) throw new HttpError(422, 'cannot_compute', e.message);
    throw e;
  }
});
