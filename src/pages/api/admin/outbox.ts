import { adminRoute } from '@/server/admin';
import { outboxStatus } from '@/server/admin-outbox';
import { json } from '@/server/http';

/** GET /api/admin/outbox: monthly letters by status, recent failures, the fake server's mail. */
export const GET = adminRoute(async () => json(await outboxStatus()));
