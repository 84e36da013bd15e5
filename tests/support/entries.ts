/**
 * Helpers for the entry tests (crops, harvests, bought food, imports) against the built server.
 *
 *   const potato = await foodId('11352');                          // reference food id by SR28 code
 *   const crop = await makeCrop(owner.cookie, hid, { name: 'Potato', foodId: potato, category: 'root_tuber' });
 *   const r = await upload(owner.cookie, hid, { kind: 'harvests', mode: 'commit', csv: 'date,crop,…' });
 */
import { api, BASE_URL } from './env';
import { apiAs } from './users';

const foodIds = new Map<string, number>();

/** The id of a reference food by its dataset code (SR28 NDB number), from GET /api/foods?code=. */
export async function foodId(code: string): Promise<number> {
  const known = foodIds.get(code);
  if (known !== undefined) return known;
  const r = await api(`/api/foods?code=${code}&dataset=usda-sr28`);
  const id = r.body?.foods?.[0]?.id;
  if (typeof id !== 'number') throw new Error(`no reference food with code ${code}: ${JSON.stringify(r.body)}`);
  foodIds.set(code, id);
  return id;
}

/** POST a crop; throws unless 201. */
export async function makeCrop(cookie: string, householdId: number, crop: Record<string, unknown>): Promise<any> {
  const r = await apiAs(cookie, 'POST', `/api/households/${householdId}/crops`, crop);
  if (r.status !== 201) throw new Error(`creating crop answered ${r.status}: ${JSON.stringify(r.body)}`);
  return r.body.crop;
}

/** POST a harvest; throws unless 201. */
export async function logHarvest(cookie: string, householdId: number, harvest: Record<string, unknown>): Promise<any> {
  const r = await apiAs(cookie, 'POST', `/api/households/${householdId}/harvests`, harvest);
  if (r.status !== 201) throw new Error(`logging harvest answered ${r.status}: ${JSON.stringify(r.body)}`);
  return r.body.harvest ?? r.body.harvests;
}

/** All harvests of a household (up to 200) with the list's total and totals. */
export async function allHarvests(cookie: string, householdId: number, query = ''): Promise<{ harvests: any[]; total: number; totals: { grams: number; edibleGrams: number } }> {
  const r = await apiAs(cookie, 'GET', `/api/households/${householdId}/harvests?pageSize=200${query ? `&${query}` : ''}`);
  if (r.status !== 200) throw new Error(`listing harvests answered ${r.status}: ${JSON.stringify(r.body)}`);
  return r.body;
}

/** All bought food of a household (up to 200). */
export async function allPurchases(cookie: string, householdId: number): Promise<{ purchases: any[]; total: number; totals: { grams: number; edibleGrams: number } }> {
  const r = await apiAs(cookie, 'GET', `/api/households/${householdId}/purchases?pageSize=200`);
  if (r.status !== 200) throw new Error(`listing purchases answered ${r.status}: ${JSON.stringify(r.body)}`);
  return r.body;
}

/** POST a multipart import. `csv` may be text or bytes; extra form fields go in `fields`. */
export async function upload(
  cookie: string,
  householdId: number,
  opts: { kind?: string; mode?: string; csv: string | Uint8Array; fileName?: string; type?: string; createCrops?: unknown; fields?: Record<string, string> },
) {
  const form = new FormData();
  const blob = new Blob([opts.csv as BlobPart], { type: opts.type ?? 'text/csv' });
  form.set('file', blob, opts.fileName ?? 'log.csv');
  if (opts.kind !== undefined) form.set('kind', opts.kind);
  if (opts.mode !== undefined) form.set('mode', opts.mode);
  if (opts.createCrops !== undefined) form.set('createCrops', JSON.stringify(opts.createCrops));
  for (const [k, v] of Object.entries(opts.fields ?? {})) form.set(k, v);
  return api(`/api/households/${householdId}/imports`, { method: 'POST', headers: cookie ? { cookie, origin: BASE_URL } : {}, body: form });
}
