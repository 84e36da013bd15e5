import { describe, expect, it } from 'vitest';
import { fulltextQuery, searchWords, singular, wantsBranded } from '@/lib/food-query';

describe('wantsBranded', () => {
  it('is true when the query names a brand, maker or chain', () => {
    expect(wantsBranded('cheerios')).toBe(true);
    expect(wantsBranded("Kellogg's corn flakes")).toBe(true);
    expect(wantsBranded('general mills')).toBe(true);
    expect(wantsBranded('wendys burger')).toBe(true);
    expect(wantsBranded('McDonald’s fries')).toBe(true);
  });

  it('is false for what a grower picks or buys by kind', () => {
    for (const q of ['tomatoes', 'eggs', 'honey', 'wheat flour whole', 'oats', 'butternut raw', 'general']) {
      expect(wantsBranded(q), q).toBe(false);
    }
  });
});

describe('searchWords', () => {
  it('keeps letters and digits, drops a possessive and stops at 8 words', () => {
    expect(searchWords("Kellogg's corn flakes")).toEqual(['kellogg', 'corn', 'flakes']);
    expect(searchWords('+potato* -"raw" (@)')).toEqual(['potato', 'raw']);
    expect(searchWords('a b c d e f g h i j')).toHaveLength(8);
  });
});

describe('singular', () => {
  it('cuts English plurals back as food names use them', () => {
    expect(singular('eggs')).toBe('egg');
    expect(singular('tomatoes')).toBe('tomato');
    expect(singular('peaches')).toBe('peach');
    expect(singular('strawberries')).toBe('strawberry');
  });

  it('leaves words that are not plural', () => {
    expect(singular('asparagus')).toBeNull();
    expect(singular('squash')).toBeNull();
    expect(singular('grass')).toBeNull();
    expect(singular('oat')).toBeNull();
  });
});

describe('fulltextQuery', () => {
  it('asks for every word as a prefix, or a plural as its exact singular', () => {
    // "eggs" must find USDA SR28 NDB 01123 "Egg, whole, raw, fresh" (EGG,WHL,RAW,FRSH), whose words say "egg"
    expect(fulltextQuery('eggs fresh')).toBe('+(eggs* egg) +fresh*');
    // an exact singular, not a prefix: "peas" must not find "Pears"
    expect(fulltextQuery('peas')).toBe('+(peas* pea)');
    expect(fulltextQuery('b')).toBe('');
  });
});
