/**
 * Month by month for one chosen nutrient: home-grown and bought as stacked bars, the household's
 * recommended intake as a dashed line (for carbohydrate and fat two lines, the low and high ends of
 * the range). The chart's text alternative gives the headline figure, flagged when uncertain, and a
 * table with the same numbers — months before records and still to come marked, the weight of
 * unknown value beside each share — sits below for those who read rather than look.
 */
import {
  BarController,
  BarElement,
  CategoryScale,
  Chart as ChartJS,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  Tooltip,
  type ChartOptions,
} from 'chart.js';
import { useId, useState } from 'react';
import { Chart } from 'react-chartjs-2';
import type { ShareResponse } from '@/lib/share-types';
import { shareText, unknownText } from '@/lib/share-scale';
import { formatWeight, type UnitSystem } from '@/lib/units';
import { amountText, basisLong, longMonth, needText, rangeText, shortMonth } from './format';
import { monthChartData } from './month-chart-data';

ChartJS.register(BarController, LineController, BarElement, LineElement, PointElement, CategoryScale, LinearScale, Tooltip, Legend);

/** No animation for automated browsers (steady screenshots) or people who asked for less motion. */
export function calmMotion(): boolean {
  if (typeof window === 'undefined') return true;
  return Boolean(navigator.webdriver) || Boolean(window.matchMedia?.('(prefers-reduced-motion: reduce)').matches);
}

export function MonthChart({ report, units }: { report: ShareResponse; units: UnitSystem }) {
  const [key, setKey] = useState<string>('energy_kcal');
  const id = useId();
  const nutrient = report.nutrients.find((n) => n.key === key) ?? report.nutrients[0]!;
  const k = nutrient.key;
  const ranged = report.months.some((m) => m.values[k].needHigh !== null);
  const data = monthChartData(report, k);
  const head = report.headline?.values[k];
  const headUnknown = head ? unknownText(head.unknownShare, nutrient.name.toLowerCase()) : null;
  const summary = head
    ? ` So far (${rangeText(report.headline!.from, report.headline!.to)}): ${shareText(head.shareOfNeed, head.uncertain)} of the recommended intake from home${headUnknown ? `; ${headUnknown}` : ''}.${report.intake.looksIncomplete ? ' Bought food looks incomplete.' : ''}`
    : '';
  const options: ChartOptions<'bar' | 'line'> = {
    responsive: true,
    maintainAspectRatio: false,
    animation: calmMotion() ? false : undefined,
    interaction: { mode: 'index', intersect: false },
    scales: {
      x: { stacked: true, grid: { display: false } },
      y: { stacked: true, beginAtZero: true, title: { display: true, text: `${nutrient.name} (${nutrient.unit} per month)` } },
    },
    plugins: {
      legend: { position: 'bottom', labels: { font: { size: 14 } } },
      tooltip: { callbacks: { label: (c) => `${c.dataset.label}: ${amountText(c.parsed.y as number | null, nutrient.unit)}` } },
    },
  };

  return (
    <section aria-labelledby={`${id}-h`}>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id={`${id}-h`} className="text-2xl font-extrabold">
          Month by month
        </h2>
        <div>
          <label htmlFor={`${id}-n`} className="block text-sm font-semibold">
            Nutrient
          </label>
          <select id={`${id}-n`} className="field mt-1 w-auto pr-10" value={k} onChange={(e) => setKey(e.target.value)} data-testid="chart-nutrient">
            {report.nutrients.map((n) => (
              <option key={n.key} value={n.key}>
                {n.name} ({n.unit})
              </option>
            ))}
          </select>
        </div>
      </div>
      <div className="card mt-3 h-80">
        <Chart
          type="bar"
          data={data}
          options={options}
          role="img"
          aria-label={`${nutrient.name} per month: home-grown and bought stacked, the recommended intake as a dashed line${ranged ? ' at each end of its range' : ''}.${summary} The numbers are in the table below.`}
        />
      </div>
      <details className="mt-3">
        <summary className="cursor-pointer font-semibold text-sprout-700">Show {nutrient.name.toLowerCase()} as a table</summary>
        <div role="region" aria-label="Home share by month, table" tabIndex={0} className="relative mt-2 overflow-x-auto focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-focus">
          <table className="w-full min-w-max border-collapse text-sm" data-testid="month-table">
            <caption className="sr-only">
              {nutrient.name} per month in {nutrient.unit}
            </caption>
            <thead>
              <tr className="text-left">
                <th scope="col" className="p-2">Month</th>
                <th scope="col" className="p-2">Home-grown</th>
                <th scope="col" className="p-2">Bought</th>
                <th scope="col" className="p-2">
                  <abbr title={basisLong(report.needBasis[k])} className="no-underline">
                    Recommended intake
                  </abbr>
                </th>
                <th scope="col" className="p-2">Home share of what you ate</th>
                <th scope="col" className="p-2">Home share of recommended</th>
                <th scope="col" className="p-2">No value for</th>
              </tr>
            </thead>
            <tbody>
              {report.months.map((m) => {
                const v = m.values[k];
                return (
                  <tr key={m.month} className={`border-t border-loam-200 ${m.beforeRecords || m.future ? 'text-loam-700' : ''}`} data-month={m.month}>
                    <th scope="row" className="p-2 text-left font-semibold">
                      {longMonth(m.month)}
                      {m.beforeRecords ? <span className="block text-xs font-normal">before records</span> : null}
                      {m.future ? <span className="block text-xs font-normal">still to come</span> : null}
                    </th>
                    <td className="p-2">{amountText(v.home, nutrient.unit)}</td>
                    <td className="p-2">{amountText(v.bought, nutrient.unit)}</td>
                    <td className="p-2" data-testid={`month-need-${m.month}`}>{m.beforeRecords ? 'before records' : needText(v, nutrient.unit)}</td>
                    <td className="p-2" data-testid={`month-intake-${m.month}`}>
                      {shareText(v.shareOfIntake, v.uncertain)}
                      {report.intake.looksIncomplete && !m.beforeRecords && !m.future && v.shareOfIntake !== null ? (
                        <span className="block text-xs font-semibold text-berry-700">bought food looks incomplete</span>
                      ) : null}
                    </td>
                    <td className="p-2">{shareText(v.shareOfNeed, v.uncertain)}</td>
                    <td className="p-2" data-testid={`month-unknown-${m.month}`}>
                      {v.unknownGrams > 0 ? `${formatWeight(v.unknownGrams, units)} (${shareText(v.unknownShare, false)})` : 'none'}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </details>
    </section>
  );
}
