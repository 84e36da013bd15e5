import { personInput } from '@/lib/people-schemas';
import { personFor } from '@/lib/privacy';
import { householdRoute } from '@/server/authz';
import { json, readJson } from '@/server/http';
import { createPerson, currentMonth, listPeople, personJson } from '@/server/people';

/**
 * GET /api/households/{id}/people: who eats in the household, each with this month's energy need.
 * Owners get every field; growers and viewers the name, presence and need only (src/lib/privacy.ts).
 */
export const GET = householdRoute('read', async (_ctx, a) => {
  const month = currentMonth(a.household.timezone);
  const rows = await listPeople(a.household.id);
  return json({ month, people: rows.map((r) => personFor(a.role, personJson(r, month))) });
});

/** POST /api/households/{id}/people (owner: the body data is theirs to keep): adds a person; 201 with the person. */
export const POST = householdRoute('own', async (ctx, a) => {
  const input = personInput.parse(await readJson(ctx.request));
  const row = await createPerson(a.household.id, input);
  return json({ person: personJson(row, currentMonth(a.household.timezone)) }, 201);
});
