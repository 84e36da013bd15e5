/** Input rules for the account forms (sign-up, sign-in, reset), shared by the pages and auth.ts. */
import { z } from 'zod';
import { lineText } from './text-schemas';
import { atMostCharsShort } from './zod-messages';

/** Passwords: long enough to resist guessing, short enough to hash quickly. */
export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 128;

// Trim and lower-case first, then check the format (zod checks run in order).
const email = z
  .string({ error: 'Enter an e-mail address, e.g. robin@example.org.' })
  .trim()
  .toLowerCase()
  .max(255, atMostCharsShort(255))
  .pipe(z.email('Enter an e-mail address, e.g. robin@example.org.'));
const password = z
  .string()
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
  .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters.`);

/** What to call a person: one plain line (sign-up, and better-auth's hooks on the server). */
export const accountName = lineText('The name', 200).min(1, 'Tell us what to call you.');

export const signUpInput = z.object({
  name: accountName,
  email,
  password,
});

export const signInInput = z.object({
  email,
  password: z.string().min(1, 'Enter your password.'),
});

export const forgotPasswordInput = z.object({ email });

export const resetPasswordInput = z
  .object({ password, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords differ.', path: ['confirm'] });

// The one zod-error flattener lives in ./error-body; re-exported for the account and household forms.
