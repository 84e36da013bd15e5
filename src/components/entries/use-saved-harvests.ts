/**
 * The harvest form's memory of what was just saved: the last five weighings with their edible
 * portion, entries the outbox sent later ("Sent and saved"), and Undo, which deletes every harvest
 * of a weighing (a split is several) through TanStack Query (the steps of src/lib/undo-plan.ts).
 * The card of the newest weighing is the form's Undo at the thumb: HarvestSaved scrolls it into
 * view just above the phone's bottom bar, where other pages float their Undo toast.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { undoSteps } from '@/lib/undo-plan';
import { unitSystemOf, type WeightUnit } from '@/lib/units';
import { keys, type Harvest } from './api';
import type { SavedEntry } from './HarvestSaved';
import { formatInUnit } from './quantity-text';
import { runUndoSteps } from './use-entry-undo';

/** What POST …/harvests answers: one harvest, or the harvests of a split. */
export type CreateAnswer = { harvest: Harvest } | { harvests: Harvest[] };

const answerHarvests = (a: CreateAnswer): Harvest[] => ('harvests' in a ? a.harvests : [a.harvest]);

/** How many saved weighings stay on screen. */
const SHOWN = 5;

export function useSavedHarvests(hid: number, unit: WeightUnit, onUndoError: (message: string | null) => void) {
  const qc = useQueryClient();
  const [saved, setSaved] = useState<SavedEntry[]>([]);

  const refresh = () => {
    void qc.invalidateQueries({ queryKey: keys.harvests(hid) });
    void qc.invalidateQueries({ queryKey: keys.allCrops(hid) });
  };

  /** Shows a weighing the server has stored; `later` when the outbox sent it after a failed try. */
  const add = (key: string, label: string, data: CreateAnswer, later = false) => {
    const hs = answerHarvests(data);
    const edible = formatInUnit(
      hs.reduce((a, h) => a + h.edibleGrams, 0),
      hs[0]?.unit ?? unit,
      unitSystemOf(unit),
    );
    setSaved((s) => [{ key, label, edible, harvests: hs, ...(later ? { later: true } : {}) }, ...s].slice(0, SHOWN));
    refresh();
  };

  const undo = useMutation({
    // Deletes every harvest of the weighing; one already gone (undone in another tab) counts as undone.
    mutationFn: async (entry: SavedEntry) => {
      await runUndoSteps(hid, undoSteps({ kind: 'harvests-saved', harvests: entry.harvests }));
      return entry;
    },
    onSuccess: (entry) => {
      setSaved((s) => s.filter((x) => x.key !== entry.key));
      onUndoError(null);
      refresh();
    },
    onError: (e) => onUndoError(`Could not undo: ${(e as Error).message}`),
  });

  return { saved, add, undo: (entry: SavedEntry) => undo.mutate(entry), undoing: undo.isPending ? undo.variables?.key : undefined };
}
