import { z } from 'zod';
import { adminRoute } from '@/server/admin';
import { applyUpload } from '@/server/fdc-upload';
import { json } from '@/server/http';

const id = z.coerce.number().int().positive();

/** POST /api/admin/uploads/{id}/apply: loads a ready upload in one transaction (409 unless ready). */
export const POST = adminRoute(async ({ params }, admin) => json({ upload: await applyUpload(admin, id.parse(params.jobId)) }));
