import { describe, expect, it } from 'vitest';
import { CAUTIONS, aboutCautions, nutrientCautions } from '@/lib/cautions';
import { VEGETARIAN_CAUTIONS } from '@/lib/diet';
import { SHARE_NUTRIENTS } from '@/lib/nutrients';

const ids = (list: { id: string }[]) => list.map((c) => c.id);

describe('cautions beside the share figures', () => {
  it('warns that plant iron and zinc absorb poorly, under their own rows', () => {
    expect(ids(nutrientCautions('iron_mg'))).toEqual(['plantIron']);
    expect(nutrientCautions('iron_mg')[0]!.text).toMatch(/iron from plants is absorbed much less well/i);
    expect(ids(nutrientCautions('zinc_mg'))).toEqual(['plantZinc']);
    expect(nutrientCautions('zinc_mg')[0]!.text).toMatch(/absorbed poorly/);
  });

  it('names spinach and chard as poor calcium sources through their oxalate', () => {
    const text = nutrientCautions('calcium_mg').map((c) => c.text).join(' ');
    expect(text).toMatch(/oxalate/);
    expect(text).toMatch(/spinach/);
    expect(text).toMatch(/chard/);
  });

  it('says vegetable vitamin A is carotenoid at 12 to 1', () => {
    // IOM 2001, vitamin A chapter: 12 µg dietary β-carotene = 1 µg retinol activity equivalent
    expect(nutrientCautions('vitamin_a_rae_ug')[0]!.text).toMatch(/12 µg beta-carotene for 1 µg RAE/);
  });

  it('warns about vitamin K and blood thinners, and plant protein needing variety', () => {
    expect(nutrientCautions('vitamin_k_ug')[0]!.text).toMatch(/blood thinner/);
    const protein = nutrientCautions('protein_g')[0]!.text;
    expect(protein).toMatch(/lysine/);
    expect(protein).toMatch(/sulphur amino acids/);
  });

  it('explains the range for carbohydrate and fat', () => {
    for (const key of ['carbohydrate_g', 'fat_g'] as const) expect(ids(nutrientCautions(key))).toEqual(['amdrRange']);
  });

  it('adds the vegetarian zinc caution only when someone is vegetarian', () => {
    // IOM 2001, zinc chapter: zinc requirement may be as much as 50 % greater for vegetarians
    expect(ids(nutrientCautions('zinc_mg', { vegetarian: true }))).toEqual(['plantZinc', 'vegetarianZinc']);
    expect(nutrientCautions('zinc_mg', { vegetarian: true })[1]!.text).toBe(VEGETARIAN_CAUTIONS[0]);
    expect(ids(nutrientCautions('iron_mg', { vegetarian: true }))).toEqual(['plantIron']);
    expect(ids(aboutCautions({ vegetarian: true }))).toContain('vegetarianZinc');
    expect(ids(aboutCautions())).not.toContain('vegetarianZinc');
  });

  it('leaves rows with nothing to add without a caution', () => {
    expect(nutrientCautions('energy_kcal')).toEqual([]);
    expect(nutrientCautions('fiber_g')).toEqual([]);
  });

  it('says what the figures are as a whole, ending on the medical caution', () => {
    const about = aboutCautions();
    expect(ids(about)).toEqual(['foodSupply', 'precision', 'upperLimit', 'aiNotRequirement', 'medical']);
    expect(CAUTIONS.foodSupply).toMatch(/food supply, not what was eaten/);
    expect(CAUTIONS.precision).toMatch(/whole percent/i);
    expect(CAUTIONS.upperLimit).toMatch(/supplements and preformed vitamin A/);
    expect(CAUTIONS.upperLimit).toMatch(/not about the vitamins in garden food/);
    expect(CAUTIONS.aiNotRequirement).toMatch(/not a proven requirement/);
    expect(about.at(-1)!.text).toMatch(/not medical or dietary advice/);
    expect(about.at(-1)!.text).toMatch(/registered dietitian or a physician/);
  });

  it('writes every caution as whole sentences, and keeps them short enough to sit beside a figure', () => {
    for (const text of Object.values(CAUTIONS)) {
      expect(text).toMatch(/^[A-Z]/);
      expect(text).toMatch(/[.)]$/);
      expect(text.length).toBeLessThan(260);
    }
    // no nutrient row carries more than two cautions, so they never become a wall of text
    for (const key of SHARE_NUTRIENTS) expect(nutrientCautions(key, { vegetarian: true }).length).toBeLessThanOrEqual(2);
  });
});
