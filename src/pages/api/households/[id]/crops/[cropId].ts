import { cropPatch } from '@/lib/crop-schemas';
import { householdRoute } from '@/server/authz';
import { deleteCrop, getCrop, updateCrop } from '@/server/crops';
import { idParam, parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';

/** GET /api/households/{id}/crops/{cropId} → { crop } */
export const GET = householdRoute('read', async (ctx, a) => json({ crop: await getCrop(a.household.id, idParam(ctx.params.cropId, 'crop')) }));

/** PATCH /api/households/{id}/crops/{cropId} (owner, grower) → { crop }; a new food match carries into its harvests. */
export const PATCH = householdRoute('write', async (ctx, a) => {
  const cropId = idParam(ctx.params.cropId, 'crop');
  const patch = parseInput(cropPatch, await readJson(ctx.request));
  return json({ crop: await updateCrop(a.household.id, cropId, patch) });
});

/** DELETE /api/households/{id}/crops/{cropId} (owner, grower) → 204; 409 in_use while harvests or plantings point at it. */
export const DELETE = householdRoute('write', async (ctx, a) => {
  await deleteCrop(a.household.id, idParam(ctx.params.cropId, 'crop'));
  return new Response(null, { status: 204 });
});
