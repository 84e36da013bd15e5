/** Input rules for households and memberships, shared by the forms and the API. */
import { z } from 'zod';

export const ROLE_VALUES = ['owner', 'grower', 'viewer'] as const;
export type RoleValue = (typeof ROLE_VALUES)[number];

export const ROLE_LABELS: Record<RoleValue, string> = {
  owner: 'Owner — everything, including members and deletion',
  grower: 'Grower — logs harvests and food, edits crops, people and plans',
  viewer: 'Viewer — reads everything, changes nothing',
};

const zones = new Set<string>([...Intl.supportedValuesOf('timeZone'), 'UTC', 'Etc/UTC']);

/** The IANA zones this runtime knows, sorted, for the time zone picker. */
export function timeZoneList(): string[] {
  return [...zones].sort();
}

export const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'] as const;

/**
 * True for an IANA time zone name this runtime knows.
 * @example isTimeZone('Europe/Oslo') // true; isTimeZone('Mars/Olympus') // false
 */
export function isTimeZone(tz: string): boolean {
  return zones.has(tz);
}

export const householdInput = z.object({
  name: z.string().trim().min(1, 'Give the household a name.').max(120, 'At most 120 characters.'),
  timezone: z.string().trim().refine(isTimeZone, 'Not a known IANA time zone (e.g. Europe/Berlin).'),
  units: z.enum(['metric', 'us']).default('metric'),
  yearStartMonth: z.number().int().min(1).max(12).default(1),
});

export const householdPatch = householdInput.partial().refine((v) => Object.keys(v).length > 0, 'Change at least one field.');

export const roleInput = z.object({ role: z.enum(ROLE_VALUES) });

export const invitationInput = z.object({
  email: z.email('Not an e-mail address.').trim().toLowerCase().max(255),
  role: z.enum(ROLE_VALUES),
});

export const acceptInvitationInput = z.object({
  token: z.string().trim().min(1, 'The invitation token is missing.').max(200, 'Not an invitation token.'),
});

/** Which roles may do what: read (every member), write (owner, grower), own (owner). */
export type Access = 'read' | 'write' | 'own';

export function roleAllows(role: RoleValue, access: Access): boolean {
  if (access === 'read') return true;
  if (access === 'write') return role === 'owner' || role === 'grower';
  return role === 'owner';
}
