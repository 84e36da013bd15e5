/**
 * Where a household's pages are and which of them a role gets: one list for the desktop tab row,
 * the phone's bottom bar and its "More" sheet, so that no destination is reachable on one screen
 * size and missing on the other.
 */
import type { RoleValue } from './household-schemas';

export interface Destination {
  /** Path after /households/{id}; '' is the overview. */
  path: string;
  label: string;
  /** A shorter label for the phone's bottom bar. */
  short: string;
}

const ALL: (Destination & { roles?: readonly RoleValue[] })[] = [
  { path: '', label: 'Overview', short: 'Overview' },
  // Viewers read: a "Log harvest" they cannot use would be a dead end.
  { path: '/log', label: 'Log harvest', short: 'Log', roles: ['owner', 'grower'] },
  { path: '/harvests', label: 'Harvests', short: 'Harvests' },
  { path: '/larder', label: 'Larder', short: 'Larder' },
  { path: '/bought', label: 'Bought food', short: 'Bought' },
  { path: '/share', label: 'Home share', short: 'Share' },
  { path: '/gaps', label: 'Gaps', short: 'Gaps' },
  { path: '/people', label: 'People', short: 'People' },
  { path: '/crops', label: 'Crops', short: 'Crops' },
  { path: '/beds', label: 'Beds', short: 'Beds' },
  { path: '/members', label: 'Members', short: 'Members' },
  { path: '/import', label: 'Import/export', short: 'Import' },
  // Settings (rename, time zone, deletion) are the owner's alone; others would only meet a refusal.
  { path: '/settings', label: 'Settings', short: 'Settings', roles: ['owner'] },
];

/**
 * Every page of the household this role may use, in tab order.
 * @example householdDestinations('viewer').some((d) => d.path === '/log') // false
 */
export function householdDestinations(role: RoleValue): Destination[] {
  return ALL.filter((d) => !d.roles || d.roles.includes(role)).map(({ path, label, short }) => ({ path, label, short }));
}

/**
 * The four destinations of the phone's bottom bar (a fifth button, "More", lists the rest): the
 * overview, the harvest entry (the harvest log for a viewer), the larder and the home share.
 * @example phoneBar('grower').map((d) => d.short) // ['Overview', 'Log', 'Larder', 'Share']
 */
export function phoneBar(role: RoleValue): { bar: Destination[]; more: Destination[] } {
  const all = householdDestinations(role);
  const barPaths = ['', all.some((d) => d.path === '/log') ? '/log' : '/harvests', '/larder', '/share'];
  return {
    bar: barPaths.map((p) => all.find((d) => d.path === p)!),
    more: all.filter((d) => !barPaths.includes(d.path)),
  };
}

/**
 * The destination a path is on (longest match), for aria-current; null off the household's pages.
 * @example currentDestination('/households/3/harvests', 3) // '/harvests'
 */
export function currentDestination(pathname: string, householdId: number): string | null {
  const base = `/households/${householdId}`;
  const p = pathname.replace(/\/$/, '');
  if (p === base) return '';
  if (!p.startsWith(`${base}/`)) return null;
  return p.slice(base.length).match(/^\/[^/]+/)?.[0] ?? null;
}
