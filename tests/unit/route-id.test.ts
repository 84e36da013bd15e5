import { describe, expect, it } from 'vitest';
import { parseRouteId } from '@/lib/route-id';

describe('parseRouteId', () => {
  it('reads plain decimal digits of a positive whole number', () => {
    expect(parseRouteId('39')).toBe(39);
    expect(parseRouteId('1')).toBe(1);
    expect(parseRouteId('9007199254740991')).toBe(Number.MAX_SAFE_INTEGER);
  });

  it('refuses every other way of writing a number that Number() would accept', () => {
    for (const lax of ['0x27', '0o47', '0b100111', '39.0', '3.9e1', ' 39', '39 ', '+39', '039', '0', '-1', '', '9007199254740993', 'Infinity']) {
      expect(parseRouteId(lax), lax).toBeNull();
    }
    expect(parseRouteId(undefined)).toBeNull();
    expect(parseRouteId(null)).toBeNull();
  });
});
