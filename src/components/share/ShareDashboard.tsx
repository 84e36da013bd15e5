/**
 * The Share dashboard island: picks the period, fetches GET /api/households/{id}/share with
 * TanStack Query and lays out the headline, the month chart, the nutrient grid, the top crops and
 * the uses of the harvest. All numbers come from the server; this file only shows them.
 */
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { aboutCautions } from '@/lib/cautions';
import type { ShareResponse } from '@/lib/share-types';
import { get } from '@/components/entries/api';
import { QueryProvider } from '@/components/QueryProvider';
import type { UnitSystem } from '@/lib/units';
import { Headline } from './Headline';
import { HarvestUses } from './HarvestUses';
import { MonthChart } from './MonthChart';
import { ShareGrid } from './ShareGrid';
import { TopCrops } from './TopCrops';
import { longMonth, rangeText } from './format';

export interface PeriodOption {
  from: string;
  to: string;
  label: string;
}

interface Props {
  householdId: number;
  units: UnitSystem;
  periods: PeriodOption[];
  initial: { from: string; to: string };
  peopleHref: string;
  /** The household's page, where the owner may change the month its records start. */
  settingsHref: string;
  /** This month in the household's time zone: later months are still to come. */
  currentMonth: string;
  /** Someone who eats in the household is vegetarian (adds the zinc caution). */
  vegetarian: boolean;
}

export default function ShareDashboard(props: Props) {
  return (
    <QueryProvider>
      <Dashboard {...props} />
    </QueryProvider>
  );
}

function Dashboard({ householdId, units, periods, initial, peopleHref, settingsHref, currentMonth, vegetarian }: Props) {
  const [range, setRange] = useState(initial);
  const known = periods.find((p) => p.from === range.from && p.to === range.to);
  const options = known ? periods : [{ ...range, label: rangeText(range.from, range.to) }, ...periods];

  // Keep the period in the address, so a reload or a shared link shows the same months.
  useEffect(() => {
    const url = new URL(window.location.href);
    url.searchParams.set('from', range.from);
    url.searchParams.set('to', range.to);
    window.history.replaceState(null, '', url);
  }, [range]);

  const query = useQuery({
    queryKey: ['share', householdId, range.from, range.to],
    queryFn: () => get<ShareResponse>(`/api/households/${householdId}/share?from=${range.from}&to=${range.to}`),
    placeholderData: keepPreviousData,
  });
  const data = query.data;

  return (
    <div>
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor="share-period" className="block font-semibold">
            Period
          </label>
          <select
            id="share-period"
            className="field mt-1 w-auto pr-10"
            value={`${range.from}..${range.to}`}
            onChange={(e) => {
              const [from, to] = e.target.value.split('..');
              if (from && to) setRange({ from, to });
            }}
          >
            {options.map((p) => (
              <option key={`${p.from}..${p.to}`} value={`${p.from}..${p.to}`}>
                {p.label}
              </option>
            ))}
          </select>
        </div>
        <p className="pb-3 text-loam-700" data-testid="share-range">
          {rangeText(range.from, range.to)}
        </p>
        {query.isFetching ? (
          <p className="pb-3 text-sm text-loam-700" role="status">
            Counting…
          </p>
        ) : null}
      </div>

      {query.isError ? (
        <p role="alert" className="mt-6 rounded-xl border-l-4 border-berry-700 bg-white p-4 font-semibold text-berry-700">
          {query.error.message}
        </p>
      ) : null}
      {!data && query.isPending ? <p className="mt-6 text-lg">Counting your harvest…</p> : null}

      {data ? (
        <div className="mt-6 space-y-10" data-testid="share-report" data-from={data.from} data-to={data.to}>
          {data.peopleCount === 0 ? (
            <p className="caution">
              No one is listed as eating here yet, so there is no need to compare with.{' '}
              <a className="font-semibold underline" href={peopleHref}>
                Add the people who eat in the household
              </a>
              .
            </p>
          ) : null}
          <div className="space-y-3">
            <Headline report={data} boughtHref={`/households/${householdId}/bought`} />
            {data.months.some((m) => m.beforeRecords) ? (
              <p className="max-w-3xl text-sm text-loam-700" data-testid="records-note">
                The household’s records start in {longMonth(data.recordsSince)}: earlier months are greyed as “before records”, count no
                need and stay out of every total. The owner can change the month on the{' '}
                <a className="font-semibold underline" href={settingsHref}>
                  household’s page
                </a>
                .
              </p>
            ) : null}
            {data.months.some((m) => m.future) ? (
              <p className="max-w-3xl text-sm text-loam-700" data-testid="future-note">
                Months after {longMonth(data.currentMonth ?? currentMonth)} are still to come and stand apart: the big figures are the
                months so far; the period’s total counts the stored and bulk-bought food already set to be eaten later, but no fresh
                harvest yet. “Last 12 months” gives a year that is complete.
              </p>
            ) : null}
          </div>
          <MonthChart report={data} units={units} />
          <ShareGrid report={data} vegetarian={vegetarian} />
          <TopCrops report={data} />
          <HarvestUses report={data} units={units} />
          <About vegetarian={vegetarian} />
          <Sources report={data} />
        </div>
      ) : null}
    </div>
  );
}

function Sources({ report }: { report: ShareResponse }) {
  return (
    <section aria-labelledby="share-sources" className="text-sm text-loam-700">
      <h2 id="share-sources" className="text-lg font-bold text-loam-900">
        Where the numbers come from
      </h2>
      <ul className="mt-2 list-disc space-y-1 pl-5">
        <li>
          Food composition:{' '}
          {report.datasets.length ? report.datasets.map((d) => `${d.name} (${d.release})`).join('; ') : 'no entries yet'}; per 100 g edible
          portion, refuse removed.
        </li>
        <li>
          Recommended intakes: National Academies Dietary Reference Intakes (RDA, or AI where no RDA is set — an AI is not a
          requirement; potassium per the 2019 update); energy from the IOM 2005 estimated energy requirement equations, or the kcal a
          day you stated; carbohydrate and fat as the IOM 2005 acceptable range (AMDR) of that energy.
        </li>
        <li>
          Stored, preserved and bought food spread over two months or more is counted evenly per day from its date; seed, gifts, sales
          and losses are not eaten at home. Preserved food loses vitamins by its method (USDA Table of Nutrient Retention Factors,
          Release 6).
        </li>
        <li>
          Production against supply: the FAO self-sufficiency ratio, production × 100 ÷ (production + bought − sold − given), over the
          period shown (a growing year unless you pick another).
        </li>
      </ul>
    </section>
  );
}

function About({ vegetarian }: { vegetarian: boolean }) {
  return (
    <section aria-labelledby="share-about" data-testid="share-about">
      <h2 id="share-about" className="text-2xl font-extrabold">
        About these figures
      </h2>
      <ul className="mt-2 max-w-3xl list-disc space-y-1 pl-5 text-loam-900">
        {aboutCautions({ vegetarian }).map((c) => (
          <li key={c.id} data-caution={c.id}>
            {c.text}
          </li>
        ))}
      </ul>
    </section>
  );
}
