/** The people form: what is typed in the household’s units becomes the people API’s metric body, checked by its schema. */
import { describe, expect, it } from 'vitest';
import { personInput } from '@/lib/people-schemas';
import { draftAgeYears, draftOf, personBody, personResolver } from '@/components/people/person-form-values';

const draft = (over: Partial<ReturnType<typeof draftOf>> = {}) => ({ ...draftOf(undefined, 'us'), name: 'Sam', ageYears: '40', ...over });
const resolve = (d: ReturnType<typeof draftOf>, units: 'us' | 'metric') => personResolver(d, { units, month: '2026-12' }, { fields: {}, shouldUseNativeValidation: false } as never);

describe('the people form in the household’s units', () => {
  it('sends feet, inches and pounds as centimetres and kilograms', () => {
    const body = personBody(draft({ heightFt: '5', heightIn: '10', weightLb: '180' }), 'us');
    expect(body.heightCm).toBe(177.8); // 70 in × 2.54 cm (International Yard and Pound Agreement, 1959)
    expect(body.weightKg).toBe(81.65); // 180 lb × 0.45359237 kg (International Yard and Pound Agreement, 1959)
  });

  it('opens a stored person in feet, inches and pounds', () => {
    const stored = personInput.parse({ name: 'Sam', sex: 'male', ageYears: 40, heightCm: 177.8, weightKg: 81.65 });
    const d = draftOf(stored, 'us');
    expect([d.heightFt, d.heightIn, d.weightLb]).toEqual(['5', '10', '180']);
  });

  it('puts a height out of range beside the feet box, in feet and inches', async () => {
    const r = await resolve(draft({ heightFt: '9', heightIn: '' }), 'us');
    expect(r.errors.heightFt?.message).toBe('Enter the height in feet and inches, between 0 ft 11.8 in and 8 ft 2.4 in.');
    expect(r.errors.heightCm).toBeUndefined();
  });

  it('sends dated months instead of the condition flag, and asks for the due month once pregnant is ticked', async () => {
    const r = await resolve(draft({ pregnant: true }), 'metric');
    expect(r.errors.pregnancyDueMonth?.message).toMatch(/^Give the month the baby is due/);
    const body = personBody(draft({ pregnant: true, pregnancyDueMonth: '2027-02' }), 'metric');
    expect(body).toMatchObject({ condition: 'none', pregnancyDueMonth: '2027-02', lactationFrom: null });
    expect(personBody(draft({ sex: 'male', pregnant: true, pregnancyDueMonth: '2027-02' }), 'metric').pregnancyDueMonth).toBeNull();
  });

  it('counts a baby’s age from the birth month in months, and an adult’s from the birth year', () => {
    expect(draftAgeYears(draft({ ageKind: 'birthMonth', birthMonth: '2026-09' }), '2026-12')).toBe(0.25);
    expect(draftAgeYears(draft({ ageKind: 'birthYear', birthYear: '1990' }), '2026-12')).toBe(36);
    expect(draftAgeYears(draft({ ageKind: 'birthYear', birthYear: 'x' }), '2026-12')).toBeNull();
  });
});
