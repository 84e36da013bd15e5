/**
 * The zod schemas every free-text field is built from, so the plain-text rule (plain-text.ts) is
 * written once: `lineText` for names and labels, `noteText` for notes. Both trim; a blank value is
 * left to the caller (required, or "none").
 */
import { z } from 'zod';
import { isPlainLine, isPlainNote, normaliseNewlines, PLAIN_LINE_MESSAGE, PLAIN_NOTE_MESSAGE } from './plain-text';
import { atMostChars, mustBeText } from './zod-messages';

/**
 * One line of text up to `max` characters. Example: `lineText('The crop name', 120).parse(' Kale ')` → 'Kale'
 * (and 'Ka\u0000le' is refused).
 */
export function lineText(subject: string, max: number, typeError = mustBeText(subject)) {
  return z
    .string({ error: typeError })
    .trim()
    .max(max, { error: atMostChars(subject, max) })
    .refine(isPlainLine, { error: PLAIN_LINE_MESSAGE });
}

/** A note of up to `max` characters, line breaks kept as `\n`. Example: `noteText('The note', 500).parse('a\r\nb')` → 'a\nb' */
export function noteText(subject: string, max: number) {
  return z
    .string({ error: mustBeText(subject) })
    .trim()
    .overwrite(normaliseNewlines)
    .max(max, { error: atMostChars(subject, max) })
    .refine(isPlainNote, { error: PLAIN_NOTE_MESSAGE });
}
