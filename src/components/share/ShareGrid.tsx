/**
 * Every key nutrient × every month, each cell coloured by home share of need on Selfsown's own
 * scale (src/lib/share-scale.ts) and carrying its value as text, so the grid reads without colour.
 */
import type { ShareResponse } from '@/lib/share-types';
import { SHARE_BANDS, UNKNOWN_BAND, percentText, shareBand } from '@/lib/share-scale';
import { longMonth, shortMonth } from './format';

export function ShareGrid({ report, currentMonth }: { report: ShareResponse; currentMonth: string }) {
  return (
    <section aria-labelledby="share-grid-h">
      <h2 id="share-grid-h" className="text-2xl font-extrabold">
        Home share of need, nutrient by month
      </h2>
      <p className="mt-1 max-w-2xl text-loam-700">
        Each cell: what the garden gave that month as a share of what the household needs. A dash means there is no figure — no need
        is set for that nutrient, nobody was at home, or the reference food has no value for it.
      </p>
      <Legend />
      <div className="relative mt-3 overflow-x-auto rounded-2xl border border-loam-200 bg-white">
        <table className="min-w-max border-separate border-spacing-0.5 p-2 text-sm" data-testid="share-grid">
          <caption className="sr-only">Home share of need per nutrient and month, in percent</caption>
          <thead>
            <tr>
              <th scope="col" className="sticky left-0 bg-white p-2 text-left">
                Nutrient
              </th>
              {report.months.map((m, i) => (
                <th key={m.month} scope="col" className={`p-1 text-center font-semibold ${m.month > currentMonth ? 'text-loam-500' : ''}`}>
                  <abbr title={`${longMonth(m.month)}${m.month > currentMonth ? ' (still to come)' : ''}`} className="no-underline">
                    {shortMonth(m.month)}
                  </abbr>
                  {i === 0 || m.month.endsWith('-01') ? <span className="block text-xs font-normal text-loam-700">{m.month.slice(0, 4)}</span> : null}
                </th>
              ))}
              <th scope="col" className="p-1 text-center">
                Period
              </th>
            </tr>
          </thead>
          <tbody>
            {report.nutrients.map((n) => (
              <tr key={n.key}>
                <th scope="row" className="sticky left-0 bg-white p-2 text-left font-semibold whitespace-nowrap">
                  {n.name} <span className="font-normal text-loam-700">({n.unit})</span>
                </th>
                {report.months.map((m) => (
                  <Cell key={m.month} share={m.values[n.key].shareOfNeed} label={`${n.name}, ${longMonth(m.month)}`} testId={`cell-${n.key}-${m.month}`} />
                ))}
                <Cell share={report.total.values[n.key].shareOfNeed} label={`${n.name}, whole period`} testId={`cell-${n.key}-total`} strong />
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

function Cell({ share, label, testId, strong = false }: { share: number | null; label: string; testId: string; strong?: boolean }) {
  const band = shareBand(share);
  const text = percentText(share);
  return (
    <td
      className={`min-w-12 rounded-md px-1 py-2 text-center tabular-nums ${strong ? 'font-extrabold' : 'font-semibold'} ${band === UNKNOWN_BAND ? 'border border-dashed border-loam-200' : ''}`}
      style={{ background: band.background, color: band.text }}
      data-testid={testId}
      data-band={band.label}
    >
      <span aria-hidden="true">{text.replace(' %', '')}</span>
      <span className="sr-only">
        {label}: {share === null ? 'no figure' : `${text} of need from home`}
      </span>
    </td>
  );
}

function Legend() {
  return (
    <ul className="mt-3 flex flex-wrap gap-2 text-sm" aria-label="Colour key">
      {[...SHARE_BANDS, UNKNOWN_BAND].map((b) => (
        <li key={b.label} className="flex items-center gap-2">
          <span
            className={`inline-block h-6 w-8 rounded-md ${b === UNKNOWN_BAND ? 'border border-dashed border-loam-500' : 'border border-loam-200'}`}
            style={{ background: b.background }}
            aria-hidden="true"
          />
          {b.label === 'no figure' ? 'no figure (–)' : b.label}
        </li>
      ))}
    </ul>
  );
}
