/**
 * The Gaps page's calls: GET …/gaps, POST …/plan (the planner) and POST …/plantings/from-plan
 * (turn a plan into plantings). The answers' shapes are the wire types of src/lib; requests go
 * through the one client in ../request.ts.
 */
import type { GapsResponse } from '@/lib/gap-types';
import type { PlanRequestBody } from '@/lib/gaps-schemas';
import type { PlanAnswer } from '@/lib/plan-result';
import { get, qs, request } from '@/components/request';

export type { PlanAnswer, PlanLimit, PlannedCrop } from '@/lib/plan-result';

export const gapsUrl = (hid: number, year?: number) => `/api/households/${hid}/gaps${qs({ year })}`;

export const getGaps = (hid: number, year?: number) => get<GapsResponse>(gapsUrl(hid, year));

export const makePlan = (hid: number, body: PlanRequestBody) => request<PlanAnswer>('POST', `/api/households/${hid}/plan`, body);

export const plantFromPlan = (hid: number, year: number, crops: { cropKey: string; areaM2: number }[]) =>
  request<{ plantings?: unknown[] } & Record<string, unknown>>('POST', `/api/households/${hid}/plantings/from-plan`, { year, crops });
