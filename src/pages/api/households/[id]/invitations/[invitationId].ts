import { householdRoute } from '@/server/authz';
import { HttpError } from '@/server/http';
import { revokeInvitation } from '@/server/invitations';

/** DELETE /api/households/{id}/invitations/{invitationId} (owner): the link stops working at once. */
export const DELETE = householdRoute('own', async (ctx, a) => {
  const id = Number(ctx.params.invitationId);
  if (!Number.isInteger(id) || id <= 0) throw new HttpError(404, 'not_found', 'No such invitation in this household.');
  await revokeInvitation(a.household.id, id);
  return new Response(null, { status: 204 });
});
