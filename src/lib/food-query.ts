/**
 * What a food search query asks for, read before the database is asked. Growers type what they
 * picked ("eggs", "tomatoes") and rarely a brand; SR28 lists hundreds of branded cereals, sweets and
 * fast-food items that would crowd those searches, so the search leaves branded foods out (their
 * `rawness` is `RAWNESS.branded`) unless the query itself names a brand or the person asks for them.
 */
import { namesBrand } from './food-brands';

/**
 * Whether a query names a brand, maker or chain, so branded foods belong in its results.
 * Example: wantsBranded('cheerios') === true; wantsBranded('tomatoes') === false
 */
export function wantsBranded(q: string): boolean {
  return namesBrand(q);
}

/**
 * The search words of a query: letters and digits, lower case, a possessive "'s" dropped, at most 8.
 * Example: searchWords("Kellogg's corn flakes") → ['kellogg', 'corn', 'flakes']
 */
export function searchWords(q: string): string[] {
  return (q.toLowerCase().match(/[\p{L}\p{N}]+(?:['’][\p{L}\p{N}]+)*/gu) ?? [])
    .map((w) => w.replace(/['’]s$/u, '').replace(/['’]/gu, ''))
    .filter(Boolean)
    .slice(0, 8);
}

/**
 * The singular of an English plural as food names use them, or null when the word is not plural:
 * "eggs" → "egg", "tomatoes" → "tomato", "peaches" → "peach", "berries" → "berry".
 * Example: singular('eggs') === 'egg'; singular('asparagus') === null
 */
export function singular(word: string): string | null {
  if (word.length <= 3 || !word.endsWith('s') || /(ss|us|is)$/.test(word)) return null;
  if (/[^aeiou]ies$/.test(word)) return `${word.slice(0, -3)}y`;
  if (/(oes|ches|shes|xes|sses)$/.test(word)) return word.slice(0, -2);
  return word.slice(0, -1);
}

/**
 * A MariaDB boolean-mode FULLTEXT query for the words of two letters or more: every word must
 * occur as a word prefix, or, for a plural, as its exact singular ("eggs" finds "Egg, whole, raw,
 * fresh" but "peas" does not find "Pears"). Empty when no word is long enough.
 * Example: fulltextQuery('eggs fresh') === '+(eggs* egg) +fresh*'
 */
export function fulltextQuery(q: string): string {
  return searchWords(q)
    .filter((w) => w.length >= 2)
    .map((w) => {
      const one = singular(w);
      return one && one.length >= 3 ? `+(${w}* ${one})` : `+${w}*`;
    })
    .join(' ');
}
