/**
 * Telling MariaDB's errors apart (by the driver's code, under Drizzle's wrapper), and the answer a
 * request gets when one escapes a route: a record that vanished under a concurrent delete is a 404,
 * a row still referenced or a lock conflict a 409 — never a 500 (issue 15: writes racing a
 * household's deletion); a database that cannot be reached (down, restarting, the connection cut)
 * is a 503 with Retry-After, never a 500 (issue 15: faults).
 */

function errCode(e: unknown): string | undefined {
  // Drizzle wraps the driver's error in DrizzleQueryError with the original as `cause`.
  for (let cur: unknown = e, i = 0; cur && i < 4; cur = (cur as { cause?: unknown }).cause, i++) {
    const code = (cur as { code?: unknown }).code;
    if (typeof code === 'string' && code.startsWith('ER_')) return code;
  }
  return undefined;
}

/** True for MariaDB's duplicate-key error (a unique index refused the row). */
export function isDuplicateKey(e: unknown): boolean {
  return errCode(e) === 'ER_DUP_ENTRY';
}

/** True when a foreign key refused a delete or update (the row is still referenced). */
export function isRowReferenced(e: unknown): boolean {
  const code = errCode(e);
  return code === 'ER_ROW_IS_REFERENCED_2' || code === 'ER_ROW_IS_REFERENCED';
}

/** True when a foreign key refused a new row because what it points at is gone. */
export function isParentMissing(e: unknown): boolean {
  const code = errCode(e);
  return code === 'ER_NO_REFERENCED_ROW_2' || code === 'ER_NO_REFERENCED_ROW';
}

/**
 * True for a deadlock or lock wait timeout, after which the transaction can be tried again. A
 * deadlock on a table's auto-increment lock reaches us as ER_AUTOINC_READ_FAILED (1467): InnoDB
 * rolled the transaction back all the same (MariaDB MDEV-33593), so it counts here too.
 */
export function isRetryableLock(e: unknown): boolean {
  const code = errCode(e);
  return code === 'ER_LOCK_DEADLOCK' || code === 'ER_LOCK_WAIT_TIMEOUT' || code === 'ER_AUTOINC_READ_FAILED';
}

/**
 * "The database is not there": a refused or timed-out connect, a connection cut mid-query (the
 * server killed or restarting). mysql2 marks these `fatal`; the same socket codes from elsewhere
 * (the mail server, say) are not the database's and keep their own answer.
 */
const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENOTFOUND', 'EAI_AGAIN', 'PROTOCOL_CONNECTION_LOST', 'PROTOCOL_SEQUENCE_TIMEOUT', 'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR']);
/** MariaDB's own: shutting down, the connection killed by the shutdown, too many connections. */
const SERVER_CODES = new Set(['ER_SERVER_SHUTDOWN', 'ER_NORMAL_SHUTDOWN', 'ER_CONNECTION_KILLED', 'ER_CON_COUNT_ERROR']);
/** mysql2's own sentences for a pool or connection that is gone (they carry no code). */
const UNAVAILABLE_MESSAGES = [/^Pool is closed/, /in closed state/i, /^Connection lost/i];

/** Every error in the chain: Drizzle's `cause`, better-auth's `cause`, a connect's AggregateError. */
function chain(e: unknown): unknown[] {
  const out: unknown[] = [];
  const walk = (cur: unknown, depth: number) => {
    if (!cur || typeof cur !== 'object' || depth > 5 || out.includes(cur)) return;
    out.push(cur);
    walk((cur as { cause?: unknown }).cause, depth + 1);
    const inner = (cur as { errors?: unknown }).errors;
    if (Array.isArray(inner)) for (const x of inner) walk(x, depth + 1);
  };
  walk(e, 0);
  return out;
}

/** True when the error says the database cannot be reached now (not that a query was wrong). */
export function isDatabaseUnavailable(e: unknown): boolean {
  return chain(e).some((cur) => {
    const { code, message, fatal } = cur as { code?: unknown; message?: unknown; fatal?: unknown };
    if (typeof code === 'string' && (SERVER_CODES.has(code) || (fatal === true && NETWORK_CODES.has(code)))) return true;
    return typeof message === 'string' && UNAVAILABLE_MESSAGES.some((re) => re.test(message));
  });
}

/** Seconds a client is told to wait before trying again while the database is down. */
export const DATABASE_RETRY_AFTER_SECONDS = 5;

/** The sentence every answer gives while the database is down. */
export const DATABASE_UNAVAILABLE_MESSAGE =
  'Selfsown cannot reach its database just now, so nothing was read or saved. Please try again in a few seconds; entries waiting on your device are kept and sent again.';

/** The status, code and sentence for a database error a route did not handle itself; undefined for any other error. */
export function databaseErrorAnswer(e: unknown): { status: number; code: string; message: string } | undefined {
  if (isDatabaseUnavailable(e)) return { status: 503, code: 'database_unavailable', message: DATABASE_UNAVAILABLE_MESSAGE };
  if (isParentMissing(e)) return { status: 404, code: 'not_found', message: 'The household or a record this refers to no longer exists.' };
  if (isRowReferenced(e)) return { status: 409, code: 'in_use', message: 'Other records still refer to this one, so it was not changed.' };
  if (isRetryableLock(e)) return { status: 409, code: 'conflict', message: 'Someone else changed the same records at the same moment; try again.' };
  return undefined;
}
