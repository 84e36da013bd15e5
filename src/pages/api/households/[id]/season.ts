import { seasonInput } from '@/lib/bed-schemas';
import { householdRoute } from '@/server/authz';
import { parseInput } from '@/server/entry-input';
import { seasonJson, setSeason } from '@/server/growing-season';
import { json, readJson } from '@/server/http';

/** GET /api/households/{id}/season → { stored, season }: the frost dates set (null = default) and the ones used. */
export const GET = householdRoute('read', (_ctx, a) => json(seasonJson(a.household)));

/** PUT /api/households/{id}/season (owner, grower) { lastSpringFrost, firstAutumnFrost } ('MM-DD' or null for the default). */
export const PUT = householdRoute('write', async (ctx, a) => {
  const input = parseInput(seasonInput, await readJson(ctx.request));
  return json(await setSeason(a.household, input));
});
