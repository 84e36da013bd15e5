/**
 * JSON answers for API routes, in the one error shape the whole API uses:
 * { "error": { "code", "message", "fields"? } }. Bad input is 400/422, never a 500.
 */
import { ZodError } from 'zod';
import { zodErrorBody } from '@/lib/error-body';
import { DATABASE_RETRY_AFTER_SECONDS, DATABASE_UNAVAILABLE_MESSAGE, databaseErrorAnswer } from './db-errors';

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

/**
 * An answer whose JSON is already written (a stored answer, as text or as its UTF-8 bytes), sent as
 * it is. `afterSent` runs once the server has read the whole body to write it out (or the client
 * went away): for work the waiting client should not wait for, such as storing the answer.
 */
export function jsonText(text: string | Uint8Array, status = 200, headers: Record<string, string> = {}, afterSent?: () => void): Response {
  const init = { status, headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers } };
  // mysql2's Buffer is a Uint8Array; the cast only meets the DOM typing of a Response body.
  if (!afterSent) return new Response(text as string | Uint8Array<ArrayBuffer>, init);
  return new Response(bodyThen(typeof text === 'string' ? new TextEncoder().encode(text) : text, afterSent), init);
}

/** A body of one chunk that calls `then` (on the next turn of the event loop) when it has been read to its end or cancelled. */
function bodyThen(bytes: Uint8Array, then: () => void): ReadableStream<Uint8Array> {
  let sent = false;
  let called = false;
  const done = () => {
    if (called) return;
    called = true;
    setImmediate(then);
  };
  return new ReadableStream<Uint8Array>({
    pull(controller) {
      if (!sent) {
        sent = true;
        controller.enqueue(bytes);
        return;
      }
      controller.close();
      done();
    },
    cancel: done,
  }, { highWaterMark: 0 }); // pulled only when read: the end is reached when the reader asks for it
}

export function errorResponse(status: number, code: string, message: string, fields?: Record<string, string>): Response {
  return json({ error: { code, message, ...(fields ? { fields } : {}) } }, status);
}

/** 503 `database_unavailable` with Retry-After: the database is down or restarting, try again soon. */
export function databaseUnavailableResponse(): Response {
  return json({ error: { code: 'database_unavailable', message: DATABASE_UNAVAILABLE_MESSAGE } }, 503, { 'retry-after': String(DATABASE_RETRY_AFTER_SECONDS) });
}

/** Turns anything thrown in a route into a response; unexpected errors are logged, not shown. */
export function toResponse(e: unknown): Response {
  if (e instanceof HttpError) return errorResponse(e.status, e.code, e.message, e.fields);
  if (e instanceof ZodError) {
    const body = zodErrorBody(e);
    return errorResponse(400, body.code, body.message, body.fields);
  }
  const db = databaseErrorAnswer(e);
  if (db?.status === 503) return databaseUnavailableResponse();
  if (db) return errorResponse(db.status, db.code, db.message);
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

/**
 * Reads a request body up to `maxBytes`, refusing (413) a larger one before reading it when it
 * says its length, and as soon as it passes the limit otherwise: nothing big is buffered first.
 */
export async function readBodyBytes(request: Request, maxBytes: number, tooLarge?: () => HttpError): Promise<Uint8Array> {
  const refuse = tooLarge ?? (() => new HttpError(413, 'too_large', `The body is larger than ${maxBytes} bytes.`));
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > maxBytes) throw refuse();
  if (!request.body) return new Uint8Array();
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      // Read the rest and drop it rather than cancel: cancelling Node's request body while a read
      // is pending throws inside undici and stops the server (see fdc-upload-form.ts).
      void (async () => {
        while (!(await reader.read()).done);
      })().catch(() => {});
      throw refuse();
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  return bytes;
}

/** True when a Content-Type header names JSON exactly (its MIME essence, not a substring). */
export function isJsonType(header: string | null): boolean {
  return (header ?? '').split(';')[0]!.trim().toLowerCase() === 'application/json';
}

function parseJsonText(text: string): unknown {
  try {
    return JSON.parse(text) as unknown;
  } catch {
    throw new HttpError(400, 'invalid_json', 'The body is not valid JSON.');
  }
}

/** Reads a JSON request body, answering 415/413/400 (not 500) when it is not JSON, too big or broken. */
export async function readJson(request: Request, maxBytes = 1_000_000): Promise<unknown> {
  if (!isJsonType(request.headers.get('content-type'))) {
    throw new HttpError(415, 'unsupported_media_type', 'Send the body as application/json.');
  }
  return parseJsonText(new TextDecoder().decode(await readBodyBytes(request, maxBytes)));
}

/** A JSON body that may be absent: no body (or a blank one) reads as {}. */
export async function readOptionalJson(request: Request, maxBytes = 100_000): Promise<unknown> {
  const text = new TextDecoder().decode(await readBodyBytes(request, maxBytes));
  if (text.trim() === '') return {};
  if (!isJsonType(request.headers.get('content-type'))) {
    throw new HttpError(415, 'unsupported_media_type', 'Send the body as application/json.');
  }
  return parseJsonText(text);
}
