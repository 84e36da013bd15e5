/**
 * When two crop names are one crop, by the database's own rule. The unique index on
 * (household, name, variety) compares with the column's collation (utf8mb4_unicode_ci: case- and
 * accent-blind, "Pois mangetout" = "Pois mangetoût", "Straße" = "Strasse"), so an import that
 * matched names by a JavaScript rule could preview two crops that the commit then refuses as one.
 * Here each name's collation weight (MariaDB's WEIGHT_STRING) is asked from the database itself,
 * over cropNameKey (trimmed, inner spaces collapsed): equal keys ⇔ one crop, in preview and commit.
 */
import { sql } from 'drizzle-orm';
import { cropNameKey } from '@/lib/csv-import';
import type { Executor } from './entry-input';

const CHUNK = 200;
const FALLBACK_COLLATION = 'utf8mb4_unicode_ci';

async function nameCollation(ex: Executor): Promise<string> {
  const [rows] = (await ex.execute(
    sql`SELECT COLLATION_NAME AS c FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'crops' AND COLUMN_NAME = 'name'`,
  )) as unknown as [{ c: string | null }[]];
  const c = rows[0]?.c;
  return c && /^[a-z0-9_]+$/.test(c) ? c : FALLBACK_COLLATION;
}

/** A crop key function: `key(name, variety)` equal for two crops exactly when the database sees one crop. */
export type CropKeyOf = (name: string, variety?: string | null) => string;

/**
 * The key function for every name and variety in `texts` (others fall back to cropNameKey alone).
 * Example: `(await cropKeyer(db, ['Pois mangetout', 'Pois mangetoût']))('Pois mangetoût')` === `…('Pois mangetout')` → true
 */
export async function cropKeyer(ex: Executor, texts: Iterable<string>): Promise<CropKeyOf> {
  const plain = [...new Set([...texts].map(cropNameKey))].filter((t) => t !== '');
  const weights = new Map<string, string>();
  if (plain.length > 0) {
    const collation = sql.raw(await nameCollation(ex));
    for (let i = 0; i < plain.length; i += CHUNK) {
      const chunk = plain.slice(i, i + CHUNK);
      const selects = chunk.map((t, j) => sql`SELECT ${j} AS i, HEX(WEIGHT_STRING(CONVERT(${t} USING utf8mb4) COLLATE ${collation})) AS w`);
      const [rows] = (await ex.execute(sql.join(selects, sql` UNION ALL `))) as unknown as [{ i: number; w: string }[]];
      for (const r of rows) weights.set(chunk[Number(r.i)]!, r.w);
    }
  }
  const one = (text: string) => {
    const k = cropNameKey(text);
    return weights.get(k) ?? k;
  };
  return (name, variety) => `${one(name)}\u0000${one(variety ?? '')}`;
}
