import type { APIRoute } from 'astro';
import { errorResponse } from '@/server/http';

/** Any /api/ path no route answers: the API's JSON error shape, not the HTML 404 page. */
export const ALL: APIRoute = () => errorResponse(404, 'not_found', 'No API endpoint at this address.');
