import { describe, expect, it } from 'vitest';
import { monthChartData } from '@/components/share/month-chart-data';
import type { ShareResponse } from '@/lib/share-types';
import { computeShare } from '@/lib/shares';

// A report with no food: only the needs matter here (fat is an AMDR range, energy one EER line).
const report = {
  ...computeShare({
    from: '2026-01',
    to: '2026-03',
    people: [{ sex: 'female', ageYears: 30 }],
    entries: [],
    nutrients: ['energy_kcal', 'fat_g'],
    recordsSince: '2026-02',
    currentMonth: '2026-02',
  }),
  topCrops: [],
  uses: [],
  peopleCount: 1,
  datasets: [],
} as unknown as ShareResponse;

describe('the month chart data', () => {
  it('draws the two ends of a range at their own values, each line in a stack of its own', () => {
    const fat = monthChartData(report, 'fat_g');
    const [least, most] = fat.datasets.filter((d) => d.type === 'line');
    expect(least!.label).toBe('Recommended, least');
    expect(most!.label).toBe('Recommended, most');
    expect(least!.stack).not.toBe(most!.stack);
    expect(fat.datasets.filter((d) => d.type === 'bar').every((d) => d.stack === 'eaten')).toBe(true);
    expect(least!.stack).not.toBe('eaten');
    // February 2026 is on record: the line values are the AMDR ends from the report, not stacked
    expect(most!.data[1]).toBe(report.months[1]!.values.fat_g.needHigh);
    expect(least!.data[1]).toBe(report.months[1]!.values.fat_g.needLow);
    expect(most!.data[1]!).toBeGreaterThan(least!.data[1]!);
  });

  it('names the months before the records start and those still to come', () => {
    const energy = monthChartData(report, 'energy_kcal');
    expect(energy.labels).toEqual([['Jan 2026', 'before records'], 'Feb', ['Mar', 'to come']]);
    expect(energy.datasets.filter((d) => d.type === 'line')).toHaveLength(1);
  });
});
