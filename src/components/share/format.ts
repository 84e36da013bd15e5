/** How the share dashboard writes months, amounts and shares: always with their unit. */
import { formatAmount } from '../../lib/format-number';
import { parseMonth } from '../../lib/months';

const MONTH_NAMES = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const LONG_MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** Example: `shortMonth('2027-01')` → 'Jan' */
export function shortMonth(month: string): string {
  return MONTH_NAMES[parseMonth(month).month - 1]!;
}

/** Example: `longMonth('2027-01')` → 'January 2027' */
export function longMonth(month: string): string {
  const { year, month: m } = parseMonth(month);
  return `${LONG_MONTHS[m - 1]!} ${year}`;
}

/** Example: `rangeText('2026-10', '2027-09')` → 'October 2026 – September 2027' */
export function rangeText(from: string, to: string): string {
  return from === to ? longMonth(from) : `${longMonth(from)} – ${longMonth(to)}`;
}

/** An amount with its unit; null is "no value". Example: `amountText(1234.5, 'kcal')` → '1,235 kcal' */
export function amountText(value: number | null | undefined, unit: string): string {
  if (value == null) return 'no value';
  return `${formatAmount(value)} ${unit}`;
}
