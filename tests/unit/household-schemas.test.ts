import { describe, expect, it } from 'vitest';
import { householdInput, householdPatch, invitationInput, isTimeZone, roleAllows, timeZoneList } from '@/lib/household-schemas';

describe('household rules', () => {
  it('accepts IANA time zone names and nothing else', () => {
    // IANA tz database zone names (https://www.iana.org/time-zones)
    expect(isTimeZone('Europe/Oslo')).toBe(true);
    expect(isTimeZone('America/Argentina/Buenos_Aires')).toBe(true);
    expect(isTimeZone('UTC')).toBe(true);
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false);
    // from memory: IANA tz database NEWS — Asia/Calcutta became Asia/Kolkata, Europe/Kiev became Europe/Kyiv; both spellings must work
    expect(isTimeZone('Asia/Kolkata')).toBe(true);
    expect(isTimeZone('Asia/Calcutta')).toBe(true);
    expect(isTimeZone('Europe/Oslo ')).toBe(false);
    expect(isTimeZone('../etc/passwd')).toBe(false);
    expect(timeZoneList()).toContain('Pacific/Auckland');
  });

  it('defaults a new household to metric units and a January year start', () => {
    expect(householdInput.parse({ name: 'Plot', timezone: 'UTC' })).toEqual({ name: 'Plot', timezone: 'UTC', units: 'metric', yearStartMonth: 1 });
  });

  it('refuses unknown units and months outside 1–12', () => {
    expect(householdInput.safeParse({ name: 'P', timezone: 'UTC', units: 'imperial' }).success).toBe(false);
    expect(householdInput.safeParse({ name: 'P', timezone: 'UTC', yearStartMonth: 0 }).success).toBe(false);
    expect(householdInput.safeParse({ name: 'P', timezone: 'UTC', yearStartMonth: 12.5 }).success).toBe(false);
  });

  it('changes only the fields a patch names (no defaults slipped in)', () => {
    expect(householdPatch.parse({ name: 'New name' })).toEqual({ name: 'New name' });
    expect(householdPatch.safeParse({}).success).toBe(false);
  });

  it('invites by a lower-cased address with one of the three roles', () => {
    expect(invitationInput.parse({ email: ' Sam@Example.org ', role: 'viewer' })).toEqual({ email: 'sam@example.org', role: 'viewer' });
    expect(invitationInput.safeParse({ email: 'sam@example.org', role: 'admin' }).success).toBe(false);
  });
});

describe('roleAllows', () => {
  it('lets every member read, owners and growers write, and only owners manage', () => {
    expect(['owner', 'grower', 'viewer'].map((r) => roleAllows(r as 'owner', 'read'))).toEqual([true, true, true]);
    expect(['owner', 'grower', 'viewer'].map((r) => roleAllows(r as 'owner', 'write'))).toEqual([true, true, false]);
    expect(['owner', 'grower', 'viewer'].map((r) => roleAllows(r as 'owner', 'own'))).toEqual([true, false, false]);
  });
});

describe('names are one line of ordinary text', () => {
  it('refuses control characters and broken UTF-16 in a household name', () => {
    expect(householdInput.safeParse({ name: 'B\u0000plot', timezone: 'UTC' }).success).toBe(false);
    expect(householdInput.safeParse({ name: 'Plot \ud800', timezone: 'UTC' }).success).toBe(false);
    expect(householdInput.safeParse({ name: 'Øvre åker 🌱', timezone: 'UTC' }).success).toBe(true);
  });
});
