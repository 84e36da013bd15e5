/**
 * The household's currency: the ISO 4217 code new bought food starts with. A short list of common
 * codes for the picker (any code the runtime knows can be typed), and a first guess from the time
 * zone for a new household, which the owner can change.
 */

/** Codes offered first in the pickers. Example: `COMMON_CURRENCIES[0]` → 'EUR' */
export const COMMON_CURRENCIES = ['EUR', 'GBP', 'USD', 'CAD', 'AUD', 'NZD', 'CHF', 'SEK', 'NOK', 'DKK', 'PLN', 'CZK', 'HUF', 'INR', 'JPY', 'ZAR'] as const;

// The runtime's ISO 4217 list (ICU), read once; empty on a runtime without Intl.supportedValuesOf.
let known: Set<string> | null = null;
function knownCurrencies(): Set<string> {
  if (!known) {
    const list = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('currency') : [];
    known = new Set([...list, ...COMMON_CURRENCIES]);
  }
  return known;
}

/** True for an ISO 4217 code the runtime knows. Example: `isCurrencyCode('GBP')` → true; `isCurrencyCode('ABC')` → false */
export function isCurrencyCode(code: string): boolean {
  return /^[A-Z]{3}$/.test(code) && knownCurrencies().has(code);
}

// from memory: ISO 4217 and the IANA tz database — the zones of the euro area, the UK, the United
// States and a few other single-currency countries; any other zone gets no guess.
const EURO_ZONES = [
  'Europe/Amsterdam', 'Europe/Andorra', 'Europe/Athens', 'Europe/Berlin', 'Europe/Bratislava', 'Europe/Brussels', 'Europe/Busingen',
  'Europe/Dublin', 'Europe/Helsinki', 'Europe/Lisbon', 'Europe/Ljubljana', 'Europe/Luxembourg', 'Europe/Madrid', 'Europe/Malta',
  'Europe/Mariehamn', 'Europe/Monaco', 'Europe/Paris', 'Europe/Podgorica', 'Europe/Riga', 'Europe/Rome', 'Europe/San_Marino',
  'Europe/Tallinn', 'Europe/Vatican', 'Europe/Vienna', 'Europe/Vilnius', 'Europe/Zagreb', 'Europe/Nicosia', 'Asia/Nicosia',
  'Atlantic/Azores', 'Atlantic/Madeira', 'Atlantic/Canary', 'Africa/Ceuta',
];
const ZONE_CURRENCY: Readonly<Record<string, string>> = {
  ...Object.fromEntries(EURO_ZONES.map((z) => [z, 'EUR'])),
  'Europe/London': 'GBP', 'Europe/Belfast': 'GBP', 'Europe/Guernsey': 'GBP', 'Europe/Jersey': 'GBP', 'Europe/Isle_of_Man': 'GBP',
  'Europe/Zurich': 'CHF', 'Europe/Vaduz': 'CHF', 'Europe/Stockholm': 'SEK', 'Europe/Oslo': 'NOK', 'Europe/Copenhagen': 'DKK',
  'Europe/Warsaw': 'PLN', 'Europe/Prague': 'CZK', 'Europe/Budapest': 'HUF',
  'America/Toronto': 'CAD', 'America/Vancouver': 'CAD', 'America/Edmonton': 'CAD', 'America/Winnipeg': 'CAD', 'America/Halifax': 'CAD',
  'America/St_Johns': 'CAD', 'America/Regina': 'CAD', 'America/Moncton': 'CAD', 'America/Whitehorse': 'CAD',
  'Pacific/Auckland': 'NZD', 'Asia/Kolkata': 'INR', 'Asia/Calcutta': 'INR', 'Asia/Tokyo': 'JPY', 'Africa/Johannesburg': 'ZAR',
};
// US zones: America/ and Pacific/Honolulu names of the fifty states and Puerto Rico.
const US_ZONE = /^America\/(New_York|Chicago|Denver|Los_Angeles|Phoenix|Anchorage|Adak|Boise|Detroit|Juneau|Sitka|Metlakatla|Yakutat|Nome|Menominee|Puerto_Rico|Indiana\/.+|Kentucky\/.+|North_Dakota\/.+)$|^Pacific\/Honolulu$|^US\//;

/**
 * A first guess at a household's currency from its time zone, or null when the zone says too
 * little (from memory, so the owner can change it). Example: `currencyForZone('Europe/London')` → 'GBP';
 * `currencyForZone('America/New_York')` → 'USD'; `currencyForZone('Asia/Dubai')` → null
 */
export function currencyForZone(timeZone: string): string | null {
  if (US_ZONE.test(timeZone)) return 'USD';
  if (timeZone.startsWith('Australia/')) return 'AUD';
  return ZONE_CURRENCY[timeZone] ?? null;
}

/**
 * The currencies to offer, the household's own first, then those it has used, then the common
 * list, each once: a currency never used is not offered ahead of the household's own.
 * Example: `currencyChoices('GBP', ['EUR'])` → ['GBP', 'EUR', 'USD', 'CAD', …]
 */
export function currencyChoices(own: string | null | undefined, used: readonly string[] = []): string[] {
  return [...new Set([...(own ? [own] : []), ...used, ...COMMON_CURRENCIES])];
}
