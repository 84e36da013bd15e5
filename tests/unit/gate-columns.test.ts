/**
 * The household gate (src/server/authz.ts) reads a route's extra columns in its own query, in one
 * row beside the session, the role and the household: an extra column named like one of those
 * would shadow it, so making such a route fails at once.
 */
import { sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { householdRouteWith } from '@/server/authz';

const route = (name: string) => () => householdRouteWith('read', { columns: { [name]: sql`1` }, values: () => ({}) }, () => new Response(null));

describe('gate columns', () => {
  it('refuses a column named like one the gate reads itself', () => {
    for (const name of ['role', 'userId', 'expiresAt', 'household.id']) expect(route(name)).toThrow(`a gate column cannot be called "${name}"`);
  });

  it('takes any other name', () => {
    expect(route('storedAnswer')).not.toThrow();
  });
});
