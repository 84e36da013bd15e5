/**
 * Undo for the entry islands: runs the requests src/lib/undo-plan.ts lists for an action and
 * refreshes the lists it touched, and `useEntryUndo` offers it in the island's toast.
 */
import { useQueryClient, type QueryKey } from '@tanstack/react-query';
import { useUndo } from '@/components/UndoToast';
import { isSpreadUse } from '@/lib/entry-schemas';
import type { LarderOutcomeJson } from '@/lib/larder-types';
import { CREATED, undoneText, undoSteps, type UndoAction, type UndoStep } from '@/lib/undo-plan';
import { ApiError, get, request, type Harvest } from './api';

/** A harvest's larder records (only stored and preserved lots have any), read before a delete or a change of use removes them. */
export async function outcomesOf(householdId: number, h: Pick<Harvest, 'id' | 'use'>): Promise<LarderOutcomeJson[]> {
  if (!isSpreadUse(h.use)) return [];
  return (await get<{ outcomes: LarderOutcomeJson[] }>(`/api/households/${householdId}/larder/outcomes?harvestId=${h.id}`)).outcomes;
}

/** Sends the steps in order; a DELETE answered 404 is already done. Throws with a sentence on the first refusal. */
export async function runUndoSteps(householdId: number, steps: readonly UndoStep[]): Promise<void> {
  let created: number | null = null;
  for (const step of steps) {
    const url = `/api/households/${householdId}/${step.path}`;
    if (step.method === 'DELETE') {
      try {
        await request<null>('DELETE', url);
      } catch (e) {
        if (!(e instanceof ApiError && e.status === 404)) throw e;
      }
    } else if (step.method === 'POST' && step.path === 'larder/outcomes') {
      const harvestId = step.body.harvestId === CREATED ? created : step.body.harvestId;
      try {
        await request('POST', url, { ...step.body, harvestId });
      } catch (e) {
        throw new Error(`the harvest is back, but not its larder record of ${String(step.body.date)}: ${(e as Error).message}`);
      }
    } else {
      const answer = await request<{ harvest?: { id: number } } | null>(step.method, url, step.body);
      if (step.path === 'harvests') created = answer?.harvest?.id ?? null;
    }
  }
}

/**
 * `offer(message, action)` shows the toast with Undo for `action` (no Undo when there is nothing to
 * undo); undoing refreshes `invalidate`. Example: `offer('Deleted 2 kg Potato', { kind: 'harvest-deleted', … })`
 */
export function useEntryUndo(householdId: number, invalidate: readonly QueryKey[]) {
  const qc = useQueryClient();
  const show = useUndo();
  return (message: string, action: UndoAction) => {
    const steps = undoSteps(action);
    show({
      message,
      ...(steps.length > 0
        ? {
            undo: async () => {
              try {
                await runUndoSteps(householdId, steps);
              } finally {
                for (const queryKey of invalidate) void qc.invalidateQueries({ queryKey });
              }
              return undoneText(action);
            },
          }
        : {}),
    });
  };
}
