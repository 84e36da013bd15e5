import { bedPatch } from '@/lib/bed-schemas';
import { householdRoute } from '@/server/authz';
import { deleteBed, getBed, updateBed } from '@/server/beds';
import { idParam, parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';

/** GET /api/households/{id}/beds/{bedId} → { bed } */
export const GET = householdRoute('read', async (ctx, a) => json({ bed: await getBed(a.household, idParam(ctx.params.bedId, 'bed')) }));

/** PATCH /api/households/{id}/beds/{bedId} (owner, grower) → { bed } */
export const PATCH = householdRoute('write', async (ctx, a) => {
  const bedId = idParam(ctx.params.bedId, 'bed');
  const patch = parseInput(bedPatch, await readJson(ctx.request));
  return json({ bed: await updateBed(a.household, bedId, patch) });
});

/** DELETE /api/households/{id}/beds/{bedId} (owner, grower) → 204; its plantings stay, without a bed. */
export const DELETE = householdRoute('write', async (ctx, a) => {
  await deleteBed(a.household.id, idParam(ctx.params.bedId, 'bed'));
  return new Response(null, { status: 204 });
});
