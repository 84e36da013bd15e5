/**
 * The entry tables sort on the server: a header click (the table library's `[{ id, desc }]`) and
 * the list endpoint's `sort` parameter must name the same order both ways.
 */
import { describe, expect, it } from 'vitest';
import { paramFromSorting, sortingFromParam, type SortableColumn } from '@/components/entries/table-sort';

const columns: SortableColumn[] = [
  { id: 'date', sort: { asc: 'date', desc: '-date' } },
  { id: 'crop', sort: { asc: 'crop', desc: 'crop' } },
  { id: 'weighed', sort: { asc: 'grams', desc: '-grams' } },
  { id: 'edible' },
];

describe('sortingFromParam', () => {
  it('reads a descending key as that column sorted descending', () => {
    expect(sortingFromParam('-date', columns)).toEqual([{ id: 'date', desc: true }]);
    expect(sortingFromParam('-grams', columns)).toEqual([{ id: 'weighed', desc: true }]);
  });

  it('reads an ascending key as that column sorted ascending', () => {
    expect(sortingFromParam('grams', columns)).toEqual([{ id: 'weighed', desc: false }]);
  });

  it('reads a one-way sort as ascending', () => {
    expect(sortingFromParam('crop', columns)).toEqual([{ id: 'crop', desc: false }]);
  });

  it('finds no column for a key none of them sorts by', () => {
    expect(sortingFromParam('food', columns)).toEqual([]);
  });
});

describe('paramFromSorting', () => {
  it('names the key of the column and direction', () => {
    expect(paramFromSorting([{ id: 'date', desc: false }], columns, '-date')).toBe('date');
    expect(paramFromSorting([{ id: 'weighed', desc: true }], columns, '-date')).toBe('-grams');
  });

  it('keeps a one-way sort whichever direction the table asks for', () => {
    expect(paramFromSorting([{ id: 'crop', desc: true }], columns, '-date')).toBe('crop');
    expect(paramFromSorting([{ id: 'crop', desc: false }], columns, '-date')).toBe('crop');
  });

  it('falls back when the sorting is empty or names a column that does not sort', () => {
    expect(paramFromSorting([], columns, '-grams')).toBe('-grams');
    expect(paramFromSorting([{ id: 'edible', desc: true }], columns, 'date')).toBe('date');
  });

  it('round-trips every key a column offers', () => {
    for (const key of ['date', '-date', 'grams', '-grams', 'crop']) expect(paramFromSorting(sortingFromParam(key, columns), columns, 'x')).toBe(key);
  });
});
