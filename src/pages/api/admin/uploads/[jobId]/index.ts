import { z } from 'zod';
import { adminRoute } from '@/server/admin';
import { datasetJob } from '@/server/dataset-jobs';
import { cancelUpload } from '@/server/fdc-upload';
import { json } from '@/server/http';

const id = z.coerce.number().int().positive();

/** GET /api/admin/uploads/{id}: the job's progress, rejected rows and, when ready, what it would change. */
export const GET = adminRoute(async ({ params }) => json({ upload: await datasetJob(id.parse(params.jobId)) }));

/** DELETE /api/admin/uploads/{id}: cancels an upload that is ready or failed. */
export const DELETE = adminRoute(async ({ params }, admin) => {
  await cancelUpload(admin, id.parse(params.jobId));
  return new Response(null, { status: 204 });
});
