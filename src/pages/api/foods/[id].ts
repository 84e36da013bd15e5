import type { APIRoute } from 'astro';
import { getPool } from '@/db/client';
import { idParam } from '@/server/entry-input';
import { errorResponse, handle, json } from '@/server/http';
import { foodDetail } from '@/server/food-search';

/** GET /api/foods/{id}: the food with every nutrient per 100 g (amount null = not in the dataset). */
export const GET: APIRoute = handle(async ({ params }) => {
  const food = await foodDetail(getPool(), idParam(params.id, 'reference food'));
  if (!food) return errorResponse(404, 'not_found', 'No reference food has that id.');
  return json({ food });
});
