import { z } from 'zod';
import { adminRoute } from '@/server/admin';
import { searchAccounts } from '@/server/admin-accounts';
import { json } from '@/server/http';

const query = z.object({ q: z.string().max(100).default('') });

/** GET /api/admin/accounts?q=: accounts whose address or name contains q (at most 50). */
export const GET = adminRoute(async ({ url }) => json({ accounts: await searchAccounts(query.parse(Object.fromEntries(url.searchParams)).q) }));
