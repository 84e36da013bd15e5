/** How the Larder page writes energy and protein; days and months go through src/lib/format-date.ts like every page. */
import { formatDate, formatMonthText } from '@/lib/format-date';
import { formatAmount } from '@/lib/format-number';

/** Example: `dateText('2027-03-01')` → '1 Mar 2027' */
export const dateText = (date: string): string => formatDate(date);

/** Example: `monthText('2027-03')` → 'Mar 2027' */
export const monthText = (month: string): string => formatMonthText(month);

export const energyText = (kcal: number | null) => (kcal === null ? 'energy unknown' : `${formatAmount(Math.round(kcal))} kcal`);
export const proteinText = (g: number | null) => (g === null ? 'protein unknown' : `${formatAmount(Math.round(g))} g protein`);
