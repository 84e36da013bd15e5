/**
 * Telling MariaDB's errors apart (by the driver's code, under Drizzle's wrapper), and the answer a
 * request gets when one escapes a route: a record that vanished under a concurrent delete is a 404,
 * a row still referenced or a lock conflict a 409 — never a 500 (issue 15: writes racing a
 * household's deletion).
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

/** The status, code and sentence for a database error a route did not handle itself; undefined for any other error. */
export function databaseErrorAnswer(e: unknown): { status: number; code: string; message: string } | undefined {
  if (isParentMissing(e)) return { status: 404, code: 'not_found', message: 'The household or a record this refers to no longer exists.' };
  if (isRowReferenced(e)) return { status: 409, code: 'in_use', message: 'Other records still refer to this one, so it was not changed.' };
  if (isRetryableLock(e)) return { status: 409, code: 'conflict', message: 'Someone else changed the same records at the same moment; try again.' };
  return undefined;
}
