/**
 * The Larder island: fetches GET …/larder with TanStack Query and shows what is still in store
 * today — totals, sums by category or by crop, the next twelve months with the empty ones beside
 * the gap finder's lean months, and a card per lot where owners and growers record what happened.
 */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { QueryProvider } from '@/components/QueryProvider';
import { Icon } from '@/components/icons/Icon';
import { addMonths, monthOf } from '@/lib/months';
import { formatWeight } from '@/lib/units';
import { dateText, energyText, monthText, proteinText } from './larder-format';
import { getLarder, larderKey } from './larder-api';
import { LotCard } from './LotCard';

interface Props {
  householdId: number;
  canWrite: boolean;
  /** 'YYYY-MM' months the gap finder counts as lean for energy this growing year; null when it could not say. */
  leanMonths: string[] | null;
  gapsHref: string;
  logHref: string;
}

export default function LarderPage(props: Props) {
  return (
    <QueryProvider>
      <Larder {...props} />
    </QueryProvider>
  );
}

function Larder({ householdId, canWrite, leanMonths, gapsHref, logHref }: Props) {
  const query = useQuery({ queryKey: larderKey(householdId), queryFn: () => getLarder(householdId) });
  const [by, setBy] = useState<'category' | 'crop'>('category');
  const data = query.data;
  if (query.isError) {
    return (
      <p role="alert" className="rounded-xl border-l-4 border-berry-700 bg-white p-4 font-semibold text-berry-700">
        {query.error.message}
      </p>
    );
  }
  if (!data) return <p role="status">Opening the larder…</p>;
  const groups = by === 'category' ? data.byCategory : data.byCrop;
  const months = Array.from({ length: 12 }, (_, i) => addMonths(monthOf(data.today), i));
  return (
    <div className="space-y-8" data-testid="larder" data-today={data.today}>
      <section aria-labelledby="larder-totals-h" className="card">
        <h2 id="larder-totals-h" className="text-sm font-semibold uppercase tracking-wide text-loam-700">
          In store on {dateText(data.today)}
        </h2>
        <p className="mt-1 text-4xl font-extrabold text-sprout-900" data-testid="larder-total">
          {formatWeight(data.totals.remainingGrams, data.units)}
        </p>
        <p className="text-lg text-loam-700">
          {energyText(data.totals.energyKcal)} · {proteinText(data.totals.proteinG)}
        </p>
        {data.lots.length === 0 ? (
          <p className="mt-3">
            Nothing stored or preserved is left.{' '}
            <a className="font-semibold underline" href={logHref}>
              Log a harvest as stored or preserved
            </a>{' '}
            to see it here.
          </p>
        ) : null}
      </section>

      <section aria-labelledby="larder-months-h">
        <h2 id="larder-months-h" className="text-2xl font-extrabold">
          The next twelve months
        </h2>
        <p className="mt-1 text-loam-700">
          A month is empty when every lot has run out by its first day. Lean months are the gap finder’s months with the lowest home share
          of energy (<a className="underline" href={gapsHref}>Gaps</a>).
        </p>
        <ul className="mt-3 grid grid-cols-3 gap-2 sm:grid-cols-6 lg:grid-cols-12" data-testid="larder-months">
          {months.map((m) => {
            const empty = data.emptyMonths.includes(m);
            const lean = leanMonths?.includes(m) ?? false;
            return (
              <li key={m} data-month={m} data-empty={empty} className={`rounded-xl border p-2 text-center ${empty ? 'border-berry-500 bg-berry-100 text-berry-700' : 'border-sprout-300 bg-sprout-100 text-sprout-900'}`}>
                <span className="block font-semibold">{monthText(m)}</span>
                <Icon name={empty ? 'jar-empty' : 'jar'} size={20} className="mx-auto my-0.5" />
                <span className="block text-sm">{empty ? 'empty' : 'stores'}</span>
                {lean ? <span className="mt-1 block rounded bg-rind-200 px-1 text-xs font-semibold text-loam-900">lean</span> : null}
              </li>
            );
          })}
        </ul>
      </section>

      {data.lots.length > 0 ? (
        <section aria-labelledby="larder-groups-h">
          <div className="flex flex-wrap items-center justify-between gap-3">
            <h2 id="larder-groups-h" className="text-2xl font-extrabold">
              What is left
            </h2>
            <div role="radiogroup" aria-label="Sum by" className="flex gap-2">
              {(['category', 'crop'] as const).map((k) => (
                <button key={k} type="button" role="radio" aria-checked={by === k} className={by === k ? 'btn-primary' : 'btn-quiet'} onClick={() => setBy(k)}>
                  By {k}
                </button>
              ))}
            </div>
          </div>
          <table className="mt-3 w-full border-collapse" data-testid="larder-groups">
            <caption className="sr-only">What is left, by {by}</caption>
            <thead>
              <tr className="text-left text-sm text-loam-700">
                <th scope="col" className="p-2">{by === 'category' ? 'Category' : 'Crop'}</th>
                <th scope="col" className="p-2">Left</th>
                <th scope="col" className="p-2 max-sm:hidden">Energy</th>
                <th scope="col" className="p-2">Runs out</th>
              </tr>
            </thead>
            <tbody>
              {groups.map((g) => (
                <tr key={g.key} className="border-t border-loam-200">
                  <th scope="row" className="p-2 text-left font-semibold">
                    {g.label}
                    <span className="block text-sm font-normal text-loam-700 sm:hidden">{energyText(g.energyKcal)}</span>
                  </th>
                  <td className="p-2">{formatWeight(g.remainingGrams, data.units)}</td>
                  <td className="p-2 max-sm:hidden">{energyText(g.energyKcal)}</td>
                  <td className="p-2">{dateText(g.runsOut)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}

      {data.lots.length > 0 ? (
        <section aria-labelledby="larder-lots-h">
          <h2 id="larder-lots-h" className="text-2xl font-extrabold">
            Lot by lot, soonest gone first
          </h2>
          <div className="mt-3 grid gap-4 lg:grid-cols-2">
            {data.lots.map((lot) => (
              <LotCard key={lot.harvestId} lot={lot} householdId={householdId} units={data.units} today={data.today} canWrite={canWrite} />
            ))}
          </div>
        </section>
      ) : null}
    </div>
  );
}
