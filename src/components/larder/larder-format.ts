/** How the Larder page writes dates, months, energy and protein. */
import { formatAmount } from '@/lib/format-number';
import { monthName } from '@/lib/months';

/** Example: `dateText('2027-03-01')` → '1 Mar 2027' */
export function dateText(date: string): string {
  const [y, m, d] = date.split('-').map(Number);
  return `${d} ${monthName(m!, 'short')} ${y}`;
}

/** Example: `monthText('2027-03')` → 'Mar 2027' */
export function monthText(month: string): string {
  const [y, m] = month.split('-').map(Number);
  return `${monthName(m!, 'short')} ${y}`;
}

export const energyText = (kcal: number | null) => (kcal === null ? 'energy unknown' : `${formatAmount(Math.round(kcal))} kcal`);
export const proteinText = (g: number | null) => (g === null ? 'protein unknown' : `${formatAmount(Math.round(g))} g protein`);
