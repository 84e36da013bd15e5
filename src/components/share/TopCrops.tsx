/** The crops that supplied most of each nutrient the household ate in the period. */
import type { ShareResponse } from '@/lib/share-types';
import { percentText } from '@/lib/share-scale';
import { amountText } from './format';

const PER_NUTRIENT = 3;

export function TopCrops({ report }: { report: ShareResponse }) {
  return (
    <section aria-labelledby="top-crops-h">
      <h2 id="top-crops-h" className="text-2xl font-extrabold">
        What gave the most
      </h2>
      {report.topCrops.length === 0 ? (
        <p className="mt-2 text-loam-700">Nothing home-grown was eaten in this period yet.</p>
      ) : (
        <div role="region" aria-label="Top crops, table" tabIndex={0} className="relative mt-3 overflow-x-auto focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-focus">
          <table className="w-full min-w-max border-collapse text-sm" data-testid="top-crops">
            <caption className="sr-only">The home-grown crops that supplied most of each nutrient, with amount and share of everything home-grown</caption>
            <thead>
              <tr className="text-left">
                <th scope="col" className="sticky left-0 z-10 bg-white p-2">Nutrient</th>
                {Array.from({ length: PER_NUTRIENT }, (_, i) => (
                  <th key={i} scope="col" className="p-2">
                    {i === 0 ? 'Most' : i === 1 ? 'Second' : 'Third'}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {report.nutrients.map((n) => {
                const ranked = report.topCrops
                  .filter((c) => (c.values[n.key] ?? 0) > 0)
                  .sort((a, b) => (b.values[n.key] ?? 0) - (a.values[n.key] ?? 0))
                  .slice(0, PER_NUTRIENT);
                return (
                  <tr key={n.key} className="border-t border-loam-200">
                    <th scope="row" className="sticky left-0 z-10 bg-white p-2 text-left font-semibold">
                      {n.name}
                    </th>
                    {Array.from({ length: PER_NUTRIENT }, (_, i) => {
                      const c = ranked[i];
                      return (
                        <td key={i} className="p-2">
                          {c ? (
                            <>
                              <span className="font-semibold">{c.name}</span>
                              <span className="block text-loam-700">
                                {amountText(c.values[n.key], n.unit)} · {percentText(c.shareOfHome[n.key])} of home
                              </span>
                            </>
                          ) : (
                            <span className="text-loam-500">–</span>
                          )}
                        </td>
                      );
                    })}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
