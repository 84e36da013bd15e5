/**
 * Formats a nutrient amount for display with sensible precision.
 * @example formatAmount(2.05) // "2.05"; formatAmount(1234.5) // "1,235"
 */
export function formatAmount(n: number): string {
  const abs = Math.abs(n);
  const digits = abs >= 100 ? 0 : abs >= 10 ? 1 : abs >= 1 ? 2 : 3;
  return n.toLocaleString('en-US', { maximumFractionDigits: digits, minimumFractionDigits: 0 });
}
