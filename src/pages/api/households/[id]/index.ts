import { householdPatch } from '@/lib/household-schemas';
import { householdRoute } from '@/server/authz';
import { deleteHousehold, householdJson, updateHousehold } from '@/server/households';
import { json, readJson } from '@/server/http';

/** GET /api/households/{id}: the household and the caller's role. */
export const GET = householdRoute('read', (_ctx, a) => json({ household: householdJson(a.household, a.role) }));

/** PATCH /api/households/{id} (owner): name, time zone, units, year start, the month records start (null = default). */
export const PATCH = householdRoute('own', async (ctx, a) => {
  const patch = householdPatch.parse(await readJson(ctx.request));
  return json({ household: householdJson(await updateHousehold(a.household, patch), a.role) });
});

/** DELETE /api/households/{id} (owner): the household and all its records, in one transaction. */
export const DELETE = householdRoute('own', async (_ctx, a) => {
  await deleteHousehold(a.household.id);
  return new Response(null, { status: 204 });
});
