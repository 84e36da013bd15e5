import { cropPinsInput } from '@/lib/crop-pins';
import { householdRoute } from '@/server/authz';
import { setCropPins } from '@/server/crops';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';

/**
 * PUT /api/households/{id}/crops/pins (owner, grower) body { cropIds: [first, second, …] } → { crops }:
 * the listed crops become the pinned chips in that order, every other crop unpinned, in one transaction.
 */
export const PUT = householdRoute('write', async (ctx, a) => {
  const { cropIds } = parseInput(cropPinsInput, await readJson(ctx.request));
  return json({ crops: await setCropPins(a.household.id, cropIds) });
});
