import type { APIRoute } from 'astro';
import { z } from 'zod';
import { getPool } from '@/db/client';
import { lineText } from '@/lib/text-schemas';
import { foodsByCode, searchFoods } from '@/server/food-search';
import { handle, json } from '@/server/http';

const query = z
  .object({
    q: lineText('The search', 100).min(1).optional(),
    code: z.string().trim().regex(/^[A-Za-z0-9._-]{1,20}$/, 'A food code is 1–20 letters, digits, dots or dashes.').optional(),
    dataset: z.string().trim().regex(/^[a-z0-9-]{1,40}$/).optional(),
    limit: z.coerce.number().int().min(1).max(50).default(20),
    /** branded=1: include branded products even when the words name no brand. */
    branded: z.enum(['0', '1']).optional(),
  })
  .refine((v) => v.q !== undefined || v.code !== undefined, { message: 'Give q (words to search) or code.', path: ['q'] });

/** GET /api/foods?q=butternut+raw[&branded=1]  or  /api/foods?code=11352 */
export const GET: APIRoute = handle(async ({ url }) => {
  const p = query.parse(Object.fromEntries(url.searchParams));
  const foods = p.code ? await foodsByCode(getPool(), p.code, p.dataset) : await searchFoods(getPool(), p.q!, p.limit, { branded: p.branded === '1' });
  return json({ foods });
});
