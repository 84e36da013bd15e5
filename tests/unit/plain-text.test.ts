import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { accountName, signUpInput } from '@/lib/account-schemas';
import { bedInput } from '@/lib/bed-schemas';
import { cropInput } from '@/lib/crop-schemas';
import { harvestInput, stapleInput } from '@/lib/entry-schemas';
import { householdInput } from '@/lib/household-schemas';
import { personInput } from '@/lib/people-schemas';
import { isPlainLine, isPlainNote, normaliseNewlines } from '@/lib/plain-text';
import { lineText, noteText } from '@/lib/text-schemas';
import { messyText } from '../support/arbitraries';

// C0 controls U+0000–U+001F, DEL U+007F and C1 controls U+0080–U+009F (Unicode general category Cc).
const controls = fc.oneof(fc.integer({ min: 0, max: 0x1f }), fc.integer({ min: 0x7f, max: 0x9f })).map((c) => String.fromCharCode(c));
const loneSurrogate = fc.integer({ min: 0xd800, max: 0xdfff }).map((c) => String.fromCharCode(c));

describe('one line of plain text', () => {
  it('accepts letters of any script, punctuation and emoji', () => {
    for (const s of ['Kale, Cavolo nero', 'Øvre åker 🌱', 'ジャガイモ', 'Pois mangetoût', "O'Brien \"Red\" (no. 3)"]) expect(isPlainLine(s), s).toBe(true);
  });

  it('refuses any control character, line break or lone UTF-16 half, wherever it sits', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 5 }), fc.oneof(controls, loneSurrogate, fc.constantFrom('\u2028', '\u2029')), fc.string({ maxLength: 5 }), (a, bad, b) => {
        // A lone half next to its partner would pair up: keep the neighbours from completing it.
        fc.pre(!/[\ud800-\udfff]/.test(a + b));
        expect(isPlainLine(a + bad + b)).toBe(false);
      }),
    );
  });
});

describe('notes', () => {
  it('keep line breaks, every kind written as \\n', () => {
    expect(normaliseNewlines('row 3\r\nnetted\rwatered\u2028ok')).toBe('row 3\nnetted\nwatered\nok');
    expect(noteText('The note', 500).parse('  first\r\nsecond  ')).toBe('first\nsecond');
    expect(isPlainNote('first\nsecond')).toBe(true);
  });

  it('refuse tabs, NUL and the other control characters', () => {
    for (const bad of ['a\tb', 'a\u0000b', 'a\u000bb', 'a\u0085b', 'a\ud800b']) expect(noteText('The note', 500).safeParse(bad).success, JSON.stringify(bad)).toBe(false);
  });
});

describe('every schema with free text uses the rule', () => {
  // A value every one of them must refuse, and the field it belongs to.
  const NUL = 'Bean\u0000row';
  const cases: [string, { safeParse(v: unknown): { success: boolean } }, Record<string, unknown>][] = [
    ['household name', householdInput, { name: NUL, timezone: 'UTC' }],
    ['crop name', cropInput, { name: NUL }],
    ['crop variety', cropInput, { name: 'Bean', variety: NUL }],
    ['staple label', stapleInput, { foodId: 1, label: NUL, quantity: 1, unit: 'kg' }],
    ['bed name', bedInput, { name: NUL, area: 4 }],
    ['bed notes', bedInput, { name: 'Bed', area: 4, notes: NUL }],
    ['person name', personInput, { name: NUL, sex: 'female', ageYears: 30 }],
    ['harvest note', harvestInput, { date: '2026-07-01', cropId: 1, quantity: 1, unit: 'kg', note: NUL }],
    ['sign-up name', signUpInput, { name: NUL, email: 'a@b.example', password: 'long-enough-1' }],
  ];
  it.each(cases)('refuses a NUL in the %s', (_what, schema, value) => {
    expect(schema.safeParse(value).success).toBe(false);
  });

  it('keeps a line break out of names and in notes', () => {
    expect(cropInput.safeParse({ name: 'Runner\nbean' }).success).toBe(false);
    expect(accountName.safeParse('Robin\r\nGood').success).toBe(false);
    const h = harvestInput.parse({ date: '2026-07-01', cropId: 1, quantity: 1, unit: 'kg', note: 'lifted\r\nstored in clamp' });
    expect(h.note).toBe('lifted\nstored in clamp');
  });

  it('never lets through a generated name that is not plain (any of the schemas above)', () => {
    fc.assert(
      fc.property(messyText(), (name) => {
        const r = lineText('The name', 120).safeParse(name);
        if (r.success) expect(isPlainLine(r.data)).toBe(true);
        const n = noteText('The note', 500).safeParse(name);
        if (n.success) expect(isPlainNote(n.data) && !n.data.includes('\r')).toBe(true);
      }),
      { numRuns: 1000 },
    );
  });
});
