/**
 * Every key nutrient × every month, each cell coloured by home share of the recommended intake on
 * Selfsown's own scale (src/lib/share-scale.ts) and carrying its value as text, so the grid reads
 * without colour. Months before the household's records are greyed and count no need; months
 * still to come stand apart after a gap; a share resting on too much food of unknown value is
 * marked "?". A short caution sits under the nutrients that need one (src/lib/cautions.ts).
 */
import { Fragment, useEffect, useRef } from 'react';
import { nutrientCautions } from '@/lib/cautions';
import type { ShareResponse } from '@/lib/share-types';
import type { ShareValue } from '@/lib/shares';
import { BEFORE_RECORDS_BAND, SHARE_BANDS, UNKNOWN_BAND, bandStyle, percentText, shareBand, unknownText } from '@/lib/share-scale';
import { basisLong, basisShort, longMonth, needText, shortMonth } from './format';

type Kind = 'before' | 'counted' | 'future';

/** Runs of months of one kind, for the header row that names them once. */
function runs(months: ShareResponse['months']): { kind: Kind; span: number }[] {
  const out: { kind: Kind; span: number }[] = [];
  for (const m of months) {
    const kind: Kind = m.beforeRecords ? 'before' : m.future ? 'future' : 'counted';
    const last = out.at(-1);
    if (last && last.kind === kind) last.span += 1;
    else out.push({ kind, span: 1 });
  }
  return out;
}

const RUN_LABEL: Record<Kind, string> = { before: 'before records', counted: 'on record', future: 'to come' };

