/** Reference food look-ups: word search (FULLTEXT, words in any order, raw/whole forms first) and by code. */
import type { Pool } from 'mysql2/promise';
import { NUTRIENTS } from '../lib/nutrients';

export interface FoodHit {
  id: number;
  dataset: string;
  code: string;
  name: string;
  group: string;
  refusePct: number | null;
}

export interface FoodDetail extends FoodHit {
  originalName: string;
  datasetInfo: { slug: string; name: string; release: string; publisher: string; licence: string };
  weights: { description: string; grams: number }[];
  nutrients: { key: string; name: string; unit: string; amount: number | null }[];
}

interface HitRow {
  id: number;
  dataset: string;
  code: string;
  name: string;
  food_group: string;
  refuse_pct: number | null;
}

const toHit = (r: HitRow): FoodHit => ({
  id: r.id,
  dataset: r.dataset,
  code: r.code,
  name: r.name,
  group: r.food_group,
  refusePct: r.refuse_pct,
});

/** Splits a query into search words (letters and digits), at most 8. */
export function queryWords(q: string): string[] {
  return (q.toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? []).slice(0, 8);
}

export async function searchFoods(pool: Pool, q: string, limit = 20): Promise<FoodHit[]> {
  const words = queryWords(q);
  if (words.length === 0) return [];
  // Each word must occur, as a word prefix ("potato" finds "Potatoes"); one-letter words use LIKE.
  const ft = words.filter((w) => w.length >= 2).map((w) => `+${w}*`).join(' ');
  const short = words.filter((w) => w.length < 2);
  const where: string[] = [];
  const params: unknown[] = [];
  if (ft) {
    where.push('MATCH(f.search_text) AGAINST (? IN BOOLEAN MODE)');
    params.push(ft);
  }
  for (const w of short) {
    where.push('f.search_text LIKE ?');
    params.push(`%${w}%`);
  }
  const first = words[0]!;
  const sql =
    `SELECT f.id, d.slug AS dataset, f.code, f.name, f.food_group, f.refuse_pct,
            ${ft ? 'MATCH(f.search_text) AGAINST (? IN BOOLEAN MODE)' : '0'} AS score
       FROM foods f JOIN datasets d ON d.id = f.dataset_id
      WHERE ${where.join(' AND ')}
      ORDER BY (f.rawness = 0) DESC, (LOWER(f.name) LIKE ?) DESC, f.rawness, score DESC, CHAR_LENGTH(f.name), f.name
      LIMIT ?`;
  const all = ft ? [ft, ...params, `${first}%`, limit] : [...params, `${first}%`, limit];
  const [rows] = await pool.query(sql, all);
  return (rows as HitRow[]).map(toHit);
}

export async function foodsByCode(pool: Pool, code: string, dataset?: string): Promise<FoodHit[]> {
  const [rows] = await pool.query(
    `SELECT f.id, d.slug AS dataset, f.code, f.name, f.food_group, f.refuse_pct
       FROM foods f JOIN datasets d ON d.id = f.dataset_id
      WHERE f.code = ? ${dataset ? 'AND d.slug = ?' : ''}
      ORDER BY d.id`,
    dataset ? [code, dataset] : [code],
  );
  return (rows as HitRow[]).map(toHit);
}

export async function foodDetail(pool: Pool, id: number): Promise<FoodDetail | null> {
  const [rows] = await pool.query(
    `SELECT f.id, d.slug AS dataset, f.code, f.name, f.original_name, f.food_group, f.refuse_pct,
            d.name AS ds_name, d.release AS ds_release, d.publisher AS ds_publisher, d.licence AS ds_licence
       FROM foods f JOIN datasets d ON d.id = f.dataset_id WHERE f.id = ?`,
    [id],
  );
  const r = (rows as (HitRow & { original_name: string; ds_name: string; ds_release: string; ds_publisher: string; ds_licence: string })[])[0];
  if (!r) return null;
  const [amountRows] = await pool.query('SELECT nutrient_key, amount FROM food_nutrients WHERE food_id = ?', [id]);
  const amounts = new Map((amountRows as { nutrient_key: string; amount: number }[]).map((a) => [a.nutrient_key, a.amount]));
  const [weightRows] = await pool.query('SELECT description, grams FROM food_weights WHERE food_id = ? ORDER BY seq', [id]);
  return {
    ...toHit(r),
    originalName: r.original_name,
    datasetInfo: { slug: r.dataset, name: r.ds_name, release: r.ds_release, publisher: r.ds_publisher, licence: r.ds_licence },
    weights: weightRows as { description: string; grams: number }[],
    nutrients: NUTRIENTS.map((n) => ({ key: n.key, name: n.name, unit: n.unit, amount: amounts.get(n.key) ?? null })),
  };
}
