/**
 * The month chart's data for one nutrient: home-grown and bought as bars stacked on each other, the
 * recommended intake as a line (two for a range), each line in a stack of its own so the y axis
 * never adds the two ends of a range together. Months before the records start or still to come
 * say so under their name.
 */
import type { ChartData } from 'chart.js';
import type { ShareNutrientKey } from '@/lib/nutrients';
import { CHART_COLOURS } from '@/lib/palette';
import type { ShareResponse } from '@/lib/share-types';
import { shortMonth } from './format';

// The one palette (src/lib/palette.ts): sprout for home, rind for bought, loam for need.
const { home: HOME, bought: BOUGHT, need: NEED } = CHART_COLOURS;

/** Example: `monthChartData(report, 'fat_g').datasets.map((d) => d.label)` → ['Home-grown', 'Bought', 'Recommended, least', 'Recommended, most'] */
export function monthChartData(report: ShareResponse, k: ShareNutrientKey): ChartData<'bar' | 'line', (number | null)[], string | string[]> {
  const ranged = report.months.some((m) => m.values[k].needHigh !== null);
  const needLine = {
    type: 'line' as const,
    borderColor: NEED,
    // No fill: the legend then draws the need as a dashed outline, like the line itself.
    backgroundColor: 'transparent',
    pointBackgroundColor: NEED,
    borderDash: [6, 4],
    borderWidth: 2,
    pointRadius: 3,
    order: 1,
  };
  // A month before the records start or still to come says so under its name, as the grid does.
  const labels = report.months.map((m, i) => {
    const name = i === 0 || m.month.endsWith('-01') ? `${shortMonth(m.month)} ${m.month.slice(0, 4)}` : shortMonth(m.month);
    return m.beforeRecords ? [name, 'before records'] : m.future ? [name, 'to come'] : name;
  });
  return {
    labels,
    datasets: [
      { type: 'bar', label: 'Home-grown', data: report.months.map((m) => m.values[k].home), backgroundColor: HOME, stack: 'eaten', order: 2 },
      { type: 'bar', label: 'Bought', data: report.months.map((m) => m.values[k].bought), backgroundColor: BOUGHT, stack: 'eaten', order: 2 },
      ...(ranged
        ? [
            // Each line its own stack: the y axis stacks the bars, never the two ends of a range.
            { ...needLine, label: 'Recommended, least', stack: 'need-low', data: report.months.map((m) => m.values[k].needLow) },
            { ...needLine, label: 'Recommended, most', stack: 'need-high', borderDash: [2, 3], data: report.months.map((m) => m.values[k].needHigh) },
          ]
        : [{ ...needLine, label: 'Recommended intake', stack: 'need', data: report.months.map((m) => m.values[k].need) }]),
    ],
  };
}
