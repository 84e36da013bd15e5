import type { APIRoute } from 'astro';
import { householdInput } from '@/lib/household-schemas';
import { requireUser } from '@/server/authz';
import { createHousehold, householdJson, listHouseholds } from '@/server/households';
import { handle, json, readJson } from '@/server/http';

/** GET /api/households: the caller's households with their role in each. */
export const GET: APIRoute = handle(async (ctx) => {
  const u = requireUser(ctx);
  const rows = await listHouseholds(u.id);
  return json({ households: rows.map((r) => householdJson(r.household, r.role)) });
});

/** POST /api/households {name, timezone, units, yearStartMonth?} → 201; the creator is owner. */
export const POST: APIRoute = handle(async (ctx) => {
  const u = requireUser(ctx);
  const input = householdInput.parse(await readJson(ctx.request));
  const h = await createHousehold(u.id, input);
  return json({ household: householdJson(h, 'owner') }, 201, { location: `/api/households/${h.id}` });
});
