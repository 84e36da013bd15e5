import { stapleInput } from '@/lib/entry-schemas';
import { householdRoute } from '@/server/authz';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';
import { createStaple, listStaples } from '@/server/staples';

/** GET /api/households/{id}/staples → { staples } */
export const GET = householdRoute('read', async (_ctx, a) => json({ staples: await listStaples(a.household.id) }));

/** POST /api/households/{id}/staples (owner, grower) { foodId, label?, quantity, unit, spreadMonths? } → 201 { staple } */
export const POST = householdRoute('write', async (ctx, a) => {
  const input = parseInput(stapleInput, await readJson(ctx.request));
  return json({ staple: await createStaple(a.household.id, input) }, 201);
});
