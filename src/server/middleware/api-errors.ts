/**
 * Every /api/ answer is JSON: an error Astro writes itself — its HTML 404 page for a method a route
 * file does not export (DELETE on a list, say), or a plain-text answer — becomes the API's error
 * shape `{ error: { code, message } }` with the same status.
 */
import { defineMiddleware } from 'astro:middleware';
import { errorResponse } from '@/server/http';

export const apiErrors = defineMiddleware(async (ctx, next) => {
  const response = await next();
  if (!ctx.url.pathname.startsWith('/api/') || response.status < 400) return response;
  if ((response.headers.get('content-type') ?? '').startsWith('application/json')) return response;
  const message = response.status === 404 ? `No API endpoint answers ${ctx.request.method} at this address.` : 'The request was refused.';
  return errorResponse(response.status, response.status === 404 ? 'not_found' : 'refused', message);
});
