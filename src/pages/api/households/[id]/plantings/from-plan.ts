import { fromPlanInput } from '@/lib/bed-schemas';
import { householdRoute } from '@/server/authz';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';
import { plantingsFromPlan } from '@/server/plantings';

/**
 * POST /api/households/{id}/plantings/from-plan (owner, grower) { year, crops: [{ cropKey, areaM2 }] }
 * → 201 { plantings }: a plan's crops as plantings in one transaction, household crops added where missing.
 */
export const POST = householdRoute('write', async (ctx, a) => {
  const input = parseInput(fromPlanInput, await readJson(ctx.request));
  return json({ plantings: await plantingsFromPlan(a.household, input) }, 201);
});
