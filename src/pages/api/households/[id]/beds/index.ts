import { bedInput } from '@/lib/bed-schemas';
import { householdRoute } from '@/server/authz';
import { createBed, listBeds } from '@/server/beds';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';

/** GET /api/households/{id}/beds → { beds }, by name, areas in m² and in the household's unit. */
export const GET = householdRoute('read', async (_ctx, a) => json({ beds: await listBeds(a.household) }));

/** POST /api/households/{id}/beds (owner, grower) { name, area, areaUnit?, notes? } → 201 { bed }; 409 for a name already used. */
export const POST = householdRoute('write', async (ctx, a) => {
  const input = parseInput(bedInput, await readJson(ctx.request));
  return json({ bed: await createBed(a.household, input) }, 201);
});
