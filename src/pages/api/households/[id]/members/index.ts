import { memberFor } from '@/lib/privacy';
import { householdRoute } from '@/server/authz';
import { listMembers } from '@/server/households';
import { json } from '@/server/http';

/** GET /api/households/{id}/members: who signs in to this household, with roles; addresses to owners only. */
export const GET = householdRoute('read', async (_ctx, a) =>
  json({ members: (await listMembers(a.household.id)).map((m) => memberFor(a.role, a.userId, m)) }),
);
