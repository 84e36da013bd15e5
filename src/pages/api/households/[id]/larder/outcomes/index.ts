import { larderOutcomeInput } from '@/lib/larder-schemas';
import { householdRoute } from '@/server/authz';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';
import { recordOutcome } from '@/server/larder-outcomes';

/**
 * POST /api/households/{id}/larder/outcomes (owner, grower) body { harvestId, kind, date,
 * lostFraction?, until?, note? } → 201 { outcome, lot }; 404 when the harvest is not a stored or
 * preserved lot of this household; 422 when the outcome cannot apply (the message names the day).
 */
export const POST = householdRoute('write', async (ctx, a) => {
  const input = parseInput(larderOutcomeInput, await readJson(ctx.request));
  return json(await recordOutcome(a.household, a.userId, input), 201);
});
