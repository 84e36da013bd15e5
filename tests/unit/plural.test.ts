import { describe, expect, it } from 'vitest';
import { countText, nounFor, pluralOf } from '@/lib/plural';

describe('plurals', () => {
  it('writes one as singular and every other count as plural, as English does', () => {
    // Unicode CLDR plural rules for English: "one" is exactly 1 (integer), everything else "other"
    expect(countText(1, 'month')).toBe('1 month');
    expect(countText(6, 'month')).toBe('6 months');
    expect(countText(0, 'month')).toBe('0 months');
    expect(nounFor(1.5, 'year')).toBe('years');
  });

  it('knows the irregular plurals the app uses', () => {
    expect(countText(2, 'entry')).toBe('2 entries');
    expect(countText(1, 'entry')).toBe('1 entry');
    expect(pluralOf('person')).toBe('people');
    expect(countText(3, 'bought-food entry', 'bought-food entries')).toBe('3 bought-food entries');
  });

  it('writes large counts with thousands separators', () => {
    expect(countText(1500, 'row')).toBe('1,500 rows');
  });
});
