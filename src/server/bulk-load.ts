/**
 * Bulk inserts through LOAD DATA LOCAL INFILE, the database's own fast path for many rows (a CSV
 * import's 50,000 harvests): the rows are written as tab-separated text in memory and streamed to
 * the server when it asks for the "file". The pool answers only the names registered here, each
 * once (src/db/client.ts sets `infileStreamFactory`), so a server can never make the app read a
 * file from disk. Runs in the caller's transaction like any statement; triggers fire as for INSERT.
 * A row the server skips or changes (LOCAL makes such errors warnings) fails the whole load.
 * Needs local_infile on the server (MariaDB's default; the private server sets it explicitly).
 */
import { randomUUID } from 'node:crypto';
import { Readable } from 'node:stream';
import { getTableColumns, sql, type SQL, type Table } from 'drizzle-orm';

/** The shared client or a transaction (only `execute` is used; no import of the client, which imports this module). */
interface Executor {
  execute(query: SQL): Promise<unknown>;
}

const pending = new Map<string, Buffer>();

/** What mysql2 answers for LOAD DATA. */
interface LoadResult {
  affectedRows: number;
  warningStatus?: number;
  info?: string;
}

/** The stream for a name the server asks for: a registered upload, else an error (never the disk). */
export function infileStream(name: string): Readable {
  const data = pending.get(name);
  pending.delete(name);
  if (!data) {
    return new Readable({
      read() {
        this.destroy(new Error(`LOAD DATA asked for ${name}, which this app did not offer`));
      },
    });
  }
  return Readable.from([data]);
}

/** One value as LOAD DATA reads it by default: \N for NULL, backslash escapes, 1/0 for booleans. */
function cell(v: unknown): string {
  if (v === null || v === undefined) return '\\N';
  if (typeof v === 'boolean') return v ? '1' : '0';
  if (v instanceof Date) return v.toISOString().slice(0, 23).replace('T', ' ');
  return String(v).replace(/\\/g, '\\\\').replace(/\t/g, '\\t').replace(/\n/g, '\\n').replace(/\r/g, '\\r');
}

/**
 * Inserts `rows` (objects keyed as the table's Drizzle columns, all with the same keys) into
 * `table` with one LOAD DATA LOCAL INFILE statement on `ex` (the shared client or a transaction).
 */
export async function loadRows<T extends Table>(ex: Executor, table: T, rows: readonly Partial<T['$inferInsert']>[]): Promise<void> {
  if (rows.length === 0) return;
  const columns = getTableColumns(table);
  const keys = Object.keys(rows[0]!).filter((k) => k in columns);
  const lines = rows.map((r) => keys.map((k) => cell((r as Record<string, unknown>)[k])).join('\t'));
  const name = `selfsown-bulk-${randomUUID()}.tsv`;
  pending.set(name, Buffer.from(lines.join('\n') + '\n', 'utf8'));
  try {
    const names = sql.join(keys.map((k) => sql.identifier(columns[k]!.name)), sql`, `);
    const [result] = (await ex.execute(sql`LOAD DATA LOCAL INFILE ${name} INTO TABLE ${table} CHARACTER SET utf8mb4 (${names})`)) as unknown as [LoadResult];
    // LOCAL turns a row's errors (duplicate key, missing parent, a value that does not fit) into
    // skipped rows and warnings: anything short of every row stored cleanly fails the statement.
    if (result.affectedRows !== rows.length || (result.warningStatus ?? 0) > 0) {
      const [warnings] = (await ex.execute(sql`SHOW WARNINGS LIMIT 3`)) as unknown as [{ Message: string }[]];
      throw new Error(`bulk load stored ${result.affectedRows} of ${rows.length} rows (${result.info ?? ''}): ${warnings.map((w) => w.Message).join('; ')}`);
    }
  } finally {
    pending.delete(name);
  }
}