export function ShareGrid({ report, vegetarian = false }: { report: ShareResponse; vegetarian?: boolean }) {
  const firstFuture = report.months.findIndex((m) => m.future);
  const headline = report.headline;
  const soFar = headline && (headline.from !== report.from || headline.to !== report.to) ? headline : null;
  const columns = 1 + report.months.length + (firstFuture >= 0 ? 1 : 0) + 1 + (soFar ? 1 : 0) + 1;
  const groups = runs(report.months);
  const lastCounted = report.months.findLast((m) => !m.beforeRecords && !m.future)?.month;
  // On a narrow screen, open the grid at the current month (else the latest on record) rather than at a row of grey.
  const openAt = report.months.some((m) => m.month === report.currentMonth) ? report.currentMonth : lastCounted;
  const scroller = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const box = scroller.current;
    const head = openAt ? box?.querySelector<HTMLElement>(`[data-testid="month-head-${openAt}"]`) : null;
    if (!box || !head) return;
    // Right-align it, so that as many months before it as fit stay in view.
    box.scrollLeft = Math.max(0, head.offsetLeft + head.offsetWidth + 8 - box.clientWidth);
  }, [openAt, report.from, report.to]);
  // A caution shared by neighbouring rows (the AMDR range of fat and carbohydrate) is said once, under the last.
  const cautionsOf = report.nutrients.map((n) => nutrientCautions(n.key, { vegetarian }));
  const shown = cautionsOf.map((list, i) => list.filter((c) => !(cautionsOf[i + 1] ?? []).some((d) => d.id === c.id)));
  return (
    <section aria-labelledby="share-grid-h">
      <h2 id="share-grid-h" className="text-2xl font-extrabold">
        Home share of the recommended intake, nutrient by month
      </h2>
      <p className="mt-1 max-w-2xl text-loam-700">
        Each cell: what the garden gave that month as a share of what the household is recommended to eat (the RDA, or an AI where
        no RDA is set; for carbohydrate and fat the least of their recommended range). A dash means there is no figure — nobody was
        at home, or the reference food has no value for it. 100 % is covered; more is not better.
      </p>
      <Legend />
      <div role="region" aria-label="Home share by nutrient and month" tabIndex={0} ref={scroller} className="relative mt-3 overflow-x-auto focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-focus rounded-2xl border border-loam-200 bg-white">
        <table className="min-w-max border-separate border-spacing-0.5 p-2 text-sm" data-testid="share-grid">
          <caption className="sr-only">Home share of the recommended intake per nutrient and month, in percent</caption>
          <thead>
            <tr>
              <td className="sticky left-0 z-10 bg-white" />
              {groups.map((g, i) => (
                <Fragment key={i}>
                  {g.kind === 'future' ? <Gap header /> : null}
                  <th
                    scope="colgroup"
                    colSpan={g.span}
                    className={`px-1 pt-1 text-left text-xs font-semibold whitespace-nowrap ${g.kind === 'counted' ? 'text-sprout-700' : 'text-loam-700'}`}
                    data-testid={`months-${g.kind}`}
                  >
                    {RUN_LABEL[g.kind]}
                  </th>
                </Fragment>
              ))}
              <td colSpan={(soFar ? 2 : 1) + 1} />
            </tr>
            <tr>
              <th scope="col" className="sticky left-0 z-10 bg-white p-2 text-left align-bottom">
                Nutrient
              </th>
              {report.months.map((m, i) => (
                <Fragment key={m.month}>
                  {i === firstFuture ? <Gap /> : null}
                  <th
                    scope="col"
                    className={`p-1 text-center align-bottom font-semibold ${m.beforeRecords || m.future ? 'text-loam-500' : ''}`}
                    data-testid={`month-head-${m.month}`}
                  >
                    <abbr title={`${longMonth(m.month)}${m.beforeRecords ? ' (before records)' : m.future ? ' (still to come)' : ''}`} className="no-underline">
                      {shortMonth(m.month)}
                    </abbr>
                    {i === 0 || m.month.endsWith('-01') ? <span className="block text-xs font-normal text-loam-700">{m.month.slice(0, 4)}</span> : null}
                  </th>
                </Fragment>
              ))}
              <th scope="col" className="p-1 text-center align-bottom">
                Period
              </th>
              {soFar ? (
                <th scope="col" className="p-1 text-center align-bottom">
                  So far
                </th>
              ) : null}
              <th scope="col" className="p-2 text-left align-bottom">
                Recommended, period
              </th>
            </tr>
          </thead>
          <tbody>
            {report.nutrients.map((n, row) => {
              const cautions = shown[row]!;
              const basis = report.needBasis[n.key];
              return (
                <Fragment key={n.key}>
                  <tr data-nutrient={n.key}>
                    <th scope="row" className="sticky left-0 z-10 bg-white p-2 text-left font-semibold whitespace-nowrap">
                      {n.name} <span className="font-normal text-loam-700">({n.unit})</span>
                      {basis ? (
                        <abbr title={basisLong(basis)} className="ml-1 rounded bg-loam-100 px-1 text-xs font-normal text-loam-900 no-underline" data-testid={`basis-${n.key}`}>
                          {basisShort(basis)}
                        </abbr>
                      ) : null}
                    </th>
                    {report.months.map((m, i) => (
                      <Fragment key={m.month}>
                        {i === firstFuture ? <Gap /> : null}
                        <Cell
                          value={m.values[n.key]}
                          beforeRecords={m.beforeRecords}
                          what={n.name.toLowerCase()}
                          label={`${n.name}, ${longMonth(m.month)}`}
                          testId={`cell-${n.key}-${m.month}`}
                        />
                      </Fragment>
                    ))}
                    <Cell value={report.total.values[n.key]} what={n.name.toLowerCase()} label={`${n.name}, whole period`} testId={`cell-${n.key}-total`} strong />
                    {soFar ? (
                      <Cell value={soFar.values[n.key]} what={n.name.toLowerCase()} label={`${n.name}, so far`} testId={`cell-${n.key}-so-far`} strong />
                    ) : null}
                    <td className="p-2 whitespace-nowrap text-loam-900" data-testid={`need-${n.key}`}>
                      {needText(report.total.values[n.key], n.unit)}
                    </td>
                  </tr>
                  {cautions.length ? (
                    <tr data-testid={`caution-${n.key}`}>
                      <td colSpan={columns} className="p-0 pb-2">
                        <div className="sticky left-0 max-w-[19rem] px-2 text-xs leading-snug text-loam-700 sm:max-w-2xl">
                          {cautions.map((c) => (
                            <p key={c.id} data-caution={c.id}>
                              <span aria-hidden="true" className="mr-1 font-bold text-rind-700">
                                !
                              </span>
                              {c.text}
                            </p>
                          ))}
                        </div>
                      </td>
                    </tr>
                  ) : null}
                </Fragment>
              );
            })}
          </tbody>
        </table>
      </div>
    </section>
  );
}

