/**
 * The two big numbers: home share of energy and of protein over the headline months (the growing
 * year so far: neither before the household's records nor still to come), with the recommended
 * intake beside. A figure resting on too much food of unknown value is flagged, and when the
 * logged food is far below the energy need the "of what you ate" share says bought food looks
 * incomplete instead of reading a flattering 100 %.
 */
import type { ShareResponse } from '@/lib/share-types';
import { percentText, shareText, unknownText } from '@/lib/share-scale';
import { amountText, basisLong, basisShort, needText, rangeText } from './format';

const HEADLINE = ['energy_kcal', 'protein_g'] as const;

export function Headline({ report, boughtHref }: { report: ShareResponse; boughtHref: string }) {
  const headline = report.headline;
  if (!headline) {
    return (
      <section aria-labelledby="share-headline">
        <h2 id="share-headline" className="text-2xl font-extrabold">
          So far
        </h2>
        <p className="mt-2 text-loam-700" data-testid="headline-none">
          No month of this period is both on record and already past, so there is no share to give yet.
        </p>
      </section>
    );
  }
  const incomplete = report.intake.looksIncomplete;
  return (
    <section aria-labelledby="share-headline">
      <h2 id="share-headline" className="text-2xl font-extrabold">
        So far: <span data-testid="headline-range">{rangeText(headline.from, headline.to)}</span>
      </h2>
      {incomplete ? (
        <p className="caution mt-3 max-w-3xl" data-testid="intake-incomplete">
          Bought food looks incomplete: everything logged, home-grown and bought, comes to{' '}
          {percentText(report.intake.loggedEnergyShareOfNeed)} of the household’s energy need in these months, so “of what you ate”
          would flatter the garden.{' '}
          <a className="font-semibold underline" href={boughtHref}>
            Log bought food
          </a>{' '}
          for an honest share.
        </p>
      ) : null}
      <div className="mt-3 grid gap-4 sm:grid-cols-2">
        {HEADLINE.map((key) => {
          const n = report.nutrients.find((x) => x.key === key)!;
          const v = headline.values[key];
          const ratio = report.ratio[key];
          const unknown = unknownText(v.unknownShare, n.name.toLowerCase());
          return (
            <article key={key} className="card" data-testid={`headline-${key}`}>
              <h3 className="text-lg font-bold">{key === 'energy_kcal' ? 'Calories' : 'Protein'} from your own ground</h3>
              <div className="mt-2 flex flex-wrap items-end gap-x-6 gap-y-2">
                <p>
                  {incomplete && v.shareOfIntake !== null ? (
                    <span className="block text-2xl font-extrabold leading-tight text-berry-700" data-testid={`intake-share-${key}`}>
                      bought food looks incomplete
                    </span>
                  ) : (
                    <span className="block text-6xl font-extrabold leading-none text-sprout-900" data-testid={`intake-share-${key}`}>
                      {shareText(v.shareOfIntake, v.uncertain)}
                    </span>
                  )}
                  <span className="text-sm text-loam-700">of what you ate</span>
                </p>
                <p>
                  <span className="block text-4xl font-extrabold leading-none text-loam-900" data-testid={`need-share-${key}`}>
                    {shareText(v.shareOfNeed, v.uncertain)}
                  </span>
                  <span className="text-sm text-loam-700">of the recommended intake</span>
                </p>
              </div>
              {unknown ? (
                <p className={`mt-2 text-sm ${v.uncertain ? 'font-semibold text-berry-700' : 'text-loam-700'}`} data-testid={`unknown-${key}`}>
                  {v.uncertain ? 'Uncertain: ' : ''}
                  {unknown}.
                </p>
              ) : null}
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
                  <dt className="text-loam-700">
                    Recommended
                    {report.needBasis[key] ? (
                      <>
                        {' '}
                        <abbr title={basisLong(report.needBasis[key])} className="no-underline">
                          ({basisShort(report.needBasis[key])})
                        </abbr>
                      </>
                    ) : null}
                  </dt>
                  <dd className="font-semibold">{needText(v, n.unit)}</dd>
                </div>
              </dl>
              <p className="mt-3 text-sm text-loam-700" data-testid={`ratio-${key}`}>
                Production against supply (FAO self-sufficiency ratio, {rangeText(report.from, report.to)}):{' '}
                <span className="font-semibold text-loam-900">{percentText(ratio)}</span>
                {report.intake.looksIncomplete ? (
                  // Supply counts bought food too: with purchases missing, the ratio reads too high.
                  <span data-testid={`ratio-incomplete-${key}`}> — too high while bought food looks incomplete</span>
                ) : null}
              </p>
            </article>
          );
        })}
      </div>
    </section>
  );
}
