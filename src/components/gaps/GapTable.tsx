/**
 * The numbers beside the gap strip: for each key nutrient the year's home share of need, the
 * shortfall with its unit, the leanest months, the crop that would close the shortfall on the least
 * area (and how much), and the crops whose food is still there in the lean months. Stacks into
 * cards on a phone.
 */
import type { GapsResponse } from '@/lib/gap-types';
import type { CarryCrop } from '@/lib/gaps';
import { formatAmount } from '@/lib/format-number';
import { percentText } from '@/lib/share-scale';
import { amountText, shortMonth } from '@/components/share/format';

const HOW: Record<CarryCrop['how'], string> = { fresh: 'picked fresh', stored: 'from store', both: 'fresh and stored' };

export function GapTable({ report }: { report: GapsResponse }) {
  return (
    <section aria-labelledby="gap-table-h">
      <h2 id="gap-table-h" className="text-2xl font-extrabold">
        Shortfall and what would close it
      </h2>
      <div className="mt-3 overflow-hidden rounded-2xl border border-loam-200 bg-white">
        <table className="w-full border-collapse text-left text-sm max-md:block" data-testid="gap-table">
          <caption className="sr-only">Per nutrient: share of need from home over the year, shortfall, leanest months and crops</caption>
          <thead className="border-b border-loam-200 bg-loam-50 max-md:hidden">
            <tr>
              <th scope="col" className="p-2">Nutrient</th>
              <th scope="col" className="p-2">From home</th>
              <th scope="col" className="p-2">Shortfall</th>
              <th scope="col" className="p-2">Leanest</th>
              <th scope="col" className="p-2">Least area</th>
              <th scope="col" className="p-2">Carries into lean months</th>
            </tr>
          </thead>
          <tbody className="max-md:block">
            {report.nutrients.map((n) => {
              const best = n.leastAreaCrops[0];
              return (
                <tr key={n.key} data-testid={`gap-row-${n.key}`} className="border-b border-loam-100 align-top last:border-b-0 max-md:grid max-md:grid-cols-2 max-md:gap-x-3 max-md:gap-y-1 max-md:p-3">
                  <th scope="row" className="p-2 font-bold max-md:p-0 max-md:text-base">
                    {n.name}
                  </th>
                  <td className="p-2 tabular-nums max-md:p-0 max-md:text-right max-md:text-base">
                    <span className="font-semibold">{percentText(n.shareOfNeed)}</span>
                    <span className="md:hidden"> of need</span>
                  </td>
                  <td className="p-2 tabular-nums max-md:col-span-2 max-md:p-0">
                    <span className="md:hidden text-loam-700">Short by </span>
                    {n.shortfall === null ? 'no figure' : n.shortfall === 0 ? 'none' : amountText(n.shortfall, n.unit)}
                  </td>
                  <td className="p-2 max-md:col-span-2 max-md:p-0">
                    <span className="md:hidden text-loam-700">Leanest: </span>
                    {n.leanMonths.length === 0 ? '–' : n.leanMonths.map((m) => shortMonth(m)).join(', ')}
                  </td>
                  <td className="p-2 max-md:col-span-2 max-md:p-0" data-testid={`least-area-${n.key}`}>
                    <span className="md:hidden text-loam-700">Least area: </span>
                    {best ? (
                      <>
                        {best.name} ({amountText(best.perM2, `${n.unit}/m²`)}
                        {best.yieldSource === 'own' ? ', your own yield' : ''})
                        {best.areaToCloseM2 > 0 ? <>: {formatAmount(best.areaToCloseM2)} m² closes it</> : null}
                        {n.leastAreaCrops.length > 1 ? (
                          <span className="block text-loam-700">then {n.leastAreaCrops.slice(1, 3).map((c) => c.name).join(', ')}</span>
                        ) : null}
                      </>
                    ) : (
                      'no reference crop has a value'
                    )}
                  </td>
                  <td className="p-2 max-md:col-span-2 max-md:p-0" data-testid={`carry-${n.key}`}>
                    <span className="md:hidden text-loam-700">Carries into lean months: </span>
                    {n.carryCrops.length === 0
                      ? '–'
                      : n.carryCrops.slice(0, 3).map((c, i) => (
                          <span key={c.cropKey}>
                            {i > 0 ? '; ' : ''}
                            {c.name} ({HOW[c.how]}, {c.covers.map((m) => shortMonth(m)).join(' ')})
                          </span>
                        ))}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </section>
  );
}