/** The gap that sets the months still to come apart (a cell in every row; the top row's is the group header's). */
function Gap({ header = false }: { header?: boolean }) {
  return <td aria-hidden="true" className={`w-3 p-0 ${header ? '' : 'border-l-2 border-dashed border-loam-500'}`} />;
}

interface CellProps {
  value: ShareValue;
  label: string;
  what: string;
  testId: string;
  beforeRecords?: boolean;
  strong?: boolean;
}

function Cell({ value, label, what, testId, beforeRecords = false, strong = false }: CellProps) {
  if (beforeRecords) {
    return (
      <td
        className="min-w-12 rounded-md px-1 py-2 text-center"
        style={bandStyle(BEFORE_RECORDS_BAND)}
        data-testid={testId}
        data-band={BEFORE_RECORDS_BAND.label}
      >
        <span aria-hidden="true">·</span>
        <span className="sr-only">{label}: before records, no need counted</span>
      </td>
    );
  }
  const share = value.shareOfNeed;
  const band = shareBand(share);
  const text = percentText(share);
  const unknown = unknownText(value.unknownShare, what);
  const flagged = value.uncertain && share !== null;
  return (
    <td
      className={`min-w-12 rounded-md px-1 py-2 text-center tabular-nums whitespace-nowrap ${strong ? 'font-extrabold' : 'font-semibold'} ${band === UNKNOWN_BAND || flagged ? 'border border-dashed border-loam-500' : ''}`}
      style={bandStyle(band)}
      data-testid={testId}
      data-band={band.label}
      data-uncertain={value.uncertain ? 'true' : undefined}
      title={unknown ? `${unknown}${value.uncertain ? ' — uncertain' : ''}` : undefined}
    >
      <span aria-hidden="true">
        {text.replace(' %', '')}
        {flagged ? '?' : ''}
      </span>
      <span className="sr-only">
        {label}: {share === null ? 'no figure' : `${text} of the recommended intake from home`}
        {flagged ? ', uncertain' : ''}
        {unknown ? ` (${unknown})` : ''}
      </span>
    </td>
  );
}

/** The figure a cell of each band might show, drawn in the key's swatch. */
const SAMPLE: Record<string, string> = {
  'none from home': '0',
  'under 10 %': '6',
  '10–25 %': '18',
  '25–50 %': '40',
  '50–75 %': '62',
  '75–100 %': '90',
  covered: '120',
  'no figure': '–',
  'before records': '·',
};

function Legend() {
  return (
    <ul className="mt-3 flex flex-wrap gap-2 text-sm" aria-label="Colour key">
      {[...SHARE_BANDS, UNKNOWN_BAND, BEFORE_RECORDS_BAND].map((b) => (
        <li key={b.label} className="flex items-center gap-2">
          <span
            className={`inline-flex h-7 w-10 items-center justify-center rounded-md text-xs font-semibold ${b === UNKNOWN_BAND ? 'border border-dashed border-loam-500' : 'border border-loam-300'}`}
            style={bandStyle(b)}
            aria-hidden="true"
          >
            {SAMPLE[b.label] ?? ''}
          </span>
          {b.label === 'no figure' ? 'no figure (–)' : b.label === 'covered' ? 'covered (100 % or more)' : b.label}
        </li>
      ))}
      <li className="flex items-center gap-2">
        <span className="inline-flex h-6 w-8 items-center justify-center rounded-md border border-dashed border-loam-500 font-semibold" aria-hidden="true">
          ?
        </span>
        uncertain: over 10 % of the weight has no value
      </li>
    </ul>
  );
}
