/**
 * The one plain-text rule for everything people type (names, labels, notes): text that pages,
 * exports and re-imports carry unchanged. Refused everywhere: NUL and the other C0/C1 control
 * characters (tabs included) and broken UTF-16 halves (lone surrogates), which garble CSV files,
 * mail and the database's UTF-8. Line breaks belong in notes only: there `\r\n`, a lone `\r` and
 * the Unicode line and paragraph separators are all stored as `\n`; names stay on one line.
 */

const CONTROL = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/;
const CONTROL_BUT_NEWLINE = /[\u0000-\u0009\u000b-\u001f\u007f-\u009f]/;
const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

/** True for one line of ordinary text, e.g. isPlainLine('Kale, Cavolo nero') → true, isPlainLine('a\u0000b') → false. */
export function isPlainLine(s: string): boolean {
  return !CONTROL.test(s) && !LONE_SURROGATE.test(s);
}

/** Every way of breaking a line written as `\n`. Example: `normaliseNewlines('a\r\nb\rc')` → 'a\nb\nc' */
export function normaliseNewlines(s: string): string {
  return s.replace(/\r\n?|[\u2028\u2029]/g, '\n');
}

/** True for note text after normaliseNewlines: plain lines joined by `\n`. Example: `isPlainNote('Row 3\nnetted')` → true */
export function isPlainNote(s: string): boolean {
  return !CONTROL_BUT_NEWLINE.test(s) && !LONE_SURROGATE.test(s);
}

export const PLAIN_LINE_MESSAGE = 'Use letters, digits and punctuation on one line (no control characters).';
export const PLAIN_NOTE_MESSAGE = 'Use letters, digits, punctuation and line breaks (no tabs or other control characters).';
