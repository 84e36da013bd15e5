import { purchaseInput } from '@/lib/entry-schemas';
import { purchaseQuery } from '@/lib/list-query-schemas';
import { householdRoute } from '@/server/authz';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';
import { answerResponse, idempotencyKey, idempotent } from '@/server/idempotency';
import { createPurchase, listPurchases } from '@/server/purchases';

/** GET /api/households/{id}/purchases?from&to&foodId&sort&page&pageSize → a page, with totals of the whole filter. */
export const GET = householdRoute('read', async (ctx, a) => {
  const q = parseInput(purchaseQuery, Object.fromEntries(ctx.url.searchParams));
  return json(await listPurchases(a.household.id, q));
});

/** POST /api/households/{id}/purchases (owner, grower) → 201 { purchase }. Honours Idempotency-Key. */
export const POST = householdRoute('write', async (ctx, a) => {
  const key = idempotencyKey(ctx.request);
  const body = await readJson(ctx.request);
  const input = parseInput(purchaseInput, body);
  const hid = a.household.id;
  const keyed = { householdId: hid, userId: a.userId, route: 'purchases', path: ctx.url.pathname, body };
  return answerResponse(await idempotent(keyed, key, async (tx) => ({ status: 201, body: { purchase: await createPurchase(tx, hid, a.userId, input) } })));
});
