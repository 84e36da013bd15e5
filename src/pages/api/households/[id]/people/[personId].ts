import { personPatch } from '@/lib/people-schemas';
import { personFor } from '@/lib/privacy';
import { householdRoute } from '@/server/authz';
import { json, readJson } from '@/server/http';
import { currentMonth, deletePerson, getPerson, personIdParam, personJson, updatePerson } from '@/server/people';

/** GET /api/households/{id}/people/{personId}: one person with this month's energy need (body data to owners only). */
export const GET = householdRoute('read', async (ctx, a) => {
  const row = await getPerson(a.household.id, personIdParam(ctx.params.personId));
  return json({ person: personFor(a.role, personJson(row, currentMonth(a.household.timezone))) });
});

/** PATCH /api/households/{id}/people/{personId} (owner): changes fields; null clears one. */
export const PATCH = householdRoute('own', async (ctx, a) => {
  const id = personIdParam(ctx.params.personId);
  const patch = personPatch.parse(await readJson(ctx.request));
  const row = await updatePerson(a.household.id, id, patch);
  return json({ person: personJson(row, currentMonth(a.household.timezone)) });
});

/** DELETE /api/households/{id}/people/{personId} (owner): 204. */
export const DELETE = householdRoute('own', async (ctx, a) => {
  await deletePerson(a.household.id, personIdParam(ctx.params.personId));
  return new Response(null, { status: 204 });
});
