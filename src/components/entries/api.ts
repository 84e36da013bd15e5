/**
 * Typed calls to the household entry API for the React islands (crops, harvests, bought food,
 * staples, imports, reference foods). Every helper throws an ApiError carrying the API's error body
 * (`{ error: { code, message, fields } }`), so TanStack Query sees a failure and the form can show
 * the fields. A network failure is an ApiError with status 0.
 */
import type { FoodDetail, FoodHit } from '../../server/food-search';
import type { UnitSystem } from '../../lib/units';

/** What an island needs to know about the household it shows. */
export interface HouseholdInfo {
  id: number;
  name: string;
  units: UnitSystem;
  timezone: string;
  role: 'owner' | 'grower' | 'viewer';
}

/** True when the role may add, change and delete entries. Example: `canWrite('viewer')` → false */
export function canWrite(role: HouseholdInfo['role']): boolean {
  return role === 'owner' || role === 'grower';
}

// The JSON shapes come from the server modules that send them; type-only imports are erased, so no
// server code reaches the browser bundle.
export type { FoodDetail, FoodHit } from '../../server/food-search';
export type { CropJson as Crop, FoodSummary as CropFood } from '../../server/crops';
export type { HarvestJson as Harvest, HarvestList as HarvestPage } from '../../server/harvests';
export type { PurchaseJson as Purchase, PurchaseList as PurchasePage } from '../../server/purchases';
export type { StapleJson as Staple } from '../../server/staples';
export type { EntryTotals as Totals } from '../../server/entry-list';

export interface CsvError {
  row: number;
  column?: string;
  message: string;
}

export interface ImportPreview {
  ok: boolean;
  rows: unknown[];
  errors: CsvError[];
  unknownCrops?: { name: string; variety?: string }[];
  unknownFoodCodes?: string[];
  created?: number;
}

/** The error body every API route answers with. */
export interface ApiErrorBody {
  code: string;
  message: string;
  fields?: Record<string, string>;
}

/** A failed API call: the HTTP status (0 = no answer at all) and the API's error body. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;
  readonly body: unknown;

  constructor(status: number, error: ApiErrorBody, body: unknown) {
    super(error.message);
    this.name = 'ApiError';
    this.status = status;
    this.code = error.code;
    this.fields = error.fields ?? {};
    this.body = body;
  }

  /** True when sending the same request again later may work: no answer, or the server's fault. */
  get retryable(): boolean {
    return this.status === 0 || this.status >= 500 || this.status === 408 || this.status === 429;
  }
}

const OFFLINE: ApiErrorBody = { code: 'network', message: 'Could not reach Selfsown. Check your connection.' };

async function readBody(res: Response): Promise<unknown> {
  const text = await res.text();
  if (!text) return null;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return { error: { code: 'not_json', message: text.slice(0, 200) } };
  }
}

function errorOf(status: number, body: unknown): ApiError {
  const e = (body as { error?: Partial<ApiErrorBody> } | null)?.error;
  const message = e?.message ?? (status >= 500 ? 'Something went wrong on our side. Please try again.' : `The request failed (${status}).`);
  return new ApiError(status, { code: e?.code ?? `http_${status}`, message, ...(e?.fields ? { fields: e.fields } : {}) }, body);
}

/** Sends a request and returns the parsed JSON; throws ApiError for any non-2xx or no answer. */
export async function request<T>(method: string, url: string, body?: unknown, headers: Record<string, string> = {}): Promise<T> {
  let res: Response;
  const isForm = typeof FormData !== 'undefined' && body instanceof FormData;
  try {
    res = await fetch(url, {
      method,
      credentials: 'same-origin',
      headers: { accept: 'application/json', ...(body === undefined || isForm ? {} : { 'content-type': 'application/json' }), ...headers },
      body: body === undefined ? undefined : isForm ? (body as FormData) : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, OFFLINE, null);
  }
  const parsed = await readBody(res);
  if (!res.ok) throw errorOf(res.status, parsed);
  return parsed as T;
}

/** GET helper. Example: `await get<{ crops: Crop[] }>(urls(7).crops())` */
export const get = <T>(url: string) => request<T>('GET', url);

/** Builds a query string, leaving out empty values. Example: `qs({ a: 1, b: '' })` → '?a=1' */
export function qs(params: Record<string, string | number | boolean | undefined | null>): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '' && v !== false) p.set(k, String(v));
  const s = p.toString();
  return s ? `?${s}` : '';
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
