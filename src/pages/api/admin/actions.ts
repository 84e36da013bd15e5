import { adminRoute, listActions } from '@/server/admin';
import { json } from '@/server/http';

/** GET /api/admin/actions: the latest 100 administrator actions (who, what, when). */
export const GET = adminRoute(async () => json({ actions: await listActions() }));
