import { describe, expect, it } from 'vitest';
import { authCall, tooMany } from '@/components/account/auth-client';

const headers = (h: Record<string, string>) => ({ response: new Response(null, { headers: h }) }) as never;

describe('authCall', () => {
  it('is null when the call succeeded', async () => {
    expect(await authCall(async () => ({ error: null }))).toBeNull();
  });

  it("keeps better-auth's status, code and sentence, and the limiter's wait", async () => {
    const failure = await authCall(async (o) => {
      o.onError(headers({ 'x-retry-after': '42' }));
      return { error: { status: 429, message: 'Too many requests. Please try again later.' } };
    });
    expect(failure).toEqual({ status: 429, code: '', message: 'Too many requests. Please try again later.', retryAfter: '42' });
  });

  it('answers status 0 with a sentence when nothing came back', async () => {
    const failure = await authCall(async () => Promise.reject(new TypeError('Failed to fetch')));
    expect(failure?.status).toBe(0);
    expect(failure?.message).toBe('Could not reach Selfsown. Check your connection and try again.');
  });

  it('falls back to a sentence when the error has none', async () => {
    const failure = await authCall(async () => ({ error: { status: 500, code: 'X' } }));
    expect(failure).toMatchObject({ status: 500, code: 'X', message: 'Something went wrong. Please try again.' });
  });
});

describe('tooMany', () => {
  it('says how long to wait', () => {
    expect(tooMany('1')).toBe('Too many attempts from here. Wait 1 second and try again.');
    expect(tooMany('30')).toBe('Too many attempts from here. Wait 30 seconds and try again.');
    expect(tooMany(null)).toBe('Too many attempts from here. Wait a minute and try again.');
  });
});
