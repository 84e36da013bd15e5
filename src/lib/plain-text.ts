/**
 * Names (of households, crops, people) are one line of ordinary text: no control characters
 * (NUL, tabs, line breaks…) and no broken UTF-16 halves, which would garble exports and pages.
 */

const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;
const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

/** True for one line of ordinary text, e.g. isPlainLine('Kale, Cavolo nero') → true, isPlainLine('a\u0000b') → false. */
export function isPlainLine(s: string): boolean {
  return !CONTROL.test(s) && !LONE_SURROGATE.test(s);
}

export const PLAIN_LINE_MESSAGE = 'Use letters, digits and punctuation on one line (no control characters).';
