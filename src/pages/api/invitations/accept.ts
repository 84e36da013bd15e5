import type { APIRoute } from 'astro';
import { acceptInvitationInput } from '@/lib/household-schemas';
import { requireUser } from '@/server/authz';
import { handle, json, readJson } from '@/server/http';
import { acceptInvitation } from '@/server/invitations';

/**
 * POST /api/invitations/accept {token} (signed in, confirmed address) → 200 {householdId, role,
 * alreadyMember}. Unknown token 404; used, revoked or expired 410 with a sentence saying which;
 * a signed-in address other than the invited one 403.
 */
export const POST: APIRoute = handle(async (ctx) => {
  const u = requireUser(ctx);
  const { token } = acceptInvitationInput.parse(await readJson(ctx.request));
  const r = await acceptInvitation(token, { id: u.id, email: u.email, emailVerified: ctx.locals.user?.emailVerified ?? false });
  return json(r);
});
