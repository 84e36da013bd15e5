import { larderOutcomeInput, larderOutcomesQuery } from '@/lib/larder-schemas';
import { householdRoute } from '@/server/authz';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';
import { harvestOutcomes, recordOutcome } from '@/server/larder-outcomes';

/** GET /api/households/{id}/larder/outcomes?harvestId=N → { outcomes } of that harvest, in the order they apply; 404 for no such harvest. */
export const GET = householdRoute('read', async (ctx, a) => {
  const { harvestId } = parseInput(larderOutcomesQuery, Object.fromEntries(ctx.url.searchParams));
  return json({ outcomes: await harvestOutcomes(a.household.id, harvestId) });
});

/**
 * POST /api/households/{id}/larder/outcomes (owner, grower) body { harvestId, kind, date,
 * lostFraction?, until?, note? } → 201 { outcome, lot }; 404 when the harvest is not a stored or
 * preserved lot of this household; 422 when the outcome cannot apply (the message names the day).
 */
export const POST = householdRoute('write', async (ctx, a) => {
  const input = parseInput(larderOutcomeInput, await readJson(ctx.request));
  return json(await recordOutcome(a.household, a.userId, input), 201);
});
