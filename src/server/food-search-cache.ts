/**
 * Food search answers kept in memory, as JSON text. A search reads only the reference tables, which
 * are the same for every household and change only when a dataset is loaded; and people type the
 * same words ("pota", "potato", "beans dry") in every garden. So an answer is kept under its words
 * and options and served again while the reference revision is the one it was worked out at: every
 * load or reload adds to that sum in its own transaction (food-import.ts).
 *
 * The revision is read again at most REVISION_TRUST_MS after the last read, not on every search:
 * that read was half the time of a kept answer. So:
 * - a load in this process (an administrator's upload, which the app server runs) drops the kept
 *   answers as it finishes (forgetKeptSearches): this server never answers from before its own load;
 * - a load elsewhere (`npm run db:import-foods`, another server of a cluster) is seen within
 *   REVISION_TRUST_MS. The rows of a food a load drops stay (entries name them), so an answer that
 *   old can only offer a food under its previous name, or miss one that has just arrived.
 * At most MAX_ANSWERS are kept, the least recently used going first.
 */
import type { Pool } from 'mysql2/promise';
import { RecentMap } from '@/lib/recent-map';
import { referenceRevision } from './food-facts';
import { searchFoods, type SearchOptions } from './food-search';

/** About 3 KB each at 20 hits: a few megabytes at most. */
export const MAX_ANSWERS = 2000;

/** How long a revision read is trusted: the longest a load made by another process goes unseen here. */
export const REVISION_TRUST_MS = 250;

interface Kept {
  revision: number;
  /** performance.now() of the read that found `revision`. */
  readAt: number;
  answers: RecentMap<string, string>;
}

const fresh = (): Kept => ({ revision: -1, readAt: -Infinity, answers: new RecentMap(MAX_ANSWERS) });
let kept = fresh();

function keyOf(q: string, limit: number, options: SearchOptions): string {
  return JSON.stringify([q, limit, options.branded === true, options.dataset ?? null, options.datasetOrder ?? null]);
}

/** Drops every kept answer and the revision read: food-import.ts calls it when a load in this process ends. */
export function forgetKeptSearches(): void {
  kept = fresh();
}

/**
 * `{"foods":[…]}` for a search, from memory when the same search was answered at the reference
 * revision last read (no longer ago than REVISION_TRUST_MS, else read again first); otherwise
 * searched, kept and returned. The text is exactly JSON.stringify of what searchFoods returns.
 */
export async function searchFoodsJson(pool: Pool, q: string, limit: number, options: SearchOptions = {}): Promise<string> {
  const now = performance.now();
  if (now - kept.readAt >= REVISION_TRUST_MS) {
    const before = kept;
    const revision = await referenceRevision(pool);
    // Unless a load here dropped everything meanwhile (its answers come after this read).
    if (kept === before) kept = revision === before.revision ? { ...before, readAt: now } : { revision, readAt: now, answers: new RecentMap(MAX_ANSWERS) };
  }
  const at = kept;
  const key = keyOf(q, limit, options);
  const hit = at.answers.get(key);
  if (hit !== undefined) return hit;
  // Read after the revision: a load that lands in between leaves this answer under the old
  // revision, which the next read of the revision (or forgetKeptSearches) drops with the rest.
  const text = JSON.stringify({ foods: await searchFoods(pool, q, limit, options) });
  at.answers.set(key, text);
  return text;
}
