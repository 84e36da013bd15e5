import { describe, expect, it } from 'vitest';
import { countedAmountText, ENTRY_UNITS, entryQuantityText, isCountOrVolume, parseEntryUnit, UNIT_GROUPS } from '@/lib/entry-units';
import { entryUnit } from '@/lib/entry-schemas';

describe('entry units', () => {
  it('offers weights, then counts, then volumes, every API code once', () => {
    expect(UNIT_GROUPS.map((g) => g.label)).toEqual(['Weight', 'Count', 'Volume']);
    expect(UNIT_GROUPS.flatMap((g) => g.units)).toEqual([...ENTRY_UNITS]);
    expect(ENTRY_UNITS).toEqual(['g', 'kg', 'oz', 'lb', 'piece', 'bunch', 'head', 'ml', 'l', 'cup', 'fl_oz', 'pint_us', 'pint_imp']);
  });

  it('accepts every code in the schema and refuses others with the list', () => {
    for (const u of ENTRY_UNITS) expect(entryUnit.parse(u)).toBe(u);
    expect(entryUnit.safeParse('dozen').error?.issues[0]?.message).toBe('The unit must be one of g, kg, oz, lb, piece, bunch, head, ml, l, cup, fl_oz, pint_us, pint_imp.');
  });

  it('tells counts and volumes from weights', () => {
    expect(isCountOrVolume('piece')).toBe(true);
    expect(isCountOrVolume('pint_imp')).toBe(true);
    expect(isCountOrVolume('kg')).toBe(false);
  });

  it('writes a quantity with its noun in the right number', () => {
    expect(entryQuantityText(12, 'piece')).toBe('12 pieces');
    expect(entryQuantityText(1, 'bunch')).toBe('1 bunch');
    expect(entryQuantityText(3, 'bunch')).toBe('3 bunches');
    expect(entryQuantityText(2, 'head')).toBe('2 heads');
    expect(entryQuantityText(1, 'pint_imp')).toBe('1 imperial pint');
    expect(entryQuantityText(2, 'cup')).toBe('2 US cups');
    expect(entryQuantityText(8, 'fl_oz')).toBe('8 US fl oz');
    expect(entryQuantityText(2, 'l')).toBe('2 l');
    expect(entryQuantityText(250.4, 'ml')).toBe('250 ml');
    expect(entryQuantityText(1.25, 'kg')).toBe('1.25 kg');
  });

  it('shows a count with the grams it stands for', () => {
    expect(countedAmountText({ quantity: 12, unit: 'piece', grams: 600 }, 'metric')).toBe('12 pieces (600 g)');
    expect(countedAmountText({ quantity: 2, unit: 'l', grams: 2062.66 }, 'metric')).toBe('2 l (2.06 kg)');
    // 600 g / 453.59237 g per lb = 1.32 lb (International Yard and Pound Agreement, 1959)
    expect(countedAmountText({ quantity: 12, unit: 'piece', grams: 600 }, 'us')).toBe('12 pieces (1.32 lb)');
  });

  it('reads the units spreadsheets use', () => {
    expect(parseEntryUnit(' Pcs ')).toBe('piece');
    expect(parseEntryUnit('each')).toBe('piece');
    expect(parseEntryUnit('ea')).toBe('piece');
    expect(parseEntryUnit('Bunches')).toBe('bunch');
    expect(parseEntryUnit('heads')).toBe('head');
    expect(parseEntryUnit('litre')).toBe('l');
    expect(parseEntryUnit('Liters')).toBe('l');
    expect(parseEntryUnit('mL')).toBe('ml');
    expect(parseEntryUnit('cups')).toBe('cup');
    expect(parseEntryUnit('fl oz')).toBe('fl_oz');
    expect(parseEntryUnit('imperial pints')).toBe('pint_imp');
    expect(parseEntryUnit('US pint')).toBe('pint_us');
    expect(parseEntryUnit('lbs')).toBe('lb');
    expect(parseEntryUnit('dozen')).toBeUndefined();
  });

  it("reads a bare pint as the household's own, and not at all without one", () => {
    expect(parseEntryUnit('pt', 'pint_imp')).toBe('pint_imp');
    expect(parseEntryUnit('pints', 'pint_us')).toBe('pint_us');
    expect(parseEntryUnit('pint')).toBeUndefined();
  });
});
