import { describe, expect, it } from 'vitest';
import { PASSWORD_MIN, resetPasswordInput, signInInput, signUpInput } from '@/lib/account-schemas';
import { fieldErrors } from '@/lib/error-body';

describe('account form rules', () => {
  it('needs a name, an e-mail address and a password of at least 10 characters to sign up', () => {
    const r = signUpInput.safeParse({ name: ' ', email: 'robin', password: 'nine-char' });
    expect(Object.keys(fieldErrors(r)).sort()).toEqual(['email', 'name', 'password']);
    expect(PASSWORD_MIN).toBe(10);
    expect(signUpInput.safeParse({ name: 'Robin', email: 'robin@example.org', password: 'ten-chars!' }).success).toBe(true);
  });

  it('stores addresses trimmed and in lower case', () => {
    expect(signInInput.parse({ email: '  Robin@Example.ORG ', password: 'x' }).email).toBe('robin@example.org');
  });

  it('refuses passwords over 128 characters', () => {
    expect(fieldErrors(signUpInput.safeParse({ name: 'R', email: 'r@example.org', password: 'x'.repeat(129) })).password).toMatch(/at most 128/);
  });

  it('points a mismatched confirmation at the confirm field', () => {
    expect(fieldErrors(resetPasswordInput.safeParse({ password: 'long-enough-1', confirm: 'long-enough-2' }))).toEqual({ confirm: 'The two passwords differ.' });
  });

  it('gives no errors for valid input', () => {
    expect(fieldErrors(signInInput.safeParse({ email: 'a@b.org', password: 'p' }))).toEqual({});
  });
});
