/**
 * How small and how fine an entry's amount may be, in the unit it was logged in, so that every
 * stored amount prints as a plain decimal and reads back as the same number (CSV export and
 * re-import, the JSON backup). Below 0.000001 JavaScript writes numbers in exponent form ("1e-7"),
 * which spreadsheets and the importer do not read as amounts, and far smaller ones (1e-21) printed
 * as plain decimals become 0.
 *
 * - at least 0.001 of the unit: 1 g in kilograms, 1 mg in grams, under 0.5 g in pounds — finer than
 *   any kitchen or garden scale (common practice (no published source));
 * - kept to 6 decimal places: finer digits (0.1 + 0.2 = 0.30000000000000004 from a conversion) are
 *   rounded off, not refused, since they carry nothing a scale measured.
 */

export const QUANTITY_RULES = { min: 0.001, decimals: 6 } as const;

/** The amount kept to 6 decimal places. Example: `roundQuantity(0.1 + 0.2)` → 0.3; `roundQuantity(2.3125)` → 2.3125 */
export function roundQuantity(q: number): number {
  return Number(q.toFixed(QUANTITY_RULES.decimals));
}

export const QUANTITY_TOO_SMALL = `The amount is too small: at least ${QUANTITY_RULES.min} in its unit (log small weights in g).`;
