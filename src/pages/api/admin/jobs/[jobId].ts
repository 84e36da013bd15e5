import { z } from 'zod';
import { adminRoute } from '@/server/admin';
import { datasetJob } from '@/server/dataset-jobs';
import { json } from '@/server/http';

const id = z.coerce.number().int().positive();

/** GET /api/admin/jobs/{id}: a dataset job (upload or reload of a built-in dataset) as the admin pages poll it. */
export const GET = adminRoute(async ({ params }) => json({ job: await datasetJob(id.parse(params.jobId)) }));
