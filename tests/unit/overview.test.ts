import { describe, expect, it } from 'vitest';
import { nextGap, nextSteps } from '@/lib/overview';

describe('a new household’s next steps', () => {
  it('ticks each step from the records, in the order people → crops → first harvest → share', () => {
    expect(nextSteps({ people: 0, crops: 0, harvests: 0, shareKnown: false }).map((s) => [s.key, s.done])).toEqual([
      ['people', false], ['crops', false], ['harvest', false], ['share', false],
    ]);
    expect(nextSteps({ people: 2, crops: 3, harvests: 1, shareKnown: true }).every((s) => s.done)).toBe(true);
    expect(nextSteps({ people: 0, crops: 1, harvests: 0, shareKnown: false }).map((s) => s.done)).toEqual([false, true, false, false]);
    // A known 0 % before anything is logged is not yet a home share worth ticking.
    expect(nextSteps({ people: 1, crops: 1, harvests: 0, shareKnown: true }).map((s) => s.done)).toEqual([true, true, false, false]);
  });
});

describe('the next gap', () => {
  const months = [
    { month: '2026-10', shareOfNeed: 0.05, counted: true },
    { month: '2026-11', shareOfNeed: 0.3, counted: true },
    { month: '2026-12', shareOfNeed: 0.2, counted: false },
  ];
  it('names the nutrient with the lowest share of need among those that fall short', () => {
    const g = nextGap([
      { name: 'Vitamin C', shareOfNeed: 0.9, shortfall: 100, months },
      { name: 'Calcium', shareOfNeed: 0.1, shortfall: 50_000, months },
      { name: 'Energy', shareOfNeed: 0.05, shortfall: 0, months },
    ], '2026-11');
    expect(g?.name).toBe('Calcium');
    expect(g?.shareOfNeed).toBe(0.1);
  });

  it('points at the leanest month still ahead, else the leanest of the year', () => {
    expect(nextGap([{ name: 'Iron', shareOfNeed: 0.2, shortfall: 10, months }], '2026-11')?.month).toBe('2026-12');
    expect(nextGap([{ name: 'Iron', shareOfNeed: 0.2, shortfall: 10, months }], '2027-01')?.month).toBe('2026-10');
  });

  it('is null when nothing falls short or nothing is known', () => {
    expect(nextGap([{ name: 'Iron', shareOfNeed: 1.2, shortfall: 0, months }], '2026-11')).toBeNull();
    expect(nextGap([{ name: 'Iron', shareOfNeed: null, shortfall: null, months }], '2026-11')).toBeNull();
    expect(nextGap([], '2026-11')).toBeNull();
  });
});
