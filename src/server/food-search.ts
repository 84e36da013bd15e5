/**
 * Reference food look-ups: word search (FULLTEXT, words in any order, raw/whole forms first), by
 * code, and one food in full. Queries go through Drizzle's builder; the FULLTEXT match is a `sql`
 * template naming the schema's column, so a renamed column fails the type check.
 */
import { and, asc, desc, eq, like, sql, type SQL } from 'drizzle-orm';
import type { Pool } from 'mysql2/promise';
import { datasets, foodNutrients, foods, foodWeights } from '@/db/schema';
import type { FoodDetail, FoodHit } from '@/lib/food-types';
import { fulltextQuery, searchWords, singular, wantsBranded } from '@/lib/food-query';
import { RAWNESS } from '@/lib/food-rows';
import { NUTRIENTS } from '@/lib/nutrients';
import { dbOn } from './db-on';

/** The columns of a hit, as FoodHit names them. */
const hitColumns = {
  id: foods.id,
  dataset: datasets.slug,
  code: foods.code,
  name: foods.name,
  group: foods.foodGroup,
  refusePct: foods.refusePct,
};

export interface SearchOptions {
  /** Include branded products even when the query names no brand. */
  branded?: boolean;
  /** Only this dataset's foods (slug). */
  dataset?: string;
  /** Dataset slugs, first ranked first (a household's order); datasets not named come after. */
  datasetOrder?: readonly string[];
}

/**
 * Foods whose words start with every query word (a plural also finds its singular), the everyday
 * raw form first; branded products only when the query names a brand or `branded` is set,
 * e.g. searchFoods(pool, 'butternut raw').
 */
export async function searchFoods(pool: Pool, q: string, limit = 20, options: SearchOptions = {}): Promise<FoodHit[]> {
  const words = searchWords(q);
  if (words.length === 0) return [];
  // Each word must occur, as a word prefix ("potato" finds "Potatoes"); one-letter words use LIKE.
  const ft = fulltextQuery(q);
  const score = ft ? sql`MATCH(${foods.searchText}) AGAINST (${ft} IN BOOLEAN MODE)` : null;
  const where: SQL[] = score ? [score] : [];
  for (const w of words.filter((w) => w.length < 2)) where.push(like(foods.searchText, `%${w}%`));
  if (!options.branded && !wantsBranded(q)) where.push(sql`${foods.rawness} < ${RAWNESS.branded}`);
  if (options.dataset) where.push(eq(datasets.slug, options.dataset));
  // The first word (or its singular) opening the name: "beans" → "Beans, kidney, …" before "Yardlong bean".
  const one = singular(words[0]!);
  // The word as typed wins over its singular ("potatoes" → "Potatoes, …" before "Potato pancakes").
  const opensAsTyped = sql`LOWER(${foods.name}) REGEXP ${`^${words[0]!}\\b`}`;
  const opens = sql`LOWER(${foods.name}) REGEXP ${`^(${[words[0]!, ...(one ? [one] : [])].join('|')})\\b`}`;
  // A word still being typed opens the name too ("pota", "potato" → "Potatoes, …" before "Sweet potato").
  const opensTyping = like(sql`LOWER(${foods.name})`, `${words[0]!}%`); // words are letters and digits only
  // Datasets in the household's order, else in the order they were loaded (USDA SR28 first).
  const order: SQL[] = [];
  if (options.datasetOrder?.length) {
    // FIELD() is 0 for a slug not in the list: those go after the listed ones.
    const at = sql`FIELD(${datasets.slug}, ${sql.join(options.datasetOrder.map((d) => sql`${d}`), sql`, `)})`;
    order.push(sql`(${at} = 0)`, asc(at));
  }
  order.push(asc(datasets.id));
  order.push(
    sql`(${opensAsTyped} AND ${foods.rawness} <= ${RAWNESS.otherRaw}) DESC`,
    sql`(${opens} AND ${foods.rawness} <= ${RAWNESS.otherRaw}) DESC`,
    sql`(${opensTyping} AND ${foods.rawness} <= ${RAWNESS.otherRaw}) DESC`,
    sql`(${foods.rawness} = ${RAWNESS.everyday}) DESC`,
    sql`(${foods.rawness} <= ${RAWNESS.otherRaw}) DESC`,
    sql`${opens} DESC`,
    asc(foods.rawness),
  );
  if (score) order.push(desc(score));
  order.push(sql`CHAR_LENGTH(${foods.name})`, asc(foods.name));
  return dbOn(pool)
    .select(hitColumns)
    .from(foods)
    .innerJoin(datasets, eq(datasets.id, foods.datasetId))
    .where(and(...where))
    .orderBy(...order)
    .limit(limit);
}

/** The foods with a dataset's code (every dataset's, or one slug's), e.g. foodsByCode(pool, '11352'). */
export async function foodsByCode(pool: Pool, code: string, dataset?: string): Promise<FoodHit[]> {
  return dbOn(pool)
    .select(hitColumns)
    .from(foods)
    .innerJoin(datasets, eq(datasets.id, foods.datasetId))
    .where(and(eq(foods.code, code), dataset ? eq(datasets.slug, dataset) : undefined))
    .orderBy(asc(datasets.id));
}

/** One food with its dataset, household measures and every nutrient (null = not in the dataset), or null. */
export async function foodDetail(pool: Pool, id: number): Promise<FoodDetail | null> {
  const db = dbOn(pool);
  const [r] = await db
    .select({
      ...hitColumns,
      originalName: foods.originalName,
      datasetInfo: { slug: datasets.slug, name: datasets.name, release: datasets.release, publisher: datasets.publisher, licence: datasets.licence },
    })
    .from(foods)
    .innerJoin(datasets, eq(datasets.id, foods.datasetId))
    .where(eq(foods.id, id));
  if (!r) return null;
  const [amountRows, weights] = await Promise.all([
    db.select({ key: foodNutrients.nutrientKey, amount: foodNutrients.amount }).from(foodNutrients).where(eq(foodNutrients.foodId, id)),
    db.select({ description: foodWeights.description, grams: foodWeights.grams }).from(foodWeights).where(eq(foodWeights.foodId, id)).orderBy(asc(foodWeights.seq)),
  ]);
  const amounts = new Map(amountRows.map((a) => [a.key, a.amount]));
  return {
    ...r,
    weights,
    nutrients: NUTRIENTS.map((n) => ({ key: n.key, name: n.name, unit: n.unit, amount: amounts.get(n.key) ?? null })),
  };
}
