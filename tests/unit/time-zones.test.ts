import { describe, expect, it } from 'vitest';
import { currentZoneList, currentZoneName, LEGACY_ZONE_NAMES } from '@/lib/time-zones';
import { householdInput, isTimeZone, timeZoneList } from '@/lib/household-schemas';

describe('current time-zone names', () => {
  it('maps the old spellings to the current ones', () => {
    // from memory: IANA tzdb backward file (Link lines: current target, old name)
    expect(currentZoneName('Asia/Calcutta')).toBe('Asia/Kolkata');
    expect(currentZoneName('Europe/Kiev')).toBe('Europe/Kyiv');
    expect(currentZoneName('Asia/Saigon')).toBe('Asia/Ho_Chi_Minh');
    expect(currentZoneName('Asia/Katmandu')).toBe('Asia/Kathmandu');
    expect(currentZoneName('Asia/Rangoon')).toBe('Asia/Yangon');
    expect(currentZoneName('America/Buenos_Aires')).toBe('America/Argentina/Buenos_Aires');
    expect(currentZoneName('America/Godthab')).toBe('America/Nuuk');
    expect(currentZoneName('Pacific/Enderbury')).toBe('Pacific/Kanton');
    expect(currentZoneName('Europe/Oslo')).toBe('Europe/Oslo');
  });

  it('offers no old name, and every name offered works in Intl', () => {
    const offered = timeZoneList();
    for (const old of Object.keys(LEGACY_ZONE_NAMES)) expect(offered).not.toContain(old);
    expect(offered).toContain('Asia/Kolkata');
    expect(offered).toContain('Europe/Kyiv');
    expect(offered).toContain('UTC');
    expect(new Set(offered).size).toBe(offered.length);
    for (const zone of offered) expect(() => new Intl.DateTimeFormat('en', { timeZone: zone })).not.toThrow();
  });

  it('maps each old name to a current name, never to another old one', () => {
    for (const target of Object.values(LEGACY_ZONE_NAMES)) expect(LEGACY_ZONE_NAMES[target]).toBeUndefined();
    expect(currentZoneList(['Asia/Calcutta', 'Asia/Kolkata', 'Europe/Kiev'])).toEqual(['Asia/Kolkata', 'Europe/Kyiv', 'UTC']);
  });

  it('accepts an old name on input and keeps it under the current one', () => {
    expect(isTimeZone('Asia/Calcutta')).toBe(true);
    expect(householdInput.parse({ name: 'Plot', timezone: 'Asia/Calcutta' }).timezone).toBe('Asia/Kolkata');
    expect(householdInput.parse({ name: 'Plot', timezone: 'Europe/Kiev' }).timezone).toBe('Europe/Kyiv');
  });
});
