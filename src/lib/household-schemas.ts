/** Input rules for households and memberships, shared by the forms and the API. */
import { z } from 'zod';
import { atMostCharsShort } from './zod-messages';
import { lineText } from './text-schemas';
import { isMonth } from './months';
import { UNIT_SYSTEMS } from './units';
import { currentZoneList, currentZoneName } from './time-zones';
import { isCurrencyCode } from './currency';

export const ROLE_VALUES = ['owner', 'grower', 'viewer'] as const;
export type RoleValue = (typeof ROLE_VALUES)[number];

export const ROLE_LABELS: Record<RoleValue, string> = {
  owner: 'Owner — everything, including members, the household’s settings and deleting it',
  grower: 'Grower — logs harvests and food, records what happened in the larder, edits crops, beds and plans',
  viewer: 'Viewer — reads everything, changes nothing',
};

// Every name the runtime knows (old ICU spellings too), for the check; the picker offers current names only.
const zones = new Set<string>([...Intl.supportedValuesOf('timeZone'), 'UTC', 'Etc/UTC']);
const offeredZones = currentZoneList([...zones]);

/** The IANA zones this runtime knows under their current names (no Asia/Calcutta), sorted, for the time zone picker. */
export function timeZoneList(): string[] {
  return [...offeredZones];
}

export { currentZoneName } from './time-zones';

// Month names live with the other calendar code in ./months; re-exported for the household forms.
export { MONTH_NAMES } from './months';

const ZONE_SHAPE = /^[A-Za-z][A-Za-z0-9_+-]*(\/[A-Za-z0-9][A-Za-z0-9_+-]*)*$/;

/**
 * True for an IANA time zone name this runtime knows, current or older spelling alike (the
 * runtime's own list has ICU's names, e.g. Asia/Calcutta, while browsers may say Asia/Kolkata).
 * @example isTimeZone('Europe/Oslo') // true; isTimeZone('Asia/Kolkata') // true; isTimeZone('Mars/Olympus') // false
 */
export function isTimeZone(tz: string): boolean {
  if (zones.has(tz)) return true;
  if (!ZONE_SHAPE.test(tz) || tz.length > 64) return false;
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

const householdFields = {
  name: lineText('The name', 120).min(1, 'Give the household a name.'),
  // An old spelling is accepted and stored under its current name (Asia/Calcutta → Asia/Kolkata).
  timezone: z.string().trim().refine(isTimeZone, 'Not a known IANA time zone (e.g. Europe/Berlin).').transform(currentZoneName),
  units: z.enum(UNIT_SYSTEMS, { error: 'Choose metric or us.' }),
  yearStartMonth: z.number({ error: 'A month number from 1 to 12.' }).int('A month number from 1 to 12.').min(1, 'A month number from 1 to 12.').max(12, 'A month number from 1 to 12.'),
  // The ISO 4217 code bought food starts with; blank or null = none yet (the first purchase with a currency sets it).
  currency: z
    .string({ error: 'Write the currency as a three-letter ISO 4217 code, like EUR, GBP or USD.' })
    .trim()
    .toUpperCase()
    .refine((c) => c === '' || isCurrencyCode(c), 'Not an ISO 4217 currency code; write three letters, like EUR, GBP or USD.')
    .transform((c) => (c === '' ? null : c))
    .nullable(),
};

/** A new household; a currency left out is guessed from the time zone (currencyForZone), null = none. */
export const householdInput = z.object({
  ...householdFields,
  units: householdFields.units.default('metric'),
  yearStartMonth: householdFields.yearStartMonth.default(1),
  currency: householdFields.currency.optional(),
});

/** Bounds of a records start month ('YYYY-MM'), as for the other dates of the app. */
export const RECORDS_SINCE_YEARS = { min: 1900, max: 2199 } as const;

/**
 * The month the household's records start, 'YYYY-MM', or null for the default rule (the earlier
 * of the month the household was created and its first entry's month; src/lib/records-start.ts).
 * Months before it are not charged any need. Example: `recordsSince.parse('2026-03')` → '2026-03'
 */
export const recordsSince = z
  .string({ error: 'Write the month the records start as YYYY-MM (for example 2026-03), or null for the default.' })
  .trim()
  .refine(isMonth, { error: 'Write the month the records start as YYYY-MM (for example 2026-03), or null for the default.', abort: true })
  .refine((m) => Number(m.slice(0, 4)) >= RECORDS_SINCE_YEARS.min && Number(m.slice(0, 4)) <= RECORDS_SINCE_YEARS.max, {
    error: `The year the records start must be between ${RECORDS_SINCE_YEARS.min} and ${RECORDS_SINCE_YEARS.max}.`,
  })
  .nullable();

/** A change to a household: only the fields sent (no defaults, which would silently reset the others). */
export const householdPatch = z
  .object({ ...householdFields, recordsSince })
  .partial()
  .refine((v) => Object.keys(v).length > 0, 'Change at least one field.');

export const roleInput = z.object({ role: z.enum(ROLE_VALUES) });

export const invitationInput = z.object({
  email: z.string({ error: 'Not an e-mail address.' }).trim().toLowerCase().max(255, atMostCharsShort(255)).pipe(z.email('Not an e-mail address.')),
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
