/**
 * The Larder page's calls: GET …/larder, POST …/larder/outcomes and DELETE …/larder/outcomes/{id},
 * through the one client in ../request.ts. The answers' shapes are the wire types of src/lib.
 */
import type { LarderLot, LarderOutcomeJson, LarderResponse } from '@/lib/larder-types';
import { get, request } from '@/components/request';

export const larderKey = (hid: number) => ['larder', hid] as const;

export const getLarder = (hid: number) => get<LarderResponse>(`/api/households/${hid}/larder`);

export const recordOutcome = (hid: number, body: unknown) =>
  request<{ outcome: LarderOutcomeJson; lot: LarderLot }>('POST', `/api/households/${hid}/larder/outcomes`, body);

export const undoOutcome = (hid: number, outcomeId: number) => request<null>('DELETE', `/api/households/${hid}/larder/outcomes/${outcomeId}`);
