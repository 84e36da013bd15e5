/**
 * A count with its noun in the right number ("1 month", "6 months", "0 entries"), chosen by
 * Intl.PluralRules for English so that no page writes "1 months" again. Nouns whose plural is not
 * noun + "s" are given their plural.
 */

import { formatCount } from './format-number';

const rules = new Intl.PluralRules('en-US');

// The irregular plurals the app's words need.
const IRREGULAR: Readonly<Record<string, string>> = {
  entry: 'entries',
  person: 'people',
  potato: 'potatoes',
  tomato: 'tomatoes',
  category: 'categories',
  copy: 'copies',
  bunch: 'bunches',
};

/** The plural of an English noun the app uses, e.g. pluralOf('entry') → 'entries', pluralOf('lot') → 'lots'. */
export function pluralOf(noun: string): string {
  return IRREGULAR[noun] ?? `${noun}s`;
}

/**
 * The noun that goes with a count, e.g. nounFor(1, 'month') → 'month', nounFor(2, 'month') → 'months',
 * nounFor(1, 'person', 'people') → 'person'. A fraction or 0 takes the plural, as English does.
 */
export function nounFor(count: number, singular: string, plural = pluralOf(singular)): string {
  return rules.select(count) === 'one' ? singular : plural;
}

/**
 * A count and its noun, e.g. countText(1, 'month') → '1 month', countText(6, 'month') → '6 months',
 * countText(1500, 'entry') → '1,500 entries'.
 */
export function countText(count: number, singular: string, plural?: string): string {
  return `${formatCount(count)} ${nounFor(count, singular, plural)}`;
}
