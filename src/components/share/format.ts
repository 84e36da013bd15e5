/**
 * How the share dashboard writes months, amounts and shares: always with their unit. Month names
 * come from src/lib/months.ts and numbers from src/lib/format-number.ts, so the dashboard writes
 * them as the rest of the app does.
 */
import { formatAmount } from '@/lib/format-number';
import { monthName, parseMonth } from '@/lib/months';

/** Example: `shortMonth('2027-01')` → 'Jan' */
export function shortMonth(month: string): string {
  return monthName(parseMonth(month).month, 'short');
}

/** Example: `longMonth('2027-01')` → 'January 2027' */
export function longMonth(month: string): string {
  const { year, month: m } = parseMonth(month);
  return `${monthName(m)} ${year}`;
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
