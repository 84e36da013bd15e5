import type { APIRoute } from 'astro';
import { z } from 'zod';
import { getPool } from '@/db/client';
import { foodDetail } from '@/server/food-search';
import { errorResponse, handle, json } from '@/server/http';

const id = z.coerce.number().int().positive();

/** GET /api/foods/{id}: the food with every nutrient per 100 g (amount null = not in the dataset). */
export const GET: APIRoute = handle(async ({ params }) => {
  const food = await foodDetail(getPool(), id.parse(params.id));
  if (!food) return errorResponse(404, 'not_found', 'No reference food has that id.');
  return json({ food });
});
