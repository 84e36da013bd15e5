/**
 * A read written once from a Drizzle `sql` template — naming the schema's columns as everywhere
 * else, with placeholders for what changes per call — and run on a mysql2 pool, its rows as mysql2
 * gives them. For the hot reads: the share report's (building the SQL again and passing every
 * field of thousands of rows through Drizzle's result hook cost more CPU than the queries
 * themselves), and the session, household gate and people every request or report starts with
 * (Drizzle's mysql2 "prepared" query is sent as text, escaped and parsed again each time). Rows
 * keep mysql2's types (DATE as 'YYYY-MM-DD', see src/db/client.ts; DECIMAL as text), so a query
 * here names its columns with the aliases its caller reads, or maps them back to the schema's
 * types with readFields. Sent as prepared statements: a value is never spliced into the text.
 */
import { Column, fillPlaceholders, is, sql, type SQL } from 'drizzle-orm';
import { MySqlDialect, type AnyMySqlColumn } from 'drizzle-orm/mysql-core';
import type { ExecuteValues, Pool } from 'mysql2/promise';

const dialect = new MySqlDialect();

export interface RawQuery<Row> {
  /** The SQL text, written once (placeholders as `?`). */
  readonly text: string;
  /** Runs the query on `pool` with the placeholders' values. */
  run(pool: Pool, values?: Record<string, unknown>): Promise<Row[]>;
}

/** A query of `template` (sql.placeholder('name') for each value given per call). */
export function rawQuery<Row>(template: SQL): RawQuery<Row> {
  const { sql: text, params } = dialect.sqlToQuery(template);
  return {
    text,
    async run(pool, values = {}) {
      // Binary protocol (a statement prepared once per connection, mysql2 keeps it): numbers
      // arrive as numbers, not text to parse, the cheaper way for thousands of rows.
      const [rows] = await pool.execute(text, fillPlaceholders(params, values) as ExecuteValues);
      return rows as Row[];
    },
  };
}

/**
 * A read whose text depends on its values (an IN list), run once: sent as text, not prepared, so
 * no statement per list length is left on the connection (MariaDB caps prepared statements
 * server-wide, max_prepared_stmt_count).
 */
export async function rawRead<Row>(pool: Pool, template: SQL): Promise<Row[]> {
  const { sql: text, params } = dialect.sqlToQuery(template);
  const [rows] = await pool.query(text, params);
  return rows as Row[];
}

/** Named columns of the schema (or expressions) a raw read selects, each under its own name. */
export type RawFields = Record<string, AnyMySqlColumn | SQL>;

/** What a field reads as: a column's type as Drizzle gives it; an expression's value as mysql2 gives it. */
type FieldValue<F> = F extends AnyMySqlColumn ? F['_']['notNull'] extends true ? F['_']['data'] : F['_']['data'] | null : F extends SQL<infer T> ? T : never;

/** The select list `column AS \`<prefix><name>\`` of `fields`, for a rawQuery template. */
export function selectList(fields: RawFields, prefix = ''): SQL {
  return sql.join(
    Object.entries(fields).map(([name, field]) => sql`${field} AS ${sql.identifier(prefix + name)}`),
    sql`, `,
  );
}

/**
 * The fields of a row read with selectList(fields, prefix), as Drizzle's own select would give
 * them: each column's value through the column's own mapping (booleans from 0/1, numbers from
 * text, …), except that a TIMESTAMP or DATETIME arrives already as a Date (the binary protocol, the
 * pool's time zone UTC: src/db/client.ts); an expression's value as mysql2 gives it.
 */
export function readFields<F extends RawFields>(fields: F, row: Record<string, unknown>, prefix = ''): { [K in keyof F]: FieldValue<F[K]> } {
  const out: Record<string, unknown> = {};
  for (const [name, field] of Object.entries(fields)) {
    const value = row[prefix + name];
    out[name] = value === null || value === undefined || !is(field, Column) || value instanceof Date ? (value ?? null) : field.mapFromDriverValue(value);
  }
  return out as { [K in keyof F]: FieldValue<F[K]> };
}
