import { describe, expect, it } from 'vitest';
import { DELETION_REMOVES, deletionConfirmed, settingsChangeNotes } from '@/lib/household-settings';

describe('deletionConfirmed', () => {
  it('counts only the exact name, spaces around it ignored', () => {
    expect(deletionConfirmed('Hillside plot', 'Hillside plot')).toBe(true);
    expect(deletionConfirmed('  Hillside plot ', 'Hillside plot')).toBe(true);
    expect(deletionConfirmed('hillside plot', 'Hillside plot')).toBe(false);
    expect(deletionConfirmed('Hillside', 'Hillside plot')).toBe(false);
    expect(deletionConfirmed('Hillside plot!', 'Hillside plot')).toBe(false);
  });

  it('never counts an empty confirmation', () => {
    expect(deletionConfirmed('', '')).toBe(false);
    expect(deletionConfirmed('  ', ' ')).toBe(false);
  });
});

describe('settingsChangeNotes', () => {
  const before = { timezone: 'Europe/Berlin', yearStartMonth: 1 };

  it('says nothing when neither the zone nor the year start changes', () => {
    expect(settingsChangeNotes(before, { ...before })).toEqual([]);
  });

  it('explains that logged dates stay when the zone changes', () => {
    const [note, ...rest] = settingsChangeNotes(before, { ...before, timezone: 'America/New_York' });
    expect(rest).toEqual([]);
    expect(note).toMatch(/^Dates already logged stay as logged\./);
    expect(note).toContain('America/New York');
  });

  it('names the new growing year, wrapping over the new year', () => {
    expect(settingsChangeNotes(before, { ...before, yearStartMonth: 10 })).toEqual([
      'The growing year will run October to September: yearly totals and the default report follow. No entry changes.',
    ]);
    expect(settingsChangeNotes({ ...before, yearStartMonth: 3 }, { ...before, yearStartMonth: 1 })[0]).toContain('January to December');
  });

  it('gives both notes when both change', () => {
    expect(settingsChangeNotes(before, { timezone: 'UTC', yearStartMonth: 4 })).toHaveLength(2);
  });
});

describe('DELETION_REMOVES', () => {
  it('names entries, crops, beds, people, members’ access and letters', () => {
    const text = DELETION_REMOVES.join(' ');
    for (const word of ['harvest', 'bought-food', 'crops', 'beds', 'people', 'access', 'letters']) expect(text).toContain(word);
  });
});
