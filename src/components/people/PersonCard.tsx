/**
 * One person as the people page shows them: age (from a birth month in months), dated pregnancy
 * and breastfeeding, diet, height and weight in the household's units, and the daily energy need
 * with what it rests on.
 */
import type { PersonJson, PersonSummaryJson } from '@/lib/api-types';
import { heightText, weightText } from '@/lib/body-plausibility';
import { formatAmount } from '@/lib/format-number';
import { ACTIVITY_LABELS, DIET_LABELS } from '@/lib/people-schemas';
import type { UnitSystem } from '@/lib/units';
import { formatMonthText } from '@/lib/format-date';
import { countText, nounFor } from '@/lib/plural';

function ageText(p: PersonJson): string {
  if (p.birthMonth != null) {
    const born = `born ${formatMonthText(p.birthMonth, 'long')}`;
    if (!p.energy) return born;
    const months = Math.round(p.energy.ageYears * 12);
    return `${born} (${months < 24 ? `${countText(months, 'month')} old` : countText(Math.floor(p.energy.ageYears), 'year')})`;
  }
  if (p.birthYear != null) return `born ${p.birthYear}${p.energy ? ` (${p.energy.ageYears} this year)` : ''}`;
  if (p.ageYears == null) return '';
  return p.ageYears < 1 ? `${countText(Math.round(p.ageYears * 12), 'month')} old` : `${formatAmount(p.ageYears)} ${nounFor(p.ageYears, 'year')}`;
}

function conditionText(p: PersonJson): string {
  const bits: string[] = [];
  if (p.pregnancyDueMonth) bits.push(`due ${p.pregnancyDueMonth}`);
  if (p.lactationFrom) bits.push(`breastfeeding from ${p.lactationFrom}${p.lactationTo ? ` to ${p.lactationTo}` : ''}`);
  if (bits.length === 0 && p.condition !== 'none') bits.push(p.condition);
  return bits.map((b) => ` · ${b}`).join('');
}

export function PersonCard({ person: p, units }: { person: PersonJson; units: UnitSystem }) {
  const e = p.energy;
  return (
    <div>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-xl font-extrabold">{p.name}</h2>
        <p className="text-loam-700">
          {p.sex}, {ageText(p)}
          {conditionText(p)}
        </p>
      </div>
      {e ? (
        <p className="mt-2">
          <span className="text-3xl font-extrabold text-sprout-900" data-testid="person-kcal">
            {formatAmount(e.kcalPerDay)} kcal
          </span>{' '}
          <span className="text-loam-700">a day</span>{' '}
          <span className="inline-block rounded-full bg-loam-100 px-3 py-1 text-sm font-semibold whitespace-nowrap" data-testid="person-basis">
            {e.basis === 'stated' ? 'as you stated' : 'estimated (EER)'}
          </span>
        </p>
      ) : (
        <p className="mt-2 text-loam-700">Not yet born this month: no need counted.</p>
      )}
      <dl className="mt-3 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        <div>
          <dt className="inline text-loam-700">Meals from the household: </dt>
          <dd className="inline font-semibold">
            {formatAmount(p.atHomePct)} %{e && e.atHomeKcalPerDay !== e.kcalPerDay ? ` (${formatAmount(e.atHomeKcalPerDay)} kcal a day counted)` : ''}
          </dd>
        </div>
        <div>
          <dt className="inline text-loam-700">Activity: </dt>
          <dd className="inline font-semibold">{ACTIVITY_LABELS[p.activity]}</dd>
        </div>
        {p.diet !== 'omnivore' ? (
          <div>
            <dt className="inline text-loam-700">Diet: </dt>
            <dd className="inline font-semibold">{DIET_LABELS[p.diet]}</dd>
          </div>
        ) : null}
        {p.heightCm != null || p.weightKg != null ? (
          <div>
            <dt className="inline text-loam-700">Height, weight: </dt>
            <dd className="inline font-semibold" data-testid="person-body">
              {p.heightCm != null ? heightText(p.heightCm, units) : 'height not given'}, {p.weightKg != null ? weightText(p.weightKg, units) : 'weight not given'}
            </dd>
          </div>
        ) : null}
        {p.presentFrom || p.presentTo ? (
          <div>
            <dt className="inline text-loam-700">Eats here: </dt>
            <dd className="inline font-semibold">
              {p.presentFrom ? `from ${p.presentFrom}` : ''} {p.presentTo ? `to ${p.presentTo}` : ''}
            </dd>
          </div>
        ) : null}
      </dl>
      {e ? (
        <details className="mt-2 text-sm">
          <summary className="cursor-pointer text-sprout-700">What the energy need rests on</summary>
          <p className="mt-1">{e.basis === 'stated' ? 'The kcal a day stated for this person.' : e.source}</p>
          {e.notes.length ? (
            <ul className="mt-1 list-disc pl-5">
              {e.notes.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          ) : null}
        </details>
      ) : null}
    </div>
  );
}

/** A person as growers and viewers see them: the name, when they eat here and the energy they need. */
export function PersonSummaryCard({ person: p }: { person: PersonSummaryJson }) {
  const e = p.energy;
  return (
    <div>
      <h2 className="text-xl font-extrabold">{p.name}</h2>
      {e ? (
        <p className="mt-2">
          <span className="text-3xl font-extrabold text-sprout-900" data-testid="person-kcal">
            {formatAmount(e.kcalPerDay)} kcal
          </span>{' '}
          <span className="text-loam-700">a day</span>
        </p>
      ) : (
        <p className="mt-2 text-loam-700">No need counted this month.</p>
      )}
      <p className="mt-1 text-sm text-loam-700">
        Meals from the household: {formatAmount(p.atHomePct)} %
        {p.presentFrom || p.presentTo ? ` · eats here ${p.presentFrom ? `from ${p.presentFrom}` : ''} ${p.presentTo ? `to ${p.presentTo}` : ''}` : ''}
      </p>
    </div>
  );
}
