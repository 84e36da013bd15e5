import { describe, expect, it } from 'vitest';
import { mergePerson, needsPerson, personInput, personPatch } from '@/lib/people-schemas';

const fieldsOf = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join('.') || '_', i.message]));

describe('personInput', () => {
  it('fills the defaults: low activity, no condition, all meals at home', () => {
    const p = personInput.parse({ name: '  Ada ', sex: 'female', ageYears: 34 });
    expect(p).toMatchObject({ name: 'Ada', activity: 'low', condition: 'none', atHomePct: 100, birthYear: null, kcalPerDay: null, presentFrom: null });
  });

  it('treats blank form fields as not given', () => {
    const p = personInput.parse({ name: 'Bo', sex: 'male', birthYear: 1990, ageYears: '', heightCm: '', presentTo: '', activity: '' });
    expect(p.ageYears).toBeNull();
    expect(p.heightCm).toBeNull();
    expect(p.presentTo).toBeNull();
    expect(p.activity).toBe('low');
  });

  it('needs an age or a birth year, but not both', () => {
    expect(fieldsOf(personInput.safeParse({ name: 'A', sex: 'female' }))).toHaveProperty('ageYears');
    expect(fieldsOf(personInput.safeParse({ name: 'A', sex: 'female', ageYears: 30, birthYear: 1996 }))).toHaveProperty('birthYear');
  });

  it('accepts an infant age in fractions of a year', () => {
    expect(personInput.parse({ name: 'Baby', sex: 'male', ageYears: 0.5 }).ageYears).toBe(0.5);
  });

  it('refuses negative ages, a share of meals over 100 % and unknown activity levels', () => {
    const f = fieldsOf(personInput.safeParse({ name: 'A', sex: 'female', ageYears: -1, atHomePct: 120, activity: 'athlete' }));
    expect(Object.keys(f).sort()).toEqual(['activity', 'ageYears', 'atHomePct']);
  });

  it('refuses a stated energy need outside 300–10,000 kcal a day', () => {
    expect(fieldsOf(personInput.safeParse({ name: 'A', sex: 'female', ageYears: 30, kcalPerDay: 50 }))).toHaveProperty('kcalPerDay');
    expect(personInput.parse({ name: 'A', sex: 'female', ageYears: 30, kcalPerDay: 2100 }).kcalPerDay).toBe(2100);
  });

  it('refuses a presence that ends before it starts, and impossible dates', () => {
    expect(fieldsOf(personInput.safeParse({ name: 'A', sex: 'male', ageYears: 20, presentFrom: '2026-09-01', presentTo: '2026-06-01' }))).toHaveProperty('presentTo');
    expect(fieldsOf(personInput.safeParse({ name: 'A', sex: 'male', ageYears: 20, presentFrom: '2026-02-30' }))).toHaveProperty('presentFrom');
    expect(personInput.safeParse({ name: 'A', sex: 'male', ageYears: 20, presentFrom: '2026-06-01', presentTo: '2026-06-01' }).success).toBe(true);
  });

  it('allows pregnancy and lactation for a female person only', () => {
    expect(personInput.safeParse({ name: 'A', sex: 'female', ageYears: 28, condition: 'pregnancy' }).success).toBe(true);
    expect(fieldsOf(personInput.safeParse({ name: 'A', sex: 'male', ageYears: 28, condition: 'lactation' }))).toHaveProperty('condition');
  });

  it('takes a birth month instead of an age, alone: with an age or a birth year it is refused', () => {
    const baby = personInput.parse({ name: 'Mo', sex: 'male', birthMonth: '2026-09' });
    expect(baby).toMatchObject({ birthMonth: '2026-09', ageYears: null, birthYear: null, fedFromHousehold: false, diet: 'omnivore' });
    expect(fieldsOf(personInput.safeParse({ name: 'Mo', sex: 'male', birthMonth: '2026-09', ageYears: 0.2 }))).toHaveProperty('birthMonth');
    expect(fieldsOf(personInput.safeParse({ name: 'Mo', sex: 'male', birthMonth: '2026-09', birthYear: 2026 }))).toHaveProperty('birthMonth');
    expect(fieldsOf(personInput.safeParse({ name: 'Mo', sex: 'male', birthMonth: '2026-13' }))).toHaveProperty('birthMonth');
    expect(fieldsOf(personInput.safeParse({ name: 'Mo', sex: 'male', birthMonth: '2026-09-01' }))).toHaveProperty('birthMonth');
    expect(fieldsOf(personInput.safeParse({ name: 'Mo', sex: 'male', birthMonth: '1850-01' }))).toHaveProperty('birthMonth');
  });

  it('dates a pregnancy and breastfeeding by month, for a female person only', () => {
    const p = personInput.parse({ name: 'Ida', sex: 'female', ageYears: 31, pregnancyDueMonth: '2027-03', lactationFrom: '2027-03', lactationTo: '2027-12' });
    expect(p).toMatchObject({ pregnancyDueMonth: '2027-03', lactationFrom: '2027-03', lactationTo: '2027-12', condition: 'none' });
    const man = fieldsOf(personInput.safeParse({ name: 'Al', sex: 'male', ageYears: 31, pregnancyDueMonth: '2027-03', lactationFrom: '2027-03' }));
    expect(Object.keys(man).sort()).toEqual(['lactationFrom', 'pregnancyDueMonth']);
  });

  it('refuses breastfeeding that ends before it begins, or an end without a start', () => {
    expect(fieldsOf(personInput.safeParse({ name: 'Ida', sex: 'female', ageYears: 31, lactationFrom: '2027-05', lactationTo: '2027-02' }))).toHaveProperty('lactationTo');
    expect(fieldsOf(personInput.safeParse({ name: 'Ida', sex: 'female', ageYears: 31, lactationTo: '2027-02' }))).toHaveProperty('lactationFrom');
    expect(personInput.safeParse({ name: 'Ida', sex: 'female', ageYears: 31, lactationFrom: '2027-05', lactationTo: '2027-05' }).success).toBe(true);
  });

  it('refuses the undated condition flag beside dated months, so neither is silently unused', () => {
    expect(fieldsOf(personInput.safeParse({ name: 'Ida', sex: 'female', ageYears: 31, condition: 'pregnancy', pregnancyDueMonth: '2027-03' }))).toHaveProperty('condition');
  });

  it('keeps fedFromHousehold as given at any age (it counts only under 6 months) and takes a vegetarian diet', () => {
    expect(personInput.parse({ name: 'Mo', sex: 'male', ageYears: 40, fedFromHousehold: true }).fedFromHousehold).toBe(true);
    expect(personInput.parse({ name: 'Vi', sex: 'female', ageYears: 40, diet: 'vegetarian' }).diet).toBe('vegetarian');
    const f = fieldsOf(personInput.safeParse({ name: 'Vi', sex: 'female', ageYears: 40, diet: 'vegan', fedFromHousehold: 'yes' }));
    expect(Object.keys(f).sort()).toEqual(['diet', 'fedFromHousehold']);
  });

  it('refuses fields it does not know, so a misspelt one is not silently dropped', () => {
    expect(personInput.safeParse({ name: 'A', sex: 'female', ageYears: 30, atHomePercent: 50 }).success).toBe(false);
  });
});

