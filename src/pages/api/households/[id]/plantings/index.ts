import { plantingInput, plantingQuery } from '@/lib/bed-schemas';
import { householdRoute } from '@/server/authz';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';
import { createPlanting, currentSeasonYear, listPlantings } from '@/server/plantings';

/** GET /api/households/{id}/plantings[?year=YYYY] → { year, plantings, yields } (default: this year in the household). */
export const GET = householdRoute('read', async (ctx, a) => {
  const q = parseInput(plantingQuery, Object.fromEntries(ctx.url.searchParams));
  return json(await listPlantings(a.household, q.year ?? currentSeasonYear(a.household)));
});

/** POST /api/households/{id}/plantings (owner, grower) → 201 { planting }; the harvest window defaults from the reference row and frost dates. */
export const POST = householdRoute('write', async (ctx, a) => {
  const input = parseInput(plantingInput, await readJson(ctx.request));
  return json({ planting: await createPlanting(a.household, input) }, 201);
});
