import { describe, expect, it } from 'vitest';
import { harvestInput, harvestSplitInput, stapleLogInput, zodErrorBody } from '@/lib/entry-schemas';

describe('unknown fields in entry input', () => {
  it('refuses a misspelt field instead of storing the entry without it', () => {
    const r = harvestInput.safeParse({ date: '2026-09-01', cropId: 1, quantity: 2, unit: 'kg', use: 'stored', spreadmonths: 6 });
    expect(r.success).toBe(false);
    expect(zodErrorBody(r.error!).fields).toEqual({ spreadmonths: 'Unknown field: check its spelling.' });
  });

  it('names an unknown field inside a split part by its path', () => {
    const r = harvestSplitInput.safeParse({ date: '2026-09-01', cropId: 1, unit: 'kg', parts: [{ quantity: 1, use: 'fresh' }, { quantity: 1, use: 'fresh', trimed: true }] });
    expect(r.success).toBe(false);
    expect(zodErrorBody(r.error!).fields['parts.1.trimed']).toBe('Unknown field: check its spelling.');
  });

  it('does not let a staple log carry a quantity it would ignore', () => {
    expect(stapleLogInput.safeParse({ quantity: -1 }).success).toBe(false);
    expect(stapleLogInput.safeParse({ date: '2026-09-01' }).success).toBe(true);
  });
});
