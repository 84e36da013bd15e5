import { describe, expect, it } from 'vitest';
import { formatAmount, formatCount, trimmedDecimal } from '@/lib/format-number';
import { amountText, longMonth, rangeText, shortMonth } from '@/components/share/format';

describe('format-number', () => {
  it('writes amounts with fewer decimals the larger they are', () => {
    expect(formatAmount(1234.5)).toBe('1,235');
    expect(formatAmount(12.34)).toBe('12.3');
    expect(formatAmount(2.05)).toBe('2.05');
    expect(formatAmount(0.1234)).toBe('0.123');
    expect(formatAmount(-150.4)).toBe('-150');
  });

  it('writes counts with thousands separators', () => {
    expect(formatCount(100_000)).toBe('100,000');
    expect(formatCount(10_000)).toBe('10,000');
    expect(formatCount(7)).toBe('7');
  });

  it('drops trailing zeros from fixed decimals, without separators', () => {
    expect(trimmedDecimal(1.5, 2)).toBe('1.5');
    expect(trimmedDecimal(2, 2)).toBe('2');
    expect(trimmedDecimal(1234.567, 1)).toBe('1234.6');
    expect(trimmedDecimal(10, 0)).toBe('10');
  });

  it('lets the dashboard write months and amounts with their unit', () => {
    expect(shortMonth('2027-01')).toBe('Jan');
    expect(longMonth('2027-09')).toBe('September 2027');
    expect(rangeText('2026-10', '2027-09')).toBe('October 2026 – September 2027');
    expect(amountText(1234.5, 'kcal')).toBe('1,235 kcal');
    expect(amountText(null, 'mg')).toBe('no value');
  });
});
