import { join } from 'node:path';
import { adminRoute } from '@/server/admin';
import { datasetJob, listDatasetJobs } from '@/server/dataset-jobs';
import { receiveUploadForm } from '@/server/fdc-upload-form';
import { startUpload } from '@/server/fdc-upload';
import { json } from '@/server/http';
import { adoptFolder, removeFolder } from '@/server/upload-files';

/** GET /api/admin/uploads: the latest uploads. */
export const GET = adminRoute(async () => json({ uploads: await listDatasetJobs('fdc_upload') }));

/**
 * POST /api/admin/uploads (multipart: slug, name, release, publisher, licence, files…): streams a
 * FoodData Central CSV download to disk and starts reading it; 202 with the job, which GET
 * /api/admin/uploads/{id} follows.
 */
export const POST = adminRoute(async ({ request }, admin) => {
  const arrived = await receiveUploadForm(request);
  try {
    const id = await startUpload(admin, arrived.meta, arrived.files, async (jobId) => {
      const dir = await adoptFolder(arrived.folder, jobId);
      return new Map([...arrived.files].map(([name, f]) => [name, { ...f, path: join(dir, name) }]));
    });
    return json({ upload: await datasetJob(id) }, 202);
  } catch (e) {
    await removeFolder(arrived.folder);
    throw e;
  }
});
