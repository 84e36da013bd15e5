import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, qs, request } from '@/components/request';

function answer(status: number, body: string) {
  return vi.fn(async () => new Response(body, { status, headers: { 'content-type': 'application/json' } }));
}

afterEach(() => vi.unstubAllGlobals());

describe('request', () => {
  it('returns the parsed JSON of a 2xx answer and sends the body as JSON', async () => {
    const fetch = answer(201, '{"household":{"id":7}}');
    vi.stubGlobal('fetch', fetch);
    await expect(request('POST', '/api/households', { name: 'Plot' })).resolves.toEqual({ household: { id: 7 } });
    const [, init] = fetch.mock.calls[0] as unknown as [string, RequestInit];
    expect(init.body).toBe('{"name":"Plot"}');
    expect((init.headers as Record<string, string>)['content-type']).toBe('application/json');
  });

  it("throws an ApiError carrying the API's code, sentence and fields", async () => {
    vi.stubGlobal('fetch', answer(400, '{"error":{"code":"invalid_input","message":"name: Give the household a name.","fields":{"name":"Give the household a name."}}}'));
    const err = await request('POST', '/api/households', {}).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 400, code: 'invalid_input', message: 'name: Give the household a name.', fields: { name: 'Give the household a name.' } });
    expect((err as ApiError).retryable).toBe(false);
  });

  it('turns no answer at all into a retryable ApiError with status 0', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    const err = (await request('GET', '/api/households').catch((e: unknown) => e)) as ApiError;
    expect(err.status).toBe(0);
    expect(err.retryable).toBe(true);
    expect(err.message).toMatch(/Could not reach Selfsown/);
  });

  it('gives a 5xx without our error body a sentence of its own', async () => {
    vi.stubGlobal('fetch', answer(502, '<html>Bad gateway</html>'));
    const err = (await request('GET', '/api/households').catch((e: unknown) => e)) as ApiError;
    expect(err.status).toBe(502);
    expect(err.retryable).toBe(true);
    expect(err.code).toBe('not_json');
  });
});

describe('qs', () => {
  it('leaves out empty values', () => {
    expect(qs({ a: 1, b: '', c: undefined, d: null, e: false, f: 'x y' })).toBe('?a=1&f=x+y');
    expect(qs({})).toBe('');
  });
});
