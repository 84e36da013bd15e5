import { letterSetting } from '@/lib/letter-schemas';
import { householdRoute } from '@/server/authz';
import { parseInput } from '@/server/entry-input';
import { json, readJson } from '@/server/http';
import { setMonthlyLetter } from '@/server/letter-settings';

/** PATCH /api/households/{id}/letter (every member, for themselves) { monthlyLetter } → { monthlyLetter }. */
export const PATCH = householdRoute('read', async (ctx, a) => {
  const input = parseInput(letterSetting, await readJson(ctx.request));
  return json({ monthlyLetter: await setMonthlyLetter(a.household.id, a.userId, input.monthlyLetter) });
});
