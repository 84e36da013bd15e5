import { describe, expect, it } from 'vitest';
import { currentDestination, householdDestinations, phoneBar } from '@/lib/household-nav';

describe('household navigation', () => {
  it('gives viewers no harvest entry and no settings, owners both', () => {
    const viewer = householdDestinations('viewer').map((d) => d.path);
    expect(viewer).not.toContain('/log');
    expect(viewer).not.toContain('/settings');
    expect(householdDestinations('grower').map((d) => d.path)).toContain('/log');
    expect(householdDestinations('owner').map((d) => d.path)).toEqual(expect.arrayContaining(['/log', '/settings']));
  });

  it('puts the overview, the harvest entry, the larder and the share on the phone bar', () => {
    expect(phoneBar('grower').bar.map((d) => d.short)).toEqual(['Overview', 'Log', 'Larder', 'Share']);
    expect(phoneBar('viewer').bar.map((d) => d.short)).toEqual(['Overview', 'Harvests', 'Larder', 'Share']);
  });

  it.each(['owner', 'grower', 'viewer'] as const)('reaches every destination of a %s from the bar or the More sheet, each once', (role) => {
    const { bar, more } = phoneBar(role);
    const reached = [...bar, ...more].map((d) => d.path).sort();
    expect(reached).toEqual(householdDestinations(role).map((d) => d.path).sort());
  });

  it('names the destination a path is on', () => {
    expect(currentDestination('/households/3', 3)).toBe('');
    expect(currentDestination('/households/3/', 3)).toBe('');
    expect(currentDestination('/households/3/harvests', 3)).toBe('/harvests');
    expect(currentDestination('/households/3/larder/x', 3)).toBe('/larder');
    expect(currentDestination('/households/31/log', 3)).toBeNull();
    expect(currentDestination('/account', 3)).toBeNull();
  });
});
