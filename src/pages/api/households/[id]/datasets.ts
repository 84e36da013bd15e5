import { getPool } from '@/db/client';
import { datasetOrderBody } from '@/lib/dataset-order';
import { householdRoute } from '@/server/authz';
import { householdDatasetOrder, listDatasets, setHouseholdDatasetOrder } from '@/server/datasets';
import { HttpError, json, readJson } from '@/server/http';

/** GET /api/households/{id}/datasets: every dataset, in the order this household's food search ranks them. */
export const GET = householdRoute('read', async (_ctx, a) => {
  const pool = getPool();
  const [all, order] = await Promise.all([listDatasets(pool), householdDatasetOrder(pool, a.household)]);
  return json({ datasets: order.map((slug) => all.find((d) => d.slug === slug)!) });
});

/** PUT /api/households/{id}/datasets {order: [slug…]} (owner): the search order; datasets left out follow. */
export const PUT = householdRoute('own', async ({ request }, a) => {
  const { order } = datasetOrderBody.parse(await readJson(request));
  const pool = getPool();
  const known = new Set((await listDatasets(pool)).map((d) => d.slug));
  const unknown = order.filter((s) => !known.has(s));
  if (unknown.length) throw new HttpError(422, 'unknown_dataset', `No dataset is called ${unknown.join(', ')}.`, { order: `Unknown: ${unknown.join(', ')}` });
  await setHouseholdDatasetOrder(pool, a.household.id, order);
  return json({ order: await householdDatasetOrder(pool, { datasetOrder: order.join(',') }) });
});
