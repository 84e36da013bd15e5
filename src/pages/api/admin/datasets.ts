import { getPool } from '@/db/client';
import { adminRoute } from '@/server/admin';
import { datasetUsage, listDatasets, listReleases } from '@/server/datasets';
import { json } from '@/server/http';

/** GET /api/admin/datasets: every dataset, its releases, and which households use it. */
export const GET = adminRoute(async () => {
  const pool = getPool();
  const [all, releases, usage] = await Promise.all([listDatasets(pool), listReleases(pool), datasetUsage(pool)]);
  return json({ datasets: all, releases, usage });
});
