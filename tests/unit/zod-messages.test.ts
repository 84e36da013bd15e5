import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { atMostChars, mustBeNumber, oneOf, trueOrFalse } from '@/lib/zod-messages';
import { roleInput } from '@/lib/household-schemas';
import { price, weightUnit } from '@/lib/entry-schemas';

const firstMessage = (r: { error?: z.ZodError }) => r.error?.issues[0]?.message;

describe('zod-messages', () => {
  it('phrases the generic rules once', () => {
    expect(mustBeNumber('The price')).toBe('The price must be a number.');
    expect(oneOf('The unit', ['g', 'kg'])).toBe('The unit must be one of g, kg.');
    expect(atMostChars('The note', 500)).toBe('The note can be at most 500 characters.');
    expect(trueOrFalse('Trimmed')).toBe('Trimmed must be true or false.');
  });

  it('is what the schemas answer with', () => {
    expect(firstMessage(price.safeParse('3'))).toBe('The price must be a number.');
    expect(firstMessage(weightUnit.safeParse('stone'))).toBe('The unit must be one of g, kg, oz, lb.');
  });

  it('gives a sentence, not zod’s default English, to a rule without a message of its own', () => {
    expect(firstMessage(roleInput.safeParse({ role: 'boss' }))).toBe('Use one of owner, grower, viewer.');
    expect(firstMessage(roleInput.safeParse({}))).toBe('This field is required.');
    expect(firstMessage(z.number().safeParse('x'))).toBe('Enter a number.');
    expect(firstMessage(z.string().max(3).safeParse('abcd'))).toBe('At most 3 characters.');
  });
});
