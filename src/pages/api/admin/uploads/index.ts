import { adminRoute } from '@/server/admin';
import { readUploadForm } from '@/server/fdc-upload-form';
import { listUploads, startUpload, uploadJob } from '@/server/fdc-upload';
import { json } from '@/server/http';

/** GET /api/admin/uploads: the latest uploads. */
export const GET = adminRoute(async () => json({ uploads: await listUploads() }));

/**
 * POST /api/admin/uploads (multipart: slug, name, release, publisher, licence, files…): starts
 * reading a FoodData Central CSV download; 202 with the job, which GET /api/admin/uploads/{id} follows.
 */
export const POST = adminRoute(async ({ request }, admin) => {
  const { meta, files } = await readUploadForm(request);
  const id = await startUpload(admin, meta, files);
  return json({ upload: await uploadJob(id) }, 202);
});