describe('personPatch and mergePerson', () => {
  const stored = personInput.parse({ name: 'Ada', sex: 'female', ageYears: 34, heightCm: 165 });

  it('keeps fields a patch leaves out and clears those set to null', () => {
    const patch = personPatch.parse({ heightCm: null, atHomePct: 50 });
    const merged = personInput.parse(mergePerson(stored, patch));
    expect(merged).toMatchObject({ name: 'Ada', ageYears: 34, heightCm: null, atHomePct: 50 });
  });

  it('lets a patch switch from age to birth year', () => {
    const merged = personInput.parse(mergePerson(stored, personPatch.parse({ ageYears: null, birthYear: 1992 })));
    expect(merged.ageYears).toBeNull();
    expect(merged.birthYear).toBe(1992);
  });

  it('checks the merged person, so a patch cannot leave both age and birth year', () => {
    expect(personInput.safeParse(mergePerson(stored, personPatch.parse({ birthYear: 1992 }))).success).toBe(false);
  });

  it('lets a patch switch from age to birth month and set the new fields', () => {
    const merged = personInput.parse(mergePerson(stored, personPatch.parse({ ageYears: null, birthMonth: '1992-04', diet: 'vegetarian', lactationFrom: '2026-10' })));
    expect(merged).toMatchObject({ ageYears: null, birthMonth: '1992-04', diet: 'vegetarian', lactationFrom: '2026-10', lactationTo: null });
    expect(personPatch.safeParse({ diet: 'carnivore' }).success).toBe(false);
    expect(personPatch.safeParse({ fedFromHousehold: 'no' }).success).toBe(false);
  });

  it('refuses an empty patch', () => {
    expect(personPatch.safeParse({}).success).toBe(false);
  });
});

describe('needsPerson', () => {
  it('maps "very" to the IOM very-active category and "none" to no condition', () => {
    const p = needsPerson(personInput.parse({ name: 'A', sex: 'male', ageYears: 40, activity: 'very' }));
    expect(p.activity).toBe('very_active');
    expect(p.condition).toBeNull();
  });

  it('passes the dated months, the feeding of a baby and the diet to the needs model', () => {
    const baby = needsPerson(personInput.parse({ name: 'Mo', sex: 'male', birthMonth: '2026-09', fedFromHousehold: true }));
    expect(baby).toMatchObject({ birthMonth: '2026-09', ageYears: null, fedFromHousehold: true, diet: 'omnivore' });
    const mum = needsPerson(personInput.parse({ name: 'Ida', sex: 'female', ageYears: 31, pregnancyDueMonth: '2027-03', lactationFrom: '2027-03', lactationTo: '2027-12', diet: 'vegetarian' }));
    expect(mum).toMatchObject({ pregnancyDueMonth: '2027-03', lactationFrom: '2027-03', lactationTo: '2027-12', diet: 'vegetarian', condition: null });
  });
});

describe('pregnancy and breastfeeding before 14 years', () => {
  // DRI tables (National Academies): pregnancy and lactation rows are given for 14–18 y and 19–50 y only
  it('refuses a due month before the person is 14, and takes one from 14 on', () => {
    const girl = { name: 'Mia', sex: 'female', birthMonth: '2015-04' } as const;
    const early = personInput.safeParse({ ...girl, pregnancyDueMonth: '2027-01' }); // 11 y 9 m
    expect(early.success).toBe(false);
    expect(early.error!.issues.map((i) => i.path.join('.'))).toContain('pregnancyDueMonth');
    expect(personInput.safeParse({ ...girl, pregnancyDueMonth: '2029-04' }).success).toBe(true); // exactly 14 y
  });

  it('refuses breastfeeding from a birth year under 14, and the undated flag for a stated age under 14', () => {
    expect(personInput.safeParse({ name: 'Ana', sex: 'female', birthYear: 2016, lactationFrom: '2026-05' }).success).toBe(false); // 10 y
    expect(personInput.safeParse({ name: 'Ana', sex: 'female', ageYears: 12, condition: 'pregnancy' }).success).toBe(false);
    expect(personInput.safeParse({ name: 'Ana', sex: 'female', ageYears: 16, condition: 'pregnancy' }).success).toBe(true);
  });
});
