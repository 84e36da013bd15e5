/**
 * How numbers are written for people, in one place: amounts with a precision that suits their
 * size, whole counts with thousands separators, and weights with their trailing zeros dropped.
 * Everything goes through a few cached `Intl.NumberFormat`s in English, so the server's HTML and
 * the browser's islands write the same text whatever the machine's locale.
 */

const formats = new Map<string, Intl.NumberFormat>();

// One Intl.NumberFormat per option set: building one is far slower than using it.
function numberFormat(options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = JSON.stringify(options);
  let f = formats.get(key);
  if (!f) {
    f = new Intl.NumberFormat('en-US', options);
    formats.set(key, f);
  }
  return f;
}

/**
 * A nutrient amount with a precision that suits its size: no decimals from 100, one from 10, two
 * from 1, three below. Example: `formatAmount(2.05)` → '2.05'; `formatAmount(1234.5)` → '1,235'
 */
export function formatAmount(n: number): string {
  const abs = Math.abs(n);
  const digits = abs >= 100 ? 0 : abs >= 10 ? 1 : abs >= 1 ? 2 : 3;
  return numberFormat({ maximumFractionDigits: digits, minimumFractionDigits: 0 }).format(n);
}

/** A count or a limit with thousands separators. Example: `formatCount(100000)` → '100,000' */
export function formatCount(n: number): string {
  return numberFormat({ maximumFractionDigits: 3 }).format(n);
}

/**
 * Fixed decimals with trailing zeros dropped and no thousands separator, rounded as `toFixed`
 * rounds, for a number that is read back or typed again (a weight in its unit).
 * Example: `trimmedDecimal(1.5, 2)` → '1.5'; `trimmedDecimal(2, 2)` → '2'; `trimmedDecimal(1234.567, 1)` → '1234.6'
 */
export function trimmedDecimal(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}
