import { z } from 'zod';
import { adminRoute } from '@/server/admin';
import { setAccountDisabled } from '@/server/admin-accounts';
import { json, readJson } from '@/server/http';

const body = z.object({ disabled: z.boolean() });

/** PATCH /api/admin/accounts/{userId} {disabled}: disable (sign-in refused, sessions ended) or enable. */
export const PATCH = adminRoute(async ({ request, params }, admin) => {
  const { disabled } = body.parse(await readJson(request));
  await setAccountDisabled(admin, String(params.userId), disabled);
  return json({ disabled });
});
