/**
 * The generic messages of every input rule, in one place: "… must be a number", "… must be one of
 * …", "… can be at most N characters" and the rest are phrased here once, and the schema modules
 * only say *what* is checked ("The price", "The note"). Importing this module also installs one
 * zod error map (`z.config({ customError })`) for a rule that gives no message of its own, so no
 * answer ever shows zod's default English ("Invalid input: expected number, received string").
 * Specific messages that say how to fix the input stay beside their rule.
 */
import { z } from 'zod';

/** Example: `mustBeNumber('The price')` → 'The price must be a number.' */
export const mustBeNumber = (subject: string): string => `${subject} must be a number.`;

/** Example: `mustBeWhole('The page')` → 'The page must be a whole number.' */
export const mustBeWhole = (subject: string): string => `${subject} must be a whole number.`;

/** Example: `mustBeText('The note')` → 'The note must be text.' */
export const mustBeText = (subject: string): string => `${subject} must be text.`;

/** Example: `trueOrFalse('Trimmed')` → 'Trimmed must be true or false.' */
export const trueOrFalse = (subject: string): string => `${subject} must be true or false.`;

/** Example: `oneOf('The unit', ['g', 'kg'])` → 'The unit must be one of g, kg.' */
export const oneOf = (subject: string, values: readonly string[]): string => `${subject} must be one of ${values.join(', ')}.`;

/** Example: `atMostChars('The note', 500)` → 'The note can be at most 500 characters.' */
export const atMostChars = (subject: string, max: number): string => `${subject} can be at most ${max} characters.`;

/** For a field whose label names it already. Example: `atMostCharsShort(120)` → 'At most 120 characters.' */
export const atMostCharsShort = (max: number): string => `At most ${max} characters.`;

type Issue = z.core.$ZodRawIssue;

/**
 * The message for an issue whose rule gave none, as a whole sentence that says what to send.
 * Example: `genericMessage({ code: 'invalid_type', expected: 'number', input: 'x', … })` → 'Enter a number.'
 */
export function genericMessage(issue: Issue): string | undefined {
  switch (issue.code) {
    case 'invalid_type':
      if (issue.input === undefined) return 'This field is required.';
      if (issue.expected === 'number' || issue.expected === 'int') return 'Enter a number.';
      if (issue.expected === 'string') return 'Enter text.';
      if (issue.expected === 'boolean') return 'Use true or false.';
      return `Send ${issue.expected === 'object' ? 'an object' : `a value of type ${issue.expected}`} here.`;
    case 'invalid_value':
      if (issue.input === undefined) return 'This field is required.';
      return `Use one of ${issue.values.map(String).join(', ')}.`;
    case 'too_small':
      if (issue.origin === 'string') return Number(issue.minimum) <= 1 ? 'This field is required.' : `Use at least ${issue.minimum} characters.`;
      if (issue.origin === 'array') return `Give at least ${issue.minimum}.`;
      return `Use a value of at least ${issue.minimum}${issue.inclusive === false ? ' (not equal)' : ''}.`;
    case 'too_big':
      if (issue.origin === 'string') return atMostCharsShort(Number(issue.maximum));
      if (issue.origin === 'array') return `Give at most ${issue.maximum}.`;
      return `Use a value of at most ${issue.maximum}${issue.inclusive === false ? ' (not equal)' : ''}.`;
    case 'invalid_format':
      return issue.format === 'email' ? 'Enter an e-mail address, e.g. robin@example.org.' : 'This is not in the expected format.';
    case 'not_multiple_of':
      return `Use a multiple of ${String(issue.divisor)}.`;
    default:
      return undefined;
  }
}

z.config({ customError: genericMessage });
