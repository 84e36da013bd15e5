import { describe, expect, it } from 'vitest';
import { acceptsGzip } from '@/lib/accept-encoding';

// Cases follow RFC 9110 §12.5.3 (Accept-Encoding) and §12.4.2 (quality values: 0–1, at most three decimals).
describe('acceptsGzip', () => {
  it('accepts what browsers send', () => {
    expect(acceptsGzip('gzip, deflate, br, zstd')).toBe(true); // Chromium's header
    expect(acceptsGzip('gzip, deflate')).toBe(true); // undici's fetch
    expect(acceptsGzip('GZIP')).toBe(true); // codings are case-insensitive (RFC 9110 §8.4.1)
    expect(acceptsGzip('x-gzip')).toBe(true); // alias (RFC 9110 §8.4.1.3)
  });

  it('sends plain when gzip is not asked for or is refused', () => {
    expect(acceptsGzip(null)).toBe(false);
    expect(acceptsGzip('')).toBe(false);
    expect(acceptsGzip('identity')).toBe(false);
    expect(acceptsGzip('br, deflate')).toBe(false);
    expect(acceptsGzip('gzip;q=0')).toBe(false);
    expect(acceptsGzip('gzip; q=0.000, br')).toBe(false);
    expect(acceptsGzip('gzip;q=0, *')).toBe(false); // refused by name wins over the wildcard
  });

  it('reads weights and the wildcard', () => {
    expect(acceptsGzip('gzip;q=0.5')).toBe(true);
    expect(acceptsGzip('br;q=1.0, gzip;q=0.001')).toBe(true);
    expect(acceptsGzip('*')).toBe(true);
    expect(acceptsGzip('*;q=0')).toBe(false);
    expect(acceptsGzip('br, *;q=0.1')).toBe(true);
  });

  it('ignores a coding whose weight is not written as the RFC writes it', () => {
    for (const odd of ['gzip;q=2', 'gzip;q=0.5000', 'gzip;q=-1', 'gzip;q=abc', 'gzip;q=', 'gzip;q=1.5']) {
      expect(acceptsGzip(odd), odd).toBe(false);
    }
    expect(acceptsGzip('gzip;q=abc, *')).toBe(true); // the wildcard still stands
  });
});
