import { describe, expect, it } from 'vitest';
import { groupAfterDelete, groupWeighings, sharedSplitPatch, splitGroupsOf, withMissingParts } from '@/lib/split-weighing';

describe('editing a part of a split weighing', () => {
  it('takes crop, food, planting and date to every part', () => {
    expect(sharedSplitPatch({ cropId: 4 })).toEqual({ cropId: 4 });
    expect(sharedSplitPatch({ foodId: 9, date: '2026-09-21' })).toEqual({ foodId: 9, date: '2026-09-21' });
    expect(sharedSplitPatch({ plantingId: null })).toEqual({ plantingId: null });
  });

  it('keeps the amount, use, spread, trimmed and note to the part edited', () => {
    expect(sharedSplitPatch({ quantity: 3, unit: 'kg', use: 'fresh', spreadMonths: 1, trimmed: true, note: 'x' })).toBeUndefined();
    expect(sharedSplitPatch({ date: '2026-09-21', quantity: 3, use: 'stored' })).toEqual({ date: '2026-09-21' });
  });
});

describe('deleting a part of a split weighing', () => {
  it('keeps a group of two or more, clears a lone part, and has nothing left at none', () => {
    expect(groupAfterDelete(3)).toBe('keep');
    expect(groupAfterDelete(2)).toBe('keep');
    expect(groupAfterDelete(1)).toBe('clear');
    expect(groupAfterDelete(0)).toBe('gone');
  });
});

describe('the harvest log as weighings', () => {
  it('puts the parts of a group on one line where its first part stands, with their grams summed', () => {
    const rows = [
      { id: 1, splitGroup: 'g1', grams: 20_000 },
      { id: 2, splitGroup: null, grams: 500 },
      { id: 3, splitGroup: 'g1', grams: 2_000 },
      { id: 4, splitGroup: 'g2', grams: 1_000 },
    ];
    const lines = groupWeighings(rows);
    expect(lines.map((l) => (l.kind === 'split' ? `${l.group}:${l.parts.map((p) => p.id).join('+')}:${l.grams}` : `${l.entry.id}`))).toEqual([
      'g1:1+3:22000',
      '2',
      'g2:4:1000',
    ]);
  });
});

describe('a page of the log made whole', () => {
  const row = (id: number, splitGroup: string | null, grams = 1000) => ({ id, splitGroup, grams });

  it('lists the page’s split groups once each, in order', () => {
    expect(splitGroupsOf([row(1, 'g1'), row(2, null), row(3, 'g2'), row(4, 'g1')])).toEqual(['g1', 'g2']);
  });

  it('adds the parts that fell on another page, once, and only of the page’s own weighings', () => {
    const page = [row(1, 'g1', 20_000), row(2, null, 500)];
    const parts = [row(1, 'g1', 20_000), row(9, 'g1', 2_000), row(7, 'g3', 100)];
    const whole = withMissingParts(page, parts);
    expect(whole.map((r) => r.id)).toEqual([1, 2, 9]);
    // Shown as one weighing of 22 kg where its first part stands.
    const lines = groupWeighings(whole);
    expect(lines[0]).toMatchObject({ kind: 'split', group: 'g1', grams: 22_000 });
    expect(lines).toHaveLength(2);
  });
});
