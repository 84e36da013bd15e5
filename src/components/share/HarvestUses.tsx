/** Where the period's harvest went: eaten fresh, stored, preserved, seed, given, sold, lost. */
import type { ShareResponse } from '@/lib/share-types';
import { USE_LABELS } from '@/lib/entry-schemas';
import { formatWeight, formatWeightPair, type UnitSystem } from '@/lib/units';
import { percentText } from '@/lib/share-scale';
import { USE_COLOURS as COLOURS } from '@/lib/palette';
import { amountText } from './format';

export function HarvestUses({ report, units }: { report: ShareResponse; units: UnitSystem }) {
  const total = report.uses.reduce((s, u) => s + u.grams, 0);
  return (
    <section aria-labelledby="uses-h">
      <h2 id="uses-h" className="text-2xl font-extrabold">
        Where the harvest went
      </h2>
      {total === 0 ? (
        <p className="mt-2 text-loam-700">No harvest is logged in this period.</p>
      ) : (
        <>
          <p className="mt-1 text-loam-700">
            {formatWeight(total, units)} harvested in the period (weight as picked or dug; edible portion beside).
          </p>
          <div className="mt-3 flex h-6 overflow-hidden rounded-full border border-loam-200" aria-hidden="true">
            {report.uses
              .filter((u) => u.grams > 0)
              .map((u) => (
                <span key={u.use} style={{ width: `${(u.grams / total) * 100}%`, background: COLOURS[u.use] }} />
              ))}
          </div>
          <div role="region" aria-label="Where the harvest went, table" tabIndex={0} className="relative mt-3 overflow-x-auto focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-focus">
          <table className="w-full max-w-2xl border-collapse text-sm" data-testid="harvest-uses">
            <caption className="sr-only">The period's harvest by use</caption>
            <thead>
              <tr className="text-left">
                <th scope="col" className="sticky left-0 z-10 bg-white p-2">Use</th>
                <th scope="col" className="p-2">Harvested</th>
                <th scope="col" className="p-2">Edible portion</th>
                <th scope="col" className="p-2">Energy</th>
                <th scope="col" className="p-2">Share of weight</th>
              </tr>
            </thead>
            <tbody>
              {report.uses.map((u) => (
                <tr key={u.use} className="border-t border-loam-200" data-use={u.use}>
                  <th scope="row" className="sticky left-0 z-10 bg-white p-2 text-left font-semibold">
                    <span className="mr-2 inline-block h-3 w-3 rounded-full" style={{ background: COLOURS[u.use] }} aria-hidden="true" />
                    {USE_LABELS[u.use]}
                  </th>
                  <td className="p-2">{formatWeightPair(u.grams, u.edibleGrams, units).weight}</td>
                  <td className="p-2">{formatWeightPair(u.grams, u.edibleGrams, units).edible}</td>
                  <td className="p-2">{amountText(u.energyKcal, 'kcal')}</td>
                  <td className="p-2">{percentText(u.grams / total)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          </div>
        </>
      )}
    </section>
  );
}
