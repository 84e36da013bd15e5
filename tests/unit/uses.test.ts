import { describe, expect, it } from 'vitest';
import { EATEN_USES, isEatenUse, isSpreadUse, isUse, NOT_EATEN_USES, SPREAD_USES, USE_LABELS, USES } from '@/lib/uses';

describe('uses', () => {
  it('splits every use into eaten or not eaten, never both', () => {
    const eaten = new Set<string>(EATEN_USES);
    const notEaten = new Set<string>(NOT_EATEN_USES);
    for (const u of USES) expect(eaten.has(u) !== notEaten.has(u)).toBe(true);
    expect(eaten.size + notEaten.size).toBe(USES.length);
  });

  it('spreads only uses that are eaten', () => {
    for (const u of SPREAD_USES) expect(isEatenUse(u)).toBe(true);
    expect(isSpreadUse('fresh')).toBe(false);
    expect(isSpreadUse('stored')).toBe(true);
  });

  it('labels every use and recognises only the listed ones', () => {
    expect(Object.keys(USE_LABELS).sort()).toEqual([...USES].sort());
    expect(isUse('sold')).toBe(true);
    expect(isUse('Sold')).toBe(false);
    expect(isUse(3)).toBe(false);
  });
});
