import { householdRoute } from '@/server/authz';
import { idParam } from '@/server/entry-input';
import { revokeInvitation } from '@/server/invitations';

/** DELETE /api/households/{id}/invitations/{invitationId} (owner): the link stops working at once. */
export const DELETE = householdRoute('own', async (ctx, a) => {
  await revokeInvitation(a.household.id, idParam(ctx.params.invitationId, 'invitation in this household'));
  return new Response(null, { status: 204 });
});
