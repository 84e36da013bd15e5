/**
 * Record ids as they appear in URLs (/households/7/harvests/39): one rule for every route, so that
 * `0x27`, `39.0`, `3.9e1`, ` 39` or `039` never reach a record that `39` names. Number() alone
 * reads all of those as 39.
 */

const DIGITS = /^[1-9][0-9]{0,15}$/;

/**
 * The id a URL segment names, or null when it is not plain decimal digits of a positive safe integer.
 * Example: `parseRouteId('39')` → 39; `parseRouteId('0x27')` → null; `parseRouteId('039')` → null
 */
export function parseRouteId(text: string | null | undefined): number | null {
  if (typeof text !== 'string' || !DIGITS.test(text)) return null;
  const id = Number(text);
  return Number.isSafeInteger(id) ? id : null;
}
