import { purchasePatch } from '@/lib/entry-schemas';
import { householdRoute } from '@/server/authz';
import { idParam, parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';
import { deletePurchase, getPurchase, updatePurchase } from '@/server/purchases';

/** GET /api/households/{id}/purchases/{purchaseId} → { purchase } */
export const GET = householdRoute('read', async (ctx, a) => json({ purchase: await getPurchase(a.household.id, idParam(ctx.params.purchaseId, 'bought food')) }));

/** PATCH /api/households/{id}/purchases/{purchaseId} (owner, grower) → { purchase }, grams and edible grams worked out again. */
export const PATCH = householdRoute('write', async (ctx, a) => {
  const purchaseId = idParam(ctx.params.purchaseId, 'bought food');
  const patch = parseInput(purchasePatch, await readJson(ctx.request));
  return json({ purchase: await updatePurchase(a.household.id, purchaseId, patch) });
});

/** DELETE /api/households/{id}/purchases/{purchaseId} (owner, grower) → 204 */
export const DELETE = householdRoute('write', async (ctx, a) => {
  await deletePurchase(a.household.id, idParam(ctx.params.purchaseId, 'bought food'));
  return new Response(null, { status: 204 });
});
