import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { fieldErrors, FORM_FIELD, zodErrorBody, zodFieldErrors } from '@/lib/error-body';
import { fieldErrors as accountFieldErrors } from '@/lib/error-body';
import { householdPatch } from '@/lib/household-schemas';

describe('error-body', () => {
  const schema = z
    .strictObject({ a: z.number(), b: z.object({ c: z.string() }) })
    .refine((v) => v.a > 1, { message: 'A must be more than 1.' });

  it('lists problems with the whole input under the same key for the API and the forms', () => {
    const err = householdPatch.safeParse({}).error!;
    expect(FORM_FIELD).toBe('_form');
    expect(zodErrorBody(err).fields).toEqual({ _form: 'Change at least one field.' });
    expect(fieldErrors(householdPatch.safeParse({}))).toEqual(zodErrorBody(err).fields);
    expect(accountFieldErrors).toBe(fieldErrors);
  });

  it('keeps the first message per field path and names unknown fields', () => {
    const err = schema.safeParse({ a: 'x', b: { c: 1 }, extra: true }).error!;
    expect(zodFieldErrors(err)).toEqual({
      a: expect.any(String),
      'b.c': expect.any(String),
      extra: 'Unknown field: check its spelling.',
    });
  });

  it('answers with the first problem and a count of the rest', () => {
    const body = zodErrorBody(schema.safeParse({ a: 'x', b: { c: 1 } }).error!);
    expect(body.code).toBe('invalid_input');
    expect(body.message).toMatch(/^a: .+ \(and 1 more problem\)$/);
  });

  it('gives no field errors for a parse that succeeded', () => {
    expect(fieldErrors(schema.safeParse({ a: 2, b: { c: 'x' } }))).toEqual({});
  });
});
