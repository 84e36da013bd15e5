import { householdRoute } from '@/server/authz';
import { idParam } from '@/server/entry-input';
import { deleteOutcome } from '@/server/larder-outcomes';

/** DELETE /api/households/{id}/larder/outcomes/{outcomeId} (owner, grower) → 204: undoes a mistaken record. */
export const DELETE = householdRoute('write', async (ctx, a) => {
  await deleteOutcome(a.household, idParam(ctx.params.outcomeId, 'larder record'));
  return new Response(null, { status: 204 });
});
