import { z } from 'zod';
import { householdRoute } from '@/server/authz';
import { EXPORT_FILES, exportFile, exportFileName } from '@/server/entry-export';
import { parseInput } from '@/server/entry-input';
import { HttpError } from '@/server/http';
import { seesPrivateData } from '@/lib/privacy';

const PRIVATE_FILES = new Set<string>(['people.csv', 'backup.json']);

const query = z.object({
  delimiter: z.enum(['comma', 'semicolon'], { error: 'The delimiter must be comma or semicolon.' }).default('comma'),
});

/**
 * GET /api/households/{id}/exports/{harvests|purchases|crops|people}.csv[?delimiter=semicolon] and
 * /exports/backup.json: a download (Content-Disposition: attachment).
 */
export const GET = householdRoute('read', async (ctx, a) => {
  const file = EXPORT_FILES.find((f) => f === ctx.params.file);
  if (!file) throw new HttpError(404, 'not_found', `No such export; choose one of ${EXPORT_FILES.join(', ')}.`);
  // People's ages, sizes and pregnancies (and, in the backup, members' addresses) are the owner's to see.
  if (PRIVATE_FILES.has(file) && !seesPrivateData(a.role)) {
    throw new HttpError(403, 'forbidden', `Only an owner can download ${file}: it holds people's body data.`);
  }
  const { delimiter } = parseInput(query, Object.fromEntries(ctx.url.searchParams));
  const { body, contentType } = await exportFile(a.household, file, delimiter === 'semicolon' ? ';' : ',');
  return new Response(body, {
    status: 200,
    headers: {
      'content-type': contentType,
      'content-disposition': `attachment; filename="${exportFileName(a.household, file)}"`,
      'cache-control': 'no-store',
    },
  });
});
