/**
 * Typed calls to the household entry API for the React islands (crops, harvests, bought food,
 * staples, imports, reference foods): their URLs, query keys and JSON shapes. Requests go through
 * the one client in ../request.ts, whose `request()` throws an ApiError carrying the API's error
 * body (`{ error: { code, message, fields } }`); a network failure is an ApiError with status 0.
 */
import type { CropCategory } from '@/lib/crop-categories';
import type { FoodDetail, FoodHit } from '@/lib/food-types';
import type { UnitSystem } from '@/lib/units';
import { get, qs } from '@/components/request';

// The one HTTP client of the islands lives in ../request; re-exported so the entry islands keep one import.
export { ApiError, get, qs, request, type ApiErrorBody } from '@/components/request';

/** What an island needs to know about the household it shows. */
export interface HouseholdInfo {
  id: number;
  name: string;
  units: UnitSystem;
  timezone: string;
  /** ISO 4217 code bought food starts with; null or absent = none chosen yet. */
  currency?: string | null;
  role: 'owner' | 'grower' | 'viewer';
  /** The signed-in person: the entry queue on this device is kept per person (entry-queue.ts). */
  userId?: string;
}

/** True when the role may add, change and delete entries. Example: `canWrite('viewer')` → false */
export function canWrite(role: HouseholdInfo['role']): boolean {
  return role === 'owner' || role === 'grower';
}

// The JSON shapes the API sends live in src/lib (wire types), under the short names the islands use.
export type { FoodDetail, FoodHit } from '@/lib/food-types';
export type { CropJson as Crop, FoodSummary as CropFood, ImportAnswerBody, PersonJson, StapleJson as Staple } from '@/lib/api-types';
export type { EntryTotals as Totals, HarvestJson as Harvest, HarvestList as HarvestPage, PurchaseJson as Purchase, PurchaseList as PurchasePage } from '@/lib/entry-types';

export interface CsvError {
  row: number;
  column?: string;
  message: string;
}

export interface ImportPreview {
  ok: boolean;
  rows: unknown[];
  errors: CsvError[];
  unknownCrops?: { name: string; variety?: string; category?: CropCategory }[];
  unknownFoodCodes?: string[];
  created?: number;
}

/** The entry API's URLs for one household. Example: `urls(7).harvest(3)` → '/api/households/7/harvests/3' */
export function urls(householdId: number) {
  const base = `/api/households/${householdId}`;
  return {
    crops: (includeArchived = false) => `${base}/crops${includeArchived ? '?includeArchived=1' : ''}`,
    crop: (id: number) => `${base}/crops/${id}`,
    harvests: (params: Record<string, string | number | undefined> = {}) => `${base}/harvests${qs(params)}`,
    harvest: (id: number) => `${base}/harvests/${id}`,
    purchases: (params: Record<string, string | number | undefined> = {}) => `${base}/purchases${qs(params)}`,
    purchase: (id: number) => `${base}/purchases/${id}`,
    staples: () => `${base}/staples`,
    staple: (id: number) => `${base}/staples/${id}`,
    stapleLog: (id: number) => `${base}/staples/${id}/log`,
    imports: () => `${base}/imports`,
    exportFile: (file: string) => `${base}/exports/${file}`,
  };
}

/** Query keys, so a mutation can invalidate exactly what it changed. */
export const keys = {
  crops: (hid: number, archived = false) => ['crops', hid, archived] as const,
  allCrops: (hid: number) => ['crops', hid] as const,
  harvests: (hid: number) => ['harvests', hid] as const,
  purchases: (hid: number) => ['purchases', hid] as const,
  staples: (hid: number) => ['staples', hid] as const,
  foodSearch: (q: string) => ['foods', 'search', q] as const,
  food: (id: number) => ['foods', id] as const,
};

/** Reference-food search, raw and whole forms first. */
export async function searchFoods(q: string, limit = 12): Promise<FoodHit[]> {
  const r = await get<{ foods: FoodHit[] }>(`/api/foods${qs({ q, limit })}`);
  return r.foods;
}

/** One reference food with its nutrients per 100 g. */
export async function foodDetail(id: number): Promise<FoodDetail> {
  const r = await get<{ food: FoodDetail }>(`/api/foods/${id}`);
  return r.food;
}

/** A nutrient's amount per 100 g, or null when the dataset does not give it. */
export function nutrientAmount(food: FoodDetail, key: string): number | null {
  return food.nutrients.find((n) => n.key === key)?.amount ?? null;
}

/** A random id for an Idempotency-Key; randomUUID needs a secure context, so fall back to getRandomValues. */
export function newIdempotencyKey(): string {
  if (typeof crypto !== 'undefined' && typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}
