import { householdRoute } from '@/server/authz';
import { idParam } from '@/server/entry-input';
import { json } from '@/server/http';
import { deleteStaple, getStaple } from '@/server/staples';

/** GET /api/households/{id}/staples/{stapleId} → { staple } */
export const GET = householdRoute('read', async (ctx, a) => json({ staple: await getStaple(a.household.id, idParam(ctx.params.stapleId, 'staple')) }));

/** DELETE /api/households/{id}/staples/{stapleId} (owner, grower) → 204; bought food logged from it stays. */
export const DELETE = householdRoute('write', async (ctx, a) => {
  await deleteStaple(a.household.id, idParam(ctx.params.stapleId, 'staple'));
  return new Response(null, { status: 204 });
});
