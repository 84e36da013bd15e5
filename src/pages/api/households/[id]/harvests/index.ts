import { harvestInput, harvestSplitInput } from '@/lib/entry-schemas';
import { harvestQuery } from '@/lib/list-query-schemas';
import { householdRoute } from '@/server/authz';
import { parseInput } from '@/server/entry-input';
import { createHarvest, createSplitHarvest, listHarvests } from '@/server/harvests';
import { json, readJson } from '@/server/http';
import { answerResponse, idempotencyKey, idempotent } from '@/server/idempotency';

/** GET /api/households/{id}/harvests?from&to&cropId&foodId&use&sort&page&pageSize → a page, with totals of the whole filter. */
export const GET = householdRoute('read', async (ctx, a) => {
  const q = parseInput(harvestQuery, Object.fromEntries(ctx.url.searchParams));
  return json(await listHarvests(a.household.id, q));
});

/**
 * POST /api/households/{id}/harvests (owner, grower): one harvest → 201 { harvest }, or a split
 * weighing (body with "parts") → 201 { harvests }, all parts in one transaction. Honours Idempotency-Key.
 */
export const POST = householdRoute('write', async (ctx, a) => {
  const key = idempotencyKey(ctx.request);
  const body = await readJson(ctx.request);
  const hid = a.household.id;
  const keyed = { householdId: hid, userId: a.userId, route: 'harvests', path: ctx.url.pathname, body };
  if (body !== null && typeof body === 'object' && 'parts' in body) {
    const split = parseInput(harvestSplitInput, body);
    return answerResponse(await idempotent(keyed, key, async (tx) => ({ status: 201, body: { harvests: await createSplitHarvest(tx, hid, a.userId, split) } })));
  }
  const input = parseInput(harvestInput, body);
  return answerResponse(await idempotent(keyed, key, async (tx) => ({ status: 201, body: { harvest: await createHarvest(tx, hid, a.userId, input) } })));
});
