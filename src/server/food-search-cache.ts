/**
 * Food search answers kept in memory, as JSON text. A search reads only the reference tables, which
 * are the same for every household and change only when an administrator loads a dataset; and people
 * type the same words ("pota", "potato", "beans dry") in every garden. So an answer is kept under its
 * words and options and served again until the reference revision moves: every load or reload adds
 * to that sum in its own transaction (food-import.ts), and it is read on every search, so no server
 * of a cluster serves foods from before a reload it can see. At most MAX_ANSWERS are kept, the least
 * recently used going first.
 */
import type { Pool } from 'mysql2/promise';
import { RecentMap } from '@/lib/recent-map';
import { referenceRevision } from './food-facts';
import { searchFoods, type SearchOptions } from './food-search';

/** About 3 KB each at 20 hits: a few megabytes at most. */
export const MAX_ANSWERS = 2000;

let kept = { revision: -1, answers: new RecentMap<string, string>(MAX_ANSWERS) };

function keyOf(q: string, limit: number, options: SearchOptions): string {
  return JSON.stringify([q, limit, options.branded === true, options.dataset ?? null, options.datasetOrder ?? null]);
}

/**
 * `{"foods":[…]}` for a search, from memory when the same search was answered at the same reference
 * revision; otherwise searched, kept and returned. The text is exactly JSON.stringify of what
 * searchFoods returns.
 */
export async function searchFoodsJson(pool: Pool, q: string, limit: number, options: SearchOptions = {}): Promise<string> {
  const revision = await referenceRevision(pool);
  if (kept.revision !== revision) kept = { revision, answers: new RecentMap(MAX_ANSWERS) };
  const at = kept;
  const key = keyOf(q, limit, options);
  const hit = at.answers.get(key);
  if (hit !== undefined) return hit;
  // Read after the revision: a reload that lands in between leaves an answer under the old revision,
  // which the next search, reading the new one, drops with the rest.
  const text = JSON.stringify({ foods: await searchFoods(pool, q, limit, options) });
  at.answers.set(key, text);
  return text;
}
