/**
 * The headers every answer carries: no MIME sniffing, not framed by other sites, no full referrers
 * sent out. The outermost step, so that the answers of the other steps (a refused cross-site
 * request, the redirect to sign-in) carry them too.
 */
import { defineMiddleware } from 'astro:middleware';

export const securityHeaders = defineMiddleware(async (_ctx, next) => withSecurityHeaders(await next()));

/** Adds each header the response does not set itself. */
export function withSecurityHeaders(response: Response): Response {
  const set = (name: string, value: string) => {
    if (!response.headers.has(name)) response.headers.set(name, value);
  };
  try {
    set('X-Content-Type-Options', 'nosniff');
    set('X-Frame-Options', 'SAMEORIGIN');
    set('Content-Security-Policy', "frame-ancestors 'self'");
    set('Referrer-Policy', 'strict-origin-when-cross-origin');
  } catch {
    // Some responses (e.g. a fetched Response passed through) have immutable headers: leave them.
  }
  return response;
}
