/**
 * Month by month for one chosen nutrient: home-grown and bought as stacked bars, the household's
 * need as a line. A table with the same numbers sits below for those who read rather than look.
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
  type ChartData,
  type ChartOptions,
} from 'chart.js';
import { useId, useState } from 'react';
import { Chart } from 'react-chartjs-2';
import type { ShareResponse } from '@/lib/share-types';
import { percentText } from '@/lib/share-scale';
import { amountText, longMonth, shortMonth } from './format';

ChartJS.register(BarController, LineController, BarElement, LineElement, PointElement, CategoryScale, LinearScale, Tooltip, Legend);

// Palette of src/styles/global.css: sprout for home, rind for bought, loam for need.
const HOME = '#5f9a3f';
const BOUGHT = '#f6c866';
const NEED = '#2e2218';

/** No animation for automated browsers (steady screenshots) or people who asked for less motion. */
export function calmMotion(): boolean {
  if (typeof window === 'undefined') return true;
  return Boolean(navigator.webdriver) || Boolean(window.matchMedia?.('(prefers-reduced-motion: reduce)').matches);
}

export function MonthChart({ report }: { report: ShareResponse }) {
  const [key, setKey] = useState<string>('energy_kcal');
  const id = useId();
  const nutrient = report.nutrients.find((n) => n.key === key) ?? report.nutrients[0]!;
  const k = nutrient.key;
  const labels = report.months.map((m, i) => (i === 0 || m.month.endsWith('-01') ? `${shortMonth(m.month)} ${m.month.slice(0, 4)}` : shortMonth(m.month)));
  const data: ChartData<'bar' | 'line', (number | null)[], string> = {
    labels,
    datasets: [
      { type: 'bar', label: 'Home-grown', data: report.months.map((m) => m.values[k].home), backgroundColor: HOME, stack: 'eaten', order: 2 },
      { type: 'bar', label: 'Bought', data: report.months.map((m) => m.values[k].bought), backgroundColor: BOUGHT, stack: 'eaten', order: 2 },
      {
        type: 'line',
        label: 'Need',
        data: report.months.map((m) => m.values[k].need),
        borderColor: NEED,
        // No fill: the legend then draws the need as a dashed outline, like the line itself.
        backgroundColor: 'transparent',
        pointBackgroundColor: NEED,
        borderDash: [6, 4],
        borderWidth: 2,
        pointRadius: 3,
        order: 1,
      },
    ],
  };
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
          aria-label={`${nutrient.name} per month: home-grown and bought stacked, need as a dashed line. The numbers are in the table below.`}
        />
      </div>
      <details className="mt-3">
        <summary className="cursor-pointer font-semibold text-sprout-700">Show {nutrient.name.toLowerCase()} as a table</summary>
        <div className="relative mt-2 overflow-x-auto">
          <table className="w-full min-w-max border-collapse text-sm" data-testid="month-table">
            <caption className="sr-only">
              {nutrient.name} per month in {nutrient.unit}
            </caption>
            <thead>
              <tr className="text-left">
                <th scope="col" className="p-2">Month</th>
                <th scope="col" className="p-2">Home-grown</th>
                <th scope="col" className="p-2">Bought</th>
                <th scope="col" className="p-2">Need</th>
                <th scope="col" className="p-2">Home share of intake</th>
                <th scope="col" className="p-2">Home share of need</th>
              </tr>
            </thead>
            <tbody>
              {report.months.map((m) => {
                const v = m.values[k];
                return (
                  <tr key={m.month} className="border-t border-loam-200" data-month={m.month}>
                    <th scope="row" className="p-2 text-left font-semibold">{longMonth(m.month)}</th>
                    <td className="p-2">{amountText(v.home, nutrient.unit)}</td>
                    <td className="p-2">{amountText(v.bought, nutrient.unit)}</td>
                    <td className="p-2">{amountText(v.need, nutrient.unit)}</td>
                    <td className="p-2" data-testid={`month-intake-${m.month}`}>{percentText(v.shareOfIntake)}</td>
                    <td className="p-2">{percentText(v.shareOfNeed)}</td>
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
