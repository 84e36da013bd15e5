/** The two big numbers: home share of energy and of protein over the period, with need coverage beside. */
import type { ShareResponse } from '@/lib/share-types';
import { percentText } from '@/lib/share-scale';
import { amountText } from './format';

const HEADLINE = ['energy_kcal', 'protein_g'] as const;

export function Headline({ report }: { report: ShareResponse }) {
  return (
    <section aria-labelledby="share-headline">
      <h2 id="share-headline" className="sr-only">
        Home share over the period
      </h2>
      <div className="grid gap-4 sm:grid-cols-2">
        {HEADLINE.map((key) => {
          const n = report.nutrients.find((x) => x.key === key)!;
          const v = report.total.values[key];
          const ratio = report.ratio[key];
          return (
            <article key={key} className="card" data-testid={`headline-${key}`}>
              <h3 className="text-lg font-bold">{key === 'energy_kcal' ? 'Calories' : 'Protein'} from your own ground</h3>
              <div className="mt-2 flex flex-wrap items-end gap-x-6 gap-y-2">
                <p>
                  <span className="block text-6xl font-extrabold leading-none text-sprout-900" data-testid={`intake-share-${key}`}>
                    {percentText(v.shareOfIntake)}
                  </span>
                  <span className="text-sm text-loam-700">of what you ate</span>
                </p>
                <p>
                  <span className="block text-4xl font-extrabold leading-none text-loam-900" data-testid={`need-share-${key}`}>
                    {percentText(v.shareOfNeed)}
                  </span>
                  <span className="text-sm text-loam-700">of what you need</span>
                </p>
              </div>
              <dl className="mt-4 grid grid-cols-3 gap-2 text-sm">
                <div>
                  <dt className="text-loam-700">Home</dt>
                  <dd className="font-semibold">{amountText(v.home, n.unit)}</dd>
                </div>
                <div>
                  <dt className="text-loam-700">Bought</dt>
                  <dd className="font-semibold">{amountText(v.bought, n.unit)}</dd>
                </div>
                <div>
                  <dt className="text-loam-700">Need</dt>
                  <dd className="font-semibold">{amountText(v.need, n.unit)}</dd>
                </div>
              </dl>
              <p className="mt-3 text-sm text-loam-700">
                Self-sufficiency ratio (FAO): <span className="font-semibold text-loam-900">{percentText(ratio)}</span>
              </p>
            </article>
          );
        })}
      </div>
    </section>
  );
}
