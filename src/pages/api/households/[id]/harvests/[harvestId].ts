import { harvestPatch } from '@/lib/entry-schemas';
import { householdRoute } from '@/server/authz';
import { idParam, parseInput } from '@/server/entry-input';
import { deleteHarvest, getHarvest, updateHarvest } from '@/server/harvests';
import { json, readJson } from '@/server/http';

/** GET /api/households/{id}/harvests/{harvestId} → { harvest } */
export const GET = householdRoute('read', async (ctx, a) => json({ harvest: await getHarvest(a.household.id, idParam(ctx.params.harvestId, 'harvest')) }));

/** PATCH /api/households/{id}/harvests/{harvestId} (owner, grower) → { harvest }, grams and edible grams worked out again. */
export const PATCH = householdRoute('write', async (ctx, a) => {
  const harvestId = idParam(ctx.params.harvestId, 'harvest');
  const patch = parseInput(harvestPatch, await readJson(ctx.request));
  return json({ harvest: await updateHarvest(a.household.id, harvestId, patch) });
});

/** DELETE /api/households/{id}/harvests/{harvestId} (owner, grower) → 204 */
export const DELETE = householdRoute('write', async (ctx, a) => {
  await deleteHarvest(a.household.id, idParam(ctx.params.harvestId, 'harvest'));
  return new Response(null, { status: 204 });
});
