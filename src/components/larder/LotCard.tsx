/**
 * One lot in the larder: what is left in the household's units, when it runs out at the present
 * rate, a bar of eaten / left / lost, the typical winter loss as an expectation, its records with
 * an undo, and (owner and grower) a button to record what happened.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { CROP_CATEGORY_LABELS } from '@/lib/crop-categories';
import { LARDER_OUTCOME_LABELS } from '@/lib/larder-outcomes';
import type { LarderLot, LarderOutcomeJson } from '@/lib/larder-types';
import { CHART_COLOURS } from '@/lib/palette';
import { USE_LABELS } from '@/lib/uses';
import { formatWeight, type UnitSystem } from '@/lib/units';
import { dateText, energyText, proteinText } from './larder-format';
import { larderKey, undoOutcome } from './larder-api';
import { OutcomeForm } from './OutcomeForm';

interface Props {
  lot: LarderLot;
  householdId: number;
  units: UnitSystem;
  today: string;
  canWrite: boolean;
}

function outcomeText(o: LarderOutcomeJson): string {
  const extra = o.kind === 'spoiled' && o.lostFraction !== null && o.lostFraction < 1 ? ` (${Math.round(o.lostFraction * 100)} % of what was left)` : o.kind === 'lasted_longer' && o.until ? ` until ${dateText(o.until)}` : '';
  return `${LARDER_OUTCOME_LABELS[o.kind]} on ${dateText(o.date)}${extra}`;
}

export function LotCard({ lot, householdId, units, today, canWrite }: Props) {
  const [recording, setRecording] = useState(false);
  const client = useQueryClient();
  const undo = useMutation({
    mutationFn: (id: number) => undoOutcome(householdId, id),
    onSuccess: () => client.invalidateQueries({ queryKey: larderKey(householdId) }),
  });
  const whole = lot.edibleGrams || 1;
  const parts = [
    { key: 'eaten', grams: lot.eatenEdibleGrams, colour: CHART_COLOURS.eaten, label: 'eaten' },
    { key: 'left', grams: lot.remainingEdibleGrams, colour: CHART_COLOURS.left, label: 'left' },
    { key: 'lost', grams: lot.lostGrams, colour: CHART_COLOURS.lost, label: 'lost' },
  ];
  return (
    <article className="card" data-testid="larder-lot" data-harvest-id={lot.harvestId}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-xl font-extrabold">{lot.name}</h3>
        <p className="text-sm text-loam-700">
          {USE_LABELS[lot.use].split(' (')[0]} {dateText(lot.date)}
          {lot.category ? ` · ${CROP_CATEGORY_LABELS[lot.category]}` : ''}
        </p>
      </div>
      <p className="mt-2 text-3xl font-extrabold text-sprout-900" data-testid="lot-left">
        {formatWeight(lot.remainingGrams, units)} <span className="text-base font-semibold text-loam-700">left</span>
      </p>
      <p className="text-loam-700">
        {energyText(lot.energyKcal)} · {proteinText(lot.proteinG)} · runs out about <strong data-testid="lot-runs-out">{dateText(lot.runsOut)}</strong>
      </p>
      <div className="mt-3 flex h-4 overflow-hidden rounded-full border border-loam-200" role="img" aria-label={parts.map((p) => `${Math.round((p.grams / whole) * 100)} % ${p.label}`).join(', ')}>
        {parts
          .filter((p) => p.grams > 0)
          .map((p) => (
            <span key={p.key} style={{ width: `${(p.grams / whole) * 100}%`, background: p.colour }} />
          ))}
      </div>
      <p className="mt-1 text-xs text-loam-700">
        Light green eaten, dark green left, red lost (edible portion of {formatWeight(lot.edibleGrams, units)}).
      </p>
      {lot.expectedLoss ? (
        <p className="mt-2 text-sm text-loam-700" data-testid="lot-expected-loss">
          Typically about {Math.round(lot.expectedLoss.fraction * 100)} % is lost over a winter ({lot.expectedLoss.source}); not taken off above.
        </p>
      ) : null}
      {lot.outcomes.length > 0 ? (
        <ul className="mt-3 space-y-2">
          {lot.outcomes.map((o) => (
            <li key={o.id} className="flex flex-wrap items-center justify-between gap-2 rounded-xl bg-loam-50 px-3 py-2">
              <span>
                {outcomeText(o)}
                {o.note ? <span className="text-loam-700"> — {o.note}</span> : null}
              </span>
              {canWrite ? (
                <button type="button" className="btn-quiet min-h-10 px-3" onClick={() => undo.mutate(o.id)} disabled={undo.isPending}>
                  Undo
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      {undo.isError ? (
        <p role="alert" className="mt-2 font-semibold text-berry-700">
          {undo.error.message}
        </p>
      ) : null}
      {canWrite && !recording ? (
        <button type="button" className="btn-quiet mt-4 w-full sm:w-auto" onClick={() => setRecording(true)}>
          Record what happened
        </button>
      ) : null}
      {recording ? <OutcomeForm householdId={householdId} harvestId={lot.harvestId} today={today} onDone={() => setRecording(false)} /> : null}
    </article>
  );
}
