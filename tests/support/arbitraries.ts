/**
 * fast-check generators of what people (and probes) type, shared by the property tests: text that
 * mixes ordinary letters with the characters that have broken exports before (NUL and other
 * control characters, CR/LF, lone UTF-16 halves, quotes, delimiters, formula starters, a BOM,
 * combining accents, emoji), and amounts from the absurd (1e-21) to the ordinary.
 */
import fc from 'fast-check';

/** Single characters (or pairs) chosen for trouble. */
const NASTY = [
  '\u0000', '\u0001', '\u0007', '\t', '\n', '\r', '\r\n', '\u000b', '\u001b', '\u007f', '\u0085', '\u009f',
  '\u2028', '\u2029', '\ud800', '\udfff', '\udc00\ud800', '\uFEFF', '\u200b', '\u202e',
  '"', "'", ',', ';', '=', '+', '-', '@', ' ', '  ', '\\', '%', '<', '>', '&',
  'é', 'e\u0301', 'ß', 'İ', 'Ø', '„', '“', '—', '🌱', '🥔', 'ジャガ', '\ufffd',
] as const;

/** One piece of text: a troublesome character, a word, or any code point. */
const piece = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...NASTY) },
  { weight: 3, arbitrary: fc.constantFrom('Potato', 'kale', 'Pink Fir', 'row 3', 'sack', '1.5', 'x') },
  { weight: 2, arbitrary: fc.string({ unit: 'binary', maxLength: 2 }) },
);

/** Free text of up to `maxPieces` pieces. */
export function messyText(maxPieces = 10): fc.Arbitrary<string> {
  return fc.array(piece, { maxLength: maxPieces }).map((parts) => parts.join(''));
}

/** Amounts, numbers or not: the API's quantity field as a probe would fill it. */
export const messyQuantity: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: fc.integer({ min: 1, max: 100_000_000 }).map((n) => n / 1000) },
  { weight: 2, arbitrary: fc.double({ min: -10, max: 200_000, noNaN: true }) },
  { weight: 2, arbitrary: fc.constantFrom(1e-21, 1e-7, 0.000999, 0.001, 0.1 + 0.2, 2.3125, 99_999.9999999, 100_000, 100_000.1, 0, -0, -1) },
  { weight: 1, arbitrary: fc.constantFrom(Number.NaN, Infinity, '1.5', null, true, 1e308) },
);

/** A day that exists, 2020–2026 (dates are not what these tests probe). */
export const pastDate: fc.Arbitrary<string> = fc
  .date({ min: new Date('2020-01-01T00:00:00Z'), max: new Date('2026-06-30T00:00:00Z'), noInvalidDate: true })
  .map((d) => d.toISOString().slice(0, 10));
