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
  const body = await readOptionalJson(ctx.request);
  const { date } = parseInput(stapleLogInput, body);
  // Same kind as POST purchases: what is stored is bought food. The path names the staple.
  const keyed = { householdId: a.household.id, userId: a.userId, route: 'purchases', path: ctx.url.pathname, body };
  return answerResponse(await idempotent(keyed, key, async (tx) => ({ status: 201, body: { purchase: await logStaple(tx, a.household, a.userId, stapleId, date) } })));
});
