/**
 * The picture of the Gaps page: one strip per key nutrient, one square per month, coloured by the
 * home share of need on Selfsown's own scale (src/lib/share-scale.ts). The leanest months carry a
 * ring. Every square carries its figure (so colour is never the only cue: "none" is also hatched,
 * a missing figure dashed) and says its month and share in words for screen readers; the table
 * beside the strip gives the numbers.
 */
import type { GapsResponse } from '@/lib/gap-types';
import { SHARE_BANDS, UNKNOWN_BAND, bandStyle, percentText, shareBand } from '@/lib/share-scale';
import { longMonth, shortMonth } from '@/components/share/format';

export function GapStrip({ report }: { report: GapsResponse }) {
  const months = report.nutrients[0]?.months ?? [];
  return (
    <section aria-labelledby="gap-strip-h">
      <h2 id="gap-strip-h" className="text-2xl font-extrabold">
        Which nutrients, which months
      </h2>
      <p className="mt-1 text-loam-700">
        Each square is one month’s home share of need, in percent. A red ring marks the leanest months of each nutrient; hatched
        squares had nothing from home; dashed squares have no figure (before your records start, still to come, or no need set).
      </p>
      <ul className="mt-3 flex flex-wrap gap-x-3 gap-y-1 text-sm" aria-label="Colour key">
        {[...SHARE_BANDS, UNKNOWN_BAND].map((b) => (
          <li key={b.label} className="flex items-center gap-1.5">
            <span className={`inline-block h-5 w-6 rounded ${b === UNKNOWN_BAND ? 'border border-dashed border-loam-500' : 'border border-loam-300'}`} style={bandStyle(b)} aria-hidden="true" />
            {b.label}
          </li>
        ))}
      </ul>
      <div role="region" aria-label="Gaps by nutrient and month" tabIndex={0} className="mt-3 overflow-x-auto focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-focus rounded-2xl border border-loam-200 bg-white p-2">
        <table className="w-full border-separate border-spacing-0.5 text-sm" data-testid="gap-strip">
          <caption className="sr-only">Home share of need per nutrient and month, with the leanest months marked</caption>
          <thead>
            <tr>
              <th scope="col" className="sticky left-0 z-10 bg-white text-left text-xs font-semibold text-loam-700">
                Nutrient
              </th>
              {months.map((m) => (
                <th key={m.month} scope="col" className="text-center text-xs font-semibold text-loam-700">
                  <abbr title={longMonth(m.month)} className="no-underline">
                    {shortMonth(m.month).slice(0, 1)}
                  </abbr>
                  <span className="sr-only">{longMonth(m.month)}</span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {report.nutrients.map((n) => (
              <tr key={n.key} data-testid={`strip-${n.key}`}>
                <th scope="row" className="sticky left-0 z-10 max-w-[5.5rem] truncate bg-white pr-1 text-left font-semibold sm:max-w-none" title={n.name}>
                  {n.name}
                </th>
                {n.months.map((m) => {
                  const share = m.counted ? m.shareOfNeed : null;
                  const band = shareBand(share);
                  const lean = n.leanMonths.includes(m.month);
                  return (
                    <td
                      key={m.month}
                      className={`h-8 min-w-5 rounded px-0.5 text-center text-[0.6875rem] leading-none font-semibold tabular-nums ${band === UNKNOWN_BAND ? 'border border-dashed border-loam-500' : ''} ${lean ? 'outline-2 outline-offset-[-3px] outline-berry-700' : ''}`}
                      style={bandStyle(band)}
                      data-testid={`strip-${n.key}-${m.month}`}
                      data-band={band.label}
                      data-lean={lean ? 'true' : undefined}
                      title={`${n.name}, ${longMonth(m.month)}: ${share === null ? 'no figure' : percentText(share)}${lean ? ' (one of the leanest months)' : ''}`}
                    >
                      <span aria-hidden="true">{share === null ? '' : percentText(share).replace(' %', '')}</span>
                      <span className="sr-only">
                        {longMonth(m.month)}: {share === null ? 'no figure' : `${percentText(share)} of need from home`}
                        {lean ? ', one of the leanest months' : ''}
                      </span>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
