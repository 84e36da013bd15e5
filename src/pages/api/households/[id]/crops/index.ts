import { cropInput } from '@/lib/crop-schemas';
import { householdRoute } from '@/server/authz';
import { createCrop, listCrops } from '@/server/crops';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';

/** GET /api/households/{id}/crops[?includeArchived=1]: the crop catalogue, recently harvested first. */
export const GET = householdRoute('read', async (ctx, a) => {
  const flag = ctx.url.searchParams.get('includeArchived');
  const includeArchived = flag === '1' || flag === 'true';
  return json({ crops: await listCrops(a.household.id, { includeArchived }) });
});

/** POST /api/households/{id}/crops (owner, grower) → 201 { crop }; 409 when the name and variety exist. */
export const POST = householdRoute('write', async (ctx, a) => {
  const input = parseInput(cropInput, await readJson(ctx.request));
  return json({ crop: await createCrop(a.household.id, input) }, 201);
});
