import { roleInput } from '@/lib/household-schemas';
import { householdAccess, householdRoute } from '@/server/authz';
import { removeMember, setMemberRole } from '@/server/households';
import { json, readJson } from '@/server/http';

/** PATCH /api/households/{id}/members/{userId} {role} (owner). The last owner cannot be demoted. */
export const PATCH = householdRoute('own', async (ctx, a) => {
  const { role } = roleInput.parse(await readJson(ctx.request));
  await setMemberRole(a.household.id, ctx.params.userId ?? '', role);
  return json({ ok: true });
});

/** DELETE /api/households/{id}/members/{userId}: an owner removes a member, or a member leaves. */
export const DELETE = householdRoute('read', async (ctx, a) => {
  const target = ctx.params.userId ?? '';
  // Leaving needs only membership; removing someone else needs the owner role.
  if (target !== a.userId) await householdAccess(a.userId, String(a.household.id), 'own');
  await removeMember(a.household.id, target);
  return new Response(null, { status: 204 });
});
