import { describe, expect, it } from 'vitest';
import { COMMON_CURRENCIES, currencyChoices, currencyForZone, isCurrencyCode } from '@/lib/currency';
import { householdInput, householdPatch } from '@/lib/household-schemas';

describe('the household currency', () => {
  it('guesses from the time zone where one currency is used', () => {
    // from memory: ISO 4217 and the IANA tz database
    expect(currencyForZone('Europe/London')).toBe('GBP');
    expect(currencyForZone('Europe/Berlin')).toBe('EUR');
    expect(currencyForZone('Europe/Dublin')).toBe('EUR');
    expect(currencyForZone('America/New_York')).toBe('USD');
    expect(currencyForZone('America/Indiana/Indianapolis')).toBe('USD');
    expect(currencyForZone('Pacific/Honolulu')).toBe('USD');
    expect(currencyForZone('Australia/Hobart')).toBe('AUD');
    expect(currencyForZone('America/Toronto')).toBe('CAD');
  });

  it('makes no guess for a zone that says too little', () => {
    expect(currencyForZone('UTC')).toBeNull();
    expect(currencyForZone('Asia/Dubai')).toBeNull();
    expect(currencyForZone('America/Mexico_City')).toBeNull();
  });

  it('knows ISO 4217 codes and refuses made-up ones', () => {
    for (const c of COMMON_CURRENCIES) expect(isCurrencyCode(c)).toBe(true);
    expect(isCurrencyCode('ABC')).toBe(false);
    expect(isCurrencyCode('eur')).toBe(false);
  });

  it("offers the household's own currency first, then those used, never an unused one ahead of it", () => {
    const choices = currencyChoices('GBP', ['EUR']);
    expect(choices.slice(0, 2)).toEqual(['GBP', 'EUR']);
    expect(choices.filter((c) => c === 'GBP')).toHaveLength(1);
    expect(currencyChoices(null)[0]).toBe('EUR');
  });

  it('takes a currency in the household schemas: upper-cased, blank as none, unknown refused', () => {
    expect(householdPatch.parse({ currency: 'gbp' })).toEqual({ currency: 'GBP' });
    expect(householdPatch.parse({ currency: '' })).toEqual({ currency: null });
    expect(householdPatch.parse({ currency: null })).toEqual({ currency: null });
    expect(householdPatch.safeParse({ currency: 'XYZ' }).error?.issues[0]?.message).toBe('Not an ISO 4217 currency code; write three letters, like EUR, GBP or USD.');
    expect(householdInput.parse({ name: 'Plot', timezone: 'Europe/London' }).currency).toBeUndefined();
  });
});
