import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseCropTable } from '@/lib/crop-table';
import { nameWords, referenceCropForName } from '@/lib/crop-name-match';

const rows = parseCropTable(readFileSync('reference-data/crops.csv', 'utf8'));

describe('nameWords', () => {
  it('lower-cases and puts each word in its singular', () => {
    expect(nameWords('Sweet Potatoes')).toBe('sweet potato');
    expect(nameWords('  Peas, fresh  shelling')).toBe('pea fresh shelling');
    expect(nameWords('Asparagus')).toBe('asparagus');
  });
});

describe('referenceCropForName', () => {
  it('finds the row by key, singular or plural, whatever the case', () => {
    for (const name of ['Potatoes', 'potato', ' POTATO ']) expect(referenceCropForName(name, rows)?.key, name).toBe('potatoes');
    expect(referenceCropForName('Beet', rows)?.key).toBe('beets');
    expect(referenceCropForName('Sweet potato', rows)?.key).toBe('sweet-potatoes');
  });

  it('finds the row by its whole name or by the part before a comma or bracket', () => {
    expect(referenceCropForName('Beetroot', rows)?.key).toBe('beets');
    expect(referenceCropForName('Onion', rows)?.key).toBe('onions');
    expect(referenceCropForName('Swede', rows)?.key).toBe('swede');
  });

  it('takes the category of the matched row', () => {
    // reference-data/crops.csv: potatoes root_tuber, kale leafy_green, lentils legume, pumpkin squash
    expect(referenceCropForName('Potatoes', rows)?.category).toBe('root_tuber');
    expect(referenceCropForName('Kale', rows)?.category).toBe('leafy_green');
    expect(referenceCropForName('Lentil', rows)?.category).toBe('legume');
    expect(referenceCropForName('Pumpkins', rows)?.category).toBe('squash');
  });

  it('prefers a key over another row whose name head is the same word', () => {
    const table = [
      { key: 'cabbage-red', name: 'Cabbage, red', category: 'leafy_green' as const },
      { key: 'cabbage', name: 'Cabbage, white', category: 'other' as const },
    ];
    expect(referenceCropForName('Cabbages', table)?.key).toBe('cabbage');
  });

  it('finds nothing for an unknown or empty name', () => {
    expect(referenceCropForName('Dahlia', rows)).toBeUndefined();
    expect(referenceCropForName(' ,. ', rows)).toBeUndefined();
  });
});
