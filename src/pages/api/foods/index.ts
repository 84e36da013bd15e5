import type { APIRoute } from 'astro';
import { z } from 'zod';
import { getPool } from '@/db/client';
import { datasetSlug } from '@/lib/dataset-order';
import { lineText } from '@/lib/text-schemas';
import { searchOrderFor } from '@/server/food-search-order';
import { datasetExists } from '@/server/datasets';
import { foodsByCode } from '@/server/food-search';
import { searchFoodsJson } from '@/server/food-search-cache';
import { errorResponse, handle, json, jsonText } from '@/server/http';

const query = z
  .object({
    q: lineText('The search', 100).min(1).optional(),
    code: z.string().trim().regex(/^[A-Za-z0-9._-]{1,20}$/, 'A food code is 1–20 letters, digits, dots or dashes.').optional(),
    dataset: datasetSlug.optional(),
    /** The household whose dataset order ranks the hits (default: the signed-in person's current one). */
    household: z.string().regex(/^\d{1,10}$/).optional(),
    limit: z.coerce.number().int().min(1).max(50).default(20),
    /** branded=1: include branded products even when the words name no brand. */
    branded: z.enum(['0', '1']).optional(),
  })
  .refine((v) => v.q !== undefined || v.code !== undefined, { message: 'Give q (words to search) or code.', path: ['q'] });

/** GET /api/foods?q=butternut+raw[&dataset=ifct2017][&branded=1]  or  /api/foods?code=F006[&dataset=ifct2017] */
export const GET: APIRoute = handle(async (ctx) => {
  const p = query.parse(Object.fromEntries(ctx.url.searchParams));
  const pool = getPool();
  if (p.dataset && !(await datasetExists(pool, p.dataset))) return errorResponse(404, 'unknown_dataset', `No dataset is called ${p.dataset}; GET /api/datasets lists them.`);
  if (p.code) return json({ foods: await foodsByCode(pool, p.code, p.dataset) });
  const datasetOrder = p.dataset ? undefined : await searchOrderFor(ctx, p.household);
  // Kept in memory until the next dataset load (food-search-cache.ts).
  return jsonText(await searchFoodsJson(pool, p.q!, p.limit, { branded: p.branded === '1', dataset: p.dataset, datasetOrder }));
});
