import { stapleLogInput } from '@/lib/entry-schemas';
import { householdRoute } from '@/server/authz';
import { idParam, parseInput } from '@/server/entry-input';
import { readOptionalJson } from '@/server/http';
import { answerResponse, idempotencyKey, idempotent } from '@/server/idempotency';
import { logStaple } from '@/server/staples';

/** POST /api/households/{id}/staples/{stapleId}/log (owner, grower) { date? } → 201 { purchase }. Honours Idempotency-Key. */
export const POST = householdRoute('write', async (ctx, a) => {
  const stapleId = idParam(ctx.params.stapleId, 'staple');
  const key = idempotencyKey(ctx.request);
  const { date } = parseInput(stapleLogInput, await readOptionalJson(ctx.request));
  // Same kind as POST purchases: what is stored is bought food.
  return answerResponse(await idempotent(a.household.id, key, 'purchases', async (tx) => ({ status: 201, body: { purchase: await logStaple(tx, a.household, a.userId, stapleId, date) } })));
});
