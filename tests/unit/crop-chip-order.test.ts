import { describe, expect, it } from 'vitest';
import { chipOrder, keepOrder, mostUsedSince, type ChipCrop } from '@/lib/crop-chip-order';
import { cropPinsInput, MAX_PINS, movePin, pinnedIds, togglePin } from '@/lib/crop-pins';

let nextId = 1;
const crop = (displayName: string, over: Partial<ChipCrop> = {}): ChipCrop => ({ id: nextId++, displayName, pinRank: null, harvestsLastYear: 0, archived: false, ...over });
const names = (list: readonly ChipCrop[]) => list.map((c) => c.displayName);

describe('the crop chips’ order', () => {
  it('puts pinned crops first by their rank, then the most harvested in the last year, then by name', () => {
    const list = [
      crop('Onion', { harvestsLastYear: 2 }),
      crop('Leek', { harvestsLastYear: 9 }),
      crop('Kale', { pinRank: 2, harvestsLastYear: 1 }),
      crop('Bean', { harvestsLastYear: 9 }),
      crop('Squash', { pinRank: 1 }),
      crop('Garlic'),
    ];
    expect(names(chipOrder(list))).toEqual(['Squash', 'Kale', 'Bean', 'Leek', 'Onion', 'Garlic']);
  });

  it('compares names as people read them (case aside, numbers by value) and leaves archived crops out', () => {
    const list = [crop('bean 10'), crop('Bean 2'), crop('apple'), crop('Zucchini', { archived: true, harvestsLastYear: 50 })];
    expect(names(chipOrder(list))).toEqual(['apple', 'Bean 2', 'bean 10']);
  });

  it('does not move a chip after a save raises its count: the order fixed at load holds', () => {
    const kale = crop('Kale', { harvestsLastYear: 5 });
    const leek = crop('Leek', { harvestsLastYear: 3 });
    const frozen = chipOrder([kale, leek]).map((c) => c.id);
    // Three saves of leek later, leek has more harvests than kale…
    const now = [{ ...kale }, { ...leek, harvestsLastYear: 8 }];
    expect(names(chipOrder(now))).toEqual(['Leek', 'Kale']);
    // …but the chips keep the order the page loaded with.
    expect(names(keepOrder(frozen, now))).toEqual(['Kale', 'Leek']);
  });

  it('adds a crop created meanwhile at the end and drops one archived meanwhile', () => {
    const a = crop('Beet', { harvestsLastYear: 4 });
    const b = crop('Chard', { harvestsLastYear: 2 });
    const frozen = [a.id, b.id];
    const c = crop('Radish', { harvestsLastYear: 7 });
    expect(names(keepOrder(frozen, [{ ...a, archived: true }, b, c]))).toEqual(['Chard', 'Radish']);
  });

  it('counts "most used" over the 365 days ending today', () => {
    expect(mostUsedSince('2026-12-31')).toBe('2026-01-01');
    // 2028 is a leap year (366 days; Gregorian calendar), so its last 365 days start on 2 January.
    expect(mostUsedSince('2028-12-31')).toBe('2028-01-02');
  });
});

describe('pinning crops', () => {
  it('lists the pinned crops by rank, leaving archived ones out', () => {
    const list = [crop('A', { pinRank: 3 }), crop('B'), crop('C', { pinRank: 1 }), crop('D', { pinRank: 2, archived: true })];
    expect(pinnedIds(list)).toEqual([list[2]!.id, list[0]!.id]);
  });

  it('pins at the end and unpins in place', () => {
    expect(togglePin([4, 9], 2)).toEqual([4, 9, 2]);
    expect(togglePin([4, 9, 2], 9)).toEqual([4, 2]);
  });

  it('moves a pinned crop one place and stops at either end', () => {
    expect(movePin([4, 9, 2], 2, -1)).toEqual([4, 2, 9]);
    expect(movePin([4, 9, 2], 4, 1)).toEqual([9, 4, 2]);
    expect(movePin([4, 9, 2], 4, -1)).toEqual([4, 9, 2]);
    expect(movePin([4, 9, 2], 2, 1)).toEqual([4, 9, 2]);
    expect(movePin([4, 9], 7, 1)).toEqual([4, 9]);
  });

  it('accepts a list of distinct crop ids, empty included, and refuses twins and too many', () => {
    expect(cropPinsInput.parse({ cropIds: [12, 7] })).toEqual({ cropIds: [12, 7] });
    expect(cropPinsInput.parse({ cropIds: [] })).toEqual({ cropIds: [] });
    expect(cropPinsInput.safeParse({ cropIds: [3, 3] }).error?.issues[0]?.message).toBe('A crop can be pinned only once; the list names one twice.');
    const many = Array.from({ length: MAX_PINS + 1 }, (_, i) => i + 1);
    expect(cropPinsInput.safeParse({ cropIds: many }).success).toBe(false);
    expect(cropPinsInput.safeParse({ cropIds: [0] }).success).toBe(false);
    expect(cropPinsInput.safeParse({ cropIds: '1,2' }).success).toBe(false);
    expect(cropPinsInput.safeParse({ cropIds: [1], extra: true }).success).toBe(false);
  });
});
