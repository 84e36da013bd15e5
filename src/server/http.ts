/**
 * JSON answers for API routes, in the one error shape the whole API uses:
 * { "error": { "code", "message", "fields"? } }. Bad input is 400/422, never a 500.
 */
import { ZodError } from 'zod';
import { zodErrorBody } from '../lib/error-body';

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export function json(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

export function errorResponse(status: number, code: string, message: string, fields?: Record<string, string>): Response {
  return json({ error: { code, message, ...(fields ? { fields } : {}) } }, status);
}

/** Turns anything thrown in a route into a response; unexpected errors are logged, not shown. */
export function toResponse(e: unknown): Response {
  if (e instanceof HttpError) return errorResponse(e.status, e.code, e.message, e.fields);
  if (e instanceof ZodError) {
    const body = zodErrorBody(e);
    return errorResponse(400, body.code, body.message, body.fields);
  }
  console.error('unexpected error in API route', e);
  return errorResponse(500, 'internal', 'Something went wrong on our side. Please try again.');
}

/** Wraps a route handler so every error becomes a JSON answer. */
export function handle<C>(fn: (ctx: C) => Promise<Response> | Response): (ctx: C) => Promise<Response> {
  return async (ctx: C) => {
    try {
      return await fn(ctx);
    } catch (e) {
      return toResponse(e);
    }
  };
}

/** Reads a JSON request body, answering 400 (not 500) when it is not JSON. */
export async function readJson(request: Request, maxBytes = 1_000_000): Promise<unknown> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.includes('application/json')) {
    throw new HttpError(415, 'unsupported_media_type', 'Send the body as application/json.');
  }
  const text = await request.text();
  if (text.length > maxBytes) throw new HttpError(413, 'too_large', `The body is larger than ${maxBytes} bytes.`);
  try {
    return JSON.parse(text) as unknown;
  } catch {
    throw new HttpError(400, 'invalid_json', 'The body is not valid JSON.');
  }
}
