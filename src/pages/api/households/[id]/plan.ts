import { planRequest } from '@/lib/plan-schemas';
import { householdRoute } from '@/server/authz';
import { HttpError, json, readJson } from '@/server/http';
import { planInputFor } from '@/server/plan-inputs';
import { planPlanting } from '@/server/planner';

/**
 * POST /api/households/{id}/plan with { year, targets, basis?, maxAreaM2?, crops?, maxShareOfEnergyPerCrop? }:
 * the least added bed area of reference crops that lifts each target nutrient to its share of need
 * (over the growing year, or in every month), or the best achievable plan with the reasons a target
 * falls short. Planning changes nothing, so every member may ask.
 */
export const POST = householdRoute('read', async (ctx, a) => {
  const body = planRequest.parse(await readJson(ctx.request, 100_000));
  try {
    return json(await planPlanting(await planInputFor(a.household, body)));
  } catch (e) {
    // The pure code refuses what it cannot count (a person older than the tables, a bad frost date…) with a sentence.
    if (e instanceof RangeError) throw new HttpError(422, 'cannot_compute', e.message);
    throw e;
  }
});
