import type { APIRoute } from 'astro';
import { getPool } from '@/db/client';
import { listDatasets } from '@/server/datasets';
import { handle, json } from '@/server/http';

/** GET /api/datasets: every food composition dataset with slug, name, release, publisher, licence, foodCount. */
export const GET: APIRoute = handle(async () => json({ datasets: await listDatasets(getPool()) }));
