import { describe, expect, it } from 'vitest';
import { LETTER_DUE_LAST_DAY, dueLetterMonth, dueLetterMonthIn } from '@/lib/letter-due';

describe('when the monthly letter is due', () => {
  it('is due on the first days of a month, about the month before, across a year end', () => {
    expect(dueLetterMonth('2027-01-01')).toBe('2026-12');
    expect(dueLetterMonth('2026-12-07')).toBe('2026-11');
  });

  it('is not due after the catch-up window', () => {
    expect(LETTER_DUE_LAST_DAY).toBe(7);
    expect(dueLetterMonth('2026-12-08')).toBeNull();
    expect(dueLetterMonth('2026-12-31')).toBeNull();
  });

  it("follows the household's own clock", () => {
    // Pacific/Auckland is UTC+13 in January (NZDT) and America/Los_Angeles UTC−8 (PST) (IANA tz database).
    const instant = new Date('2027-01-01T02:00:00Z');
    expect(dueLetterMonthIn('Pacific/Auckland', instant)).toBe('2026-12'); // 15:00 on 1 January there
    expect(dueLetterMonthIn('America/Los_Angeles', instant)).toBeNull(); // 18:00 on 31 December there
    expect(dueLetterMonthIn('America/Los_Angeles', new Date('2027-01-01T08:00:00Z'))).toBe('2026-12'); // midnight there
  });
});
