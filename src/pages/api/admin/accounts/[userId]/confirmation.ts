import { adminRoute } from '@/server/admin';
import { resendConfirmation } from '@/server/admin-accounts';
import { getAuth } from '@/server/auth';
import { json } from '@/server/http';

/** POST /api/admin/accounts/{userId}/confirmation: a new confirmation mail (409 when already confirmed). */
export const POST = adminRoute(async ({ params }, admin) => {
  await resendConfirmation(admin, String(params.userId), async (email) => {
    await getAuth().api.sendVerificationEmail({ body: { email, callbackURL: '/verify' } });
  });
  return json({ sent: true }, 202);
});
