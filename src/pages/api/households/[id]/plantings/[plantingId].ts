import { plantingPatch } from '@/lib/bed-schemas';
import { householdRoute } from '@/server/authz';
import { idParam, parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';
import { deletePlanting, getPlanting, updatePlanting } from '@/server/plantings';

/** GET /api/households/{id}/plantings/{plantingId} → { planting } */
export const GET = householdRoute('read', async (ctx, a) => json({ planting: await getPlanting(a.household, idParam(ctx.params.plantingId, 'planting')) }));

/** PATCH /api/households/{id}/plantings/{plantingId} (owner, grower) → { planting } */
export const PATCH = householdRoute('write', async (ctx, a) => {
  const plantingId = idParam(ctx.params.plantingId, 'planting');
  const patch = parseInput(plantingPatch, await readJson(ctx.request));
  return json({ planting: await updatePlanting(a.household, plantingId, patch) });
});

/** DELETE /api/households/{id}/plantings/{plantingId} (owner, grower) → 204; harvests naming it keep their weight. */
export const DELETE = householdRoute('write', async (ctx, a) => {
  await deletePlanting(a.household.id, idParam(ctx.params.plantingId, 'planting'));
  return new Response(null, { status: 204 });
});
