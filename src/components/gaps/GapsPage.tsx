/**
 * The Gaps island: picks the growing year, fetches GET …/gaps with TanStack Query and lays out the
 * nutrient × month strip with the table beside it, then the plan form (any member may plan; an
 * owner or grower may turn the plan into plantings).
 */
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { QueryProvider } from '@/components/QueryProvider';
import { monthName } from '@/lib/months';
import { GapStrip } from './GapStrip';
import { GapTable } from './GapTable';
import { PlanPanel } from './PlanPanel';
import { getGaps } from './plan-api';
import { countText } from '@/lib/plural';

/** A frost date 'MM-DD' as words. Example: `dayText('05-01')` → '1 May' */
function dayText(mmdd: string): string {
  const [m, d] = mmdd.split('-').map(Number);
  return `${d} ${monthName(m!)}`;
}

interface Props {
  householdId: number;
  years: { year: number; label: string }[];
  initialYear: number;
  /** Owner or grower: may turn a plan into plantings. */
  canPlant: boolean;
  peopleHref: string;
}

export default function GapsPage(props: Props) {
  return (
    <QueryProvider>
      <Gaps {...props} />
    </QueryProvider>
  );
}

function Gaps({ householdId, years, initialYear, canPlant, peopleHref }: Props) {
  const [year, setYear] = useState(initialYear);
  const query = useQuery({ queryKey: ['gaps', householdId, year], queryFn: () => getGaps(householdId, year), placeholderData: keepPreviousData });
  const data = query.data;
  return (
    <div>
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor="gaps-year" className="block font-semibold">
            Growing year
          </label>
          <select id="gaps-year" className="field mt-1 w-auto pr-10" value={year} onChange={(e) => setYear(Number(e.target.value))}>
            {years.map((y) => (
              <option key={y.year} value={y.year}>
                {y.label}
              </option>
            ))}
          </select>
        </div>
        {query.isFetching ? (
          <p className="pb-3 text-sm text-loam-700" role="status">
            Looking for gaps…
          </p>
        ) : null}
      </div>
      {query.isError ? (
        <p role="alert" className="mt-6 rounded-xl border-l-4 border-berry-700 bg-white p-4 font-semibold text-berry-700">
          {query.error.message}
        </p>
      ) : null}
      {data ? (
        <div className="mt-6 space-y-8" data-testid="gaps-report" data-year={data.year}>
          {data.peopleCount === 0 ? (
            <p className="caution">
              No one is listed as eating here yet, so there is no need to fall short of.{' '}
              <a className="font-semibold underline" href={peopleHref}>
                Add the people who eat in the household
              </a>
              .
            </p>
          ) : null}
          <p className="text-loam-700">
            Harvest windows are placed by the last spring frost on {dayText(data.frostDates.lastSpringFrost)} and the first autumn frost on{' '}
            {dayText(data.frostDates.firstAutumnFrost)}
            {data.frostDates.defaulted ? (
              <>
                {' '}
                (the usual dates for your hemisphere: <a className="underline" href={`/households/${householdId}/beds`}>set your own on the Beds page</a>)
              </>
            ) : null}
            . Yields are the reference
            table’s typical ones{data.ownYieldCrops.length > 0 ? `, except your own measured yield for ${countText(data.ownYieldCrops.length, 'crop')}` : ''}.
          </p>
          <div className="grid grid-cols-1 gap-8 xl:grid-cols-[minmax(0,5fr)_minmax(0,7fr)]">
            <GapStrip report={data} />
            <GapTable report={data} />
          </div>
          <PlanPanel key={data.year} householdId={householdId} report={data} canPlant={canPlant} />
        </div>
      ) : null}
    </div>
  );
}
