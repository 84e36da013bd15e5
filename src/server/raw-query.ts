/**
 * A read written once from a Drizzle `sql` template — naming the schema's columns as everywhere
 * else, with placeholders for what changes per call — and run on a mysql2 pool, its rows as mysql2
 * gives them. For the share report's hot reads only: building the SQL again and passing every
 * field of thousands of rows through Drizzle's result hook cost more CPU than the queries
 * themselves. Rows keep mysql2's types (DATE as 'YYYY-MM-DD', see src/db/client.ts; DECIMAL as
 * text), so a query here names its columns with the aliases its caller reads. Sent as prepared
 * statements: a value is never spliced into the text.
 */
import { fillPlaceholders, type SQL } from 'drizzle-orm';
import { MySqlDialect } from 'drizzle-orm/mysql-core';
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
