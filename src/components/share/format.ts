/**
 * How the share dashboard writes months, amounts and shares: always with their unit. Month names
 * come from src/lib/months.ts and numbers from src/lib/format-number.ts, so the dashboard writes
 * them as the rest of the app does.
 */
import { formatMonthText } from '@/lib/format-date';
import { formatAmount } from '@/lib/format-number';
import { monthName, parseMonth } from '@/lib/months';
import type { NeedBasis } from '@/lib/need-basis';

/** Example: `shortMonth('2027-01')` → 'Jan' */
export function shortMonth(month: string): string {
  return monthName(parseMonth(month).month, 'short');
}

/** Example: `longMonth('2027-01')` → 'January 2027' */
export function longMonth(month: string): string {
  return formatMonthText(month, 'long');
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


/**
 * The recommended intake of a share value: the AMDR range for carbohydrate and fat, else the one amount,
 * e.g. `needText({ need: 250, needLow: 250, needHigh: 361 }, 'g')` → '250–361 g'; a missing need is 'no value'.
 */
export function needText(v: { need: number | null; needLow?: number | null; needHigh?: number | null }, unit: string): string {
  if (v.needLow != null && v.needHigh != null) return `${formatAmount(v.needLow)}–${formatAmount(v.needHigh)} ${unit}`;
  return amountText(v.need, unit);
}

/** Example: `basisShort('AI')` → 'AI'; 'mixed' → 'RDA/AI'; null → '' */
export function basisShort(basis: NeedBasis | null | undefined): string {
  if (!basis) return '';
  if (basis === 'mixed') return 'RDA/AI';
  if (basis === 'AMDR') return 'range';
  return basis;
}

/** Example: `basisLong('AI')` → 'adequate intake (AI): what healthy people are seen to eat, not a requirement' */
export function basisLong(basis: NeedBasis | null | undefined): string {
  switch (basis) {
    case 'RDA':
      return 'recommended dietary allowance (RDA): enough for nearly everyone';
    case 'AI':
      return 'adequate intake (AI): what healthy people are seen to eat, not a requirement';
    case 'AMDR':
      return 'acceptable range (AMDR) of the energy need; shares are of its low end';
    case 'EER':
      return 'estimated energy requirement (EER), or the kcal a day stated';
    case 'mixed':
      return 'an RDA for some people, an AI for others';
    default:
      return 'no recommended intake';
  }
}
