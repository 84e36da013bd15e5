import { describe, expect, it } from 'vitest';
import { RecentMap } from '@/lib/recent-map';

describe('a map of the most recently used entries', () => {
  it('drops the entry least recently read or written once it is full', () => {
    const m = new RecentMap<string, number>(3);
    m.set('a', 1);
    m.set('b', 2);
    m.set('c', 3);
    expect(m.get('a')).toBe(1); // a is now the most recent; b the least
    m.set('d', 4);
    expect(m.size).toBe(3);
    expect(m.get('b')).toBeUndefined();
    expect([m.get('a'), m.get('c'), m.get('d')]).toEqual([1, 3, 4]);
    m.set('c', 30); // writing counts as a use: a goes next
    m.set('e', 5);
    expect(m.get('a')).toBeUndefined();
    expect([m.get('c'), m.get('d'), m.get('e')]).toEqual([30, 4, 5]);
  });

  it('keeps a value that is itself undefined-like, and refuses a size under one', () => {
    const m = new RecentMap<string, string>(1);
    m.set('', '');
    expect(m.get('')).toBe('');
    m.set('x', 'y');
    expect(m.get('')).toBeUndefined();
    expect(() => new RecentMap(0)).toThrow(RangeError);
  });
});
