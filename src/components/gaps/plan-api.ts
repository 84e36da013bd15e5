/**
 * The Gaps page's calls: GET …/gaps, POST …/plan (the planner) and POST …/plantings/from-plan
 * (turn a plan into plantings), with the JSON shapes of their answers as the issue-10 contract
 * gives them. Requests go through the one client in ../request.ts.
 */
import type { GapsResponse } from '@/lib/gap-types';
import type { PlanRequestBody } from '@/lib/gaps-schemas';
import { get, qs, request } from '@/components/request';

/** One crop of a plan. `seedKept` is what the household kept from that crop last season. */
export interface PlanCrop {
  cropKey: string;
  name: string;
  areaM2: number;
  expectedKg: number;
  seedNeeded: number | null;
  seedKept: number | null;
  seedUnit?: string | null;
}

/** A limit the planner met, said in words (and whatever else the planner adds). */
export type PlanLimit = string | { kind?: string; code?: string; message?: string; nutrient?: string; [k: string]: unknown };

export interface PlanAnswer {
  status: 'optimal' | 'infeasible-best-effort';
  addedAreaM2: number;
  crops: PlanCrop[];
  projected: Record<string, number | null>;
  projectedMonths?: unknown[];
  limits: PlanLimit[];
}

/** The sentence of a limit, whatever its shape. Example: `limitText({ message: 'No crop supplies B12.' })` → 'No crop supplies B12.' */
export function limitText(limit: PlanLimit): string {
  if (typeof limit === 'string') return limit;
  return limit.message ?? [limit.kind ?? limit.code, limit.nutrient].filter(Boolean).join(': ');
}

export const gapsUrl = (hid: number, year?: number) => `/api/households/${hid}/gaps${qs({ year })}`;

export const getGaps = (hid: number, year?: number) => get<GapsResponse>(gapsUrl(hid, year));

export const makePlan = (hid: number, body: PlanRequestBody) => request<PlanAnswer>('POST', `/api/households/${hid}/plan`, body);

export const plantFromPlan = (hid: number, year: number, crops: { cropKey: string; areaM2: number }[]) =>
  request<{ plantings?: unknown[] } & Record<string, unknown>>('POST', `/api/households/${hid}/plantings/from-plan`, { year, crops });
