/**
 * The one way the browser islands talk to Selfsown's own API: `request()` sends JSON (or a form
 * upload) and returns the parsed answer, and every failure — a non-2xx answer or no answer at all —
 * is thrown as an `ApiError` carrying the API's error body (`{ error: { code, message, fields } }`),
 * so TanStack Query sees a failure and a form can show each field's problem beside the field.
 * Sign-in and the other account calls go through better-auth's own client instead
 * (`account/auth-client.ts`).
 */

/** The error body every API route answers with. */
export interface ApiErrorBody {
  code: string;
  message: string;
  fields?: Record<string, string>;
}

/** A failed API call: the HTTP status (0 = no answer at all) and the API's error body. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;
  readonly body: unknown;

  constructor(status: number, error: ApiErrorBody, body: unknown) {
    super(error.message);
    this.name = 'ApiError';
    this.status = status;
    this.code = error.code;
    this.fields = error.fields ?? {};
    this.body = body;
  }

  /** True when sending the same request again later may work: no answer, or the server's fault. */
  get retryable(): boolean {
    return this.status === 0 || this.status >= 500 || this.status === 408 || this.status === 429;
  }
}

const OFFLINE: ApiErrorBody = { code: 'network', message: 'Could not reach Selfsown. Check your connection.' };

async function readBody(res: Response): Promise<unknown> {
  const text = await res.text();
  if (!text) return null;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return { error: { code: 'not_json', message: text.slice(0, 200) } };
  }
}

function errorOf(status: number, body: unknown): ApiError {
  const e = (body as { error?: Partial<ApiErrorBody> } | null)?.error;
  const message = e?.message ?? (status >= 500 ? 'Something went wrong on our side. Please try again.' : `The request failed (${status}).`);
  return new ApiError(status, { code: e?.code ?? `http_${status}`, message, ...(e?.fields ? { fields: e.fields } : {}) }, body);
}

/** Sends a request and returns the parsed JSON; throws ApiError for any non-2xx or no answer. */
export async function request<T>(method: string, url: string, body?: unknown, headers: Record<string, string> = {}): Promise<T> {
  let res: Response;
  const isForm = typeof FormData !== 'undefined' && body instanceof FormData;
  try {
    res = await fetch(url, {
      method,
      credentials: 'same-origin',
      headers: { accept: 'application/json', ...(body === undefined || isForm ? {} : { 'content-type': 'application/json' }), ...headers },
      body: body === undefined ? undefined : isForm ? (body as FormData) : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, OFFLINE, null);
  }
  const parsed = await readBody(res);
  if (!res.ok) throw errorOf(res.status, parsed);
  return parsed as T;
}

/** GET helper. Example: `await get<{ members: MemberJson[] }>('/api/households/7/members')` */
export const get = <T>(url: string) => request<T>('GET', url);

/** Builds a query string, leaving out empty values. Example: `qs({ a: 1, b: '' })` → '?a=1' */
export function qs(params: Record<string, string | number | boolean | undefined | null>): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '' && v !== false) p.set(k, String(v));
  const s = p.toString();
  return s ? `?${s}` : '';
}
