import type { APIRoute } from 'astro';
import { CLIENT_IP_HEADER, getAuth } from '@/server/auth';
import { trustProxy } from '@/server/config';

export const prerender = false;

/** Every better-auth endpoint (/api/auth/sign-up/email, /sign-in/email, /sign-out, …). */
export const ALL: APIRoute = async ({ request, clientAddress }) => {
  // The limiter keys on the connecting address; a client cannot choose it by sending the header.
  // Behind the one trusted proxy (TRUST_PROXY=1) the last X-Forwarded-For entry is the address that
  // proxy saw; earlier entries are whatever the client wrote, so they are never used.
  const forwarded = trustProxy() ? request.headers.get('x-forwarded-for')?.split(',').pop()?.trim() : undefined;
  const headers = new Headers(request.headers);
  headers.set(CLIENT_IP_HEADER, forwarded || clientAddress);
  const init: RequestInit & { duplex?: 'half' } = { method: request.method, headers };
  if (request.method !== 'GET' && request.method !== 'HEAD') {
    init.body = request.body;
    init.duplex = 'half';
  }
  return getAuth().handler(new Request(request.url, init));
};
