import { invitationInput } from '@/lib/household-schemas';
import { householdRoute } from '@/server/authz';
import { invitationJson, inviteByEmail, listPendingInvitations } from '@/server/invitations';
import { json, readJson } from '@/server/http';

/** GET /api/households/{id}/invitations (owner): invitations that can still be accepted. */
export const GET = householdRoute('own', async (_ctx, a) => json({ invitations: (await listPendingInvitations(a.household.id)).map(invitationJson) }));

/** POST /api/households/{id}/invitations {email, role} (owner) → 201; mails a single-use link. */
export const POST = householdRoute('own', async (ctx, a) => {
  const { email, role } = invitationInput.parse(await readJson(ctx.request));
  const inv = await inviteByEmail(a.household, a.userId, email, role);
  return json({ invitation: invitationJson(inv) }, 201);
});
