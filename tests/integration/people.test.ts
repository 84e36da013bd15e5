/** The people API: create, read, change and remove who eats in a household; roles; validation. */
import { beforeAll, describe, expect, it } from 'vitest';
import { apiAs, createHousehold, householdWithRoles, newVerifiedUser, type RoleFixture, type TestUser } from '../support/users';

let t: RoleFixture;
let otherOwner: TestUser;
let otherId: number;
const base = () => `/api/households/${t.household.id}/people`;

beforeAll(async () => {
  t = await householdWithRoles({ name: 'People plot' });
  otherOwner = await newVerifiedUser({ name: 'Pia Other' });
  otherId = (await createHousehold(otherOwner.cookie, { name: 'Other people plot' })).id;
});

describe('people API', () => {
  it('adds a person (201) with defaults and the energy need they rest on', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', base(), { name: 'Rosa', sex: 'female', ageYears: 34, kcalPerDay: 2100, atHomePct: 80 });
    expect(r.status).toBe(201);
    expect(r.body.person).toMatchObject({ name: 'Rosa', sex: 'female', ageYears: 34, activity: 'low', condition: 'none', atHomePct: 80, birthYear: null });
    expect(r.body.person.energy).toMatchObject({ kcalPerDay: 2100, basis: 'stated', atHomeKcalPerDay: 1680 });
  });

  it('estimates the energy need by the IOM 2005 EER when none is stated', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', base(), { name: 'Tomas', sex: 'male', ageYears: 30, heightCm: 177, weightKg: 70, activity: 'very' });
    expect(r.status).toBe(201);
    // IOM 2005 EER men ≥19 y: 662 − 9.53 × 30 + 1.48 × (15.91 × 70 + 539.6 × 1.77), PA "very active" = 1.48
    const eer = 662 - 9.53 * 30 + 1.48 * (15.91 * 70 + 539.6 * 1.77);
    expect(r.body.person.energy.basis).toBe('EER');
    expect(r.body.person.energy.kcalPerDay).toBeCloseTo(eer, 6);
    expect(r.body.person.activity).toBe('very');
  });

  it('lists the household’s people for every member, viewers included', async () => {
    const r = await apiAs(t.viewer.cookie, 'GET', base());
    expect(r.status).toBe(200);
    expect(r.body.people.map((p: { name: string }) => p.name)).toEqual(['Rosa', 'Tomas']);
    expect(r.body.month).toMatch(/^\d{4}-\d{2}$/);
  });

  it('changes a person with PATCH, null clearing a field', async () => {
    const list = (await apiAs(t.owner.cookie, 'GET', base())).body.people;
    const rosa = list.find((p: { name: string }) => p.name === 'Rosa');
    const r = await apiAs(t.owner.cookie, 'PATCH', `${base()}/${rosa.id}`, { kcalPerDay: null, ageYears: null, birthYear: 1990, presentFrom: '2026-05-01' });
    expect(r.status).toBe(200);
    expect(r.body.person).toMatchObject({ kcalPerDay: null, ageYears: null, birthYear: 1990, presentFrom: '2026-05-01', atHomePct: 80 });
    expect(r.body.person.energy.basis).toBe('EER');
    const again = await apiAs(t.owner.cookie, 'GET', `${base()}/${rosa.id}`);
    expect(again.body.person.birthYear).toBe(1990);
  });

  it('checks the person after the patch: age and birth year together, or a presence ending before it starts, are 400', async () => {
    const rosa = (await apiAs(t.owner.cookie, 'GET', base())).body.people.find((p: { name: string }) => p.name === 'Rosa');
    const both = await apiAs(t.owner.cookie, 'PATCH', `${base()}/${rosa.id}`, { ageYears: 36 });
    expect(both.status).toBe(400);
    expect(both.body.error.fields).toHaveProperty('birthYear');
    const dates = await apiAs(t.owner.cookie, 'PATCH', `${base()}/${rosa.id}`, { presentTo: '2026-04-01' });
    expect(dates.status).toBe(400);
    expect(dates.body.error.fields).toHaveProperty('presentTo');
    expect((await apiAs(t.owner.cookie, 'PATCH', `${base()}/${rosa.id}`, {})).status).toBe(400);
  });

  it('answers 400 with the fields for bad input, and 415 for a body that is not JSON', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', base(), { name: '', sex: 'other', ageYears: -3, atHomePct: 150 });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect(Object.keys(r.body.error.fields)).toEqual(expect.arrayContaining(['name', 'sex', 'ageYears', 'atHomePct']));
    const none = await apiAs(t.owner.cookie, 'POST', base(), { name: 'Nobody', sex: 'female' });
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toHaveProperty('ageYears');
    const text = await apiAs(t.owner.cookie, 'POST', base(), undefined, { 'content-type': 'text/plain' });
    expect(text.status).toBe(415);
  });

  it('lets only owners change people: the body data is theirs to keep', async () => {
    const rosa = (await apiAs(t.owner.cookie, 'GET', base())).body.people.find((p: { name: string }) => p.name === 'Rosa');
    expect((await apiAs(t.grower.cookie, 'POST', base(), { name: 'G', sex: 'male', ageYears: 9 })).status).toBe(403);
    expect((await apiAs(t.grower.cookie, 'PATCH', `${base()}/${rosa.id}`, { atHomePct: 10 })).status).toBe(403);
    expect((await apiAs(t.grower.cookie, 'DELETE', `${base()}/${rosa.id}`)).status).toBe(403);
    expect((await apiAs(t.viewer.cookie, 'POST', base(), { name: 'V', sex: 'male', ageYears: 9 })).status).toBe(403);
    expect((await apiAs(t.viewer.cookie, 'PATCH', `${base()}/${rosa.id}`, { atHomePct: 10 })).status).toBe(403);
    expect((await apiAs(t.viewer.cookie, 'DELETE', `${base()}/${rosa.id}`)).status).toBe(403);
  });

  it('hides the household from non-members (404) and asks the signed-out to sign in (401)', async () => {
    expect((await apiAs(t.outsider.cookie, 'GET', base())).status).toBe(404);
    expect((await apiAs(t.outsider.cookie, 'POST', base(), { name: 'X', sex: 'male', ageYears: 9 })).status).toBe(404);
    expect((await apiAs('', 'GET', base())).status).toBe(401);
  });

  it('answers 404 for a person of another household, even to its own household’s owner through this one', async () => {
    const mine = await apiAs(otherOwner.cookie, 'POST', `/api/households/${otherId}/people`, { name: 'Elsewhere', sex: 'male', ageYears: 50 });
    expect(mine.status).toBe(201);
    const id = mine.body.person.id;
    expect((await apiAs(t.owner.cookie, 'GET', `${base()}/${id}`)).status).toBe(404);
    expect((await apiAs(t.owner.cookie, 'PATCH', `${base()}/${id}`, { atHomePct: 10 })).status).toBe(404);
    expect((await apiAs(t.owner.cookie, 'DELETE', `${base()}/${id}`)).status).toBe(404);
    expect((await apiAs(otherOwner.cookie, 'GET', `/api/households/${otherId}/people/${id}`)).body.person.atHomePct).toBe(100);
    expect((await apiAs(t.owner.cookie, 'GET', `${base()}/abc`)).status).toBe(404);
  });

  it('removes a person (204), after which they are gone', async () => {
    const tomas = (await apiAs(t.owner.cookie, 'GET', base())).body.people.find((p: { name: string }) => p.name === 'Tomas');
    expect((await apiAs(t.owner.cookie, 'DELETE', `${base()}/${tomas.id}`)).status).toBe(204);
    expect((await apiAs(t.owner.cookie, 'GET', `${base()}/${tomas.id}`)).status).toBe(404);
    expect((await apiAs(t.owner.cookie, 'DELETE', `${base()}/${tomas.id}`)).status).toBe(404);
  });
});

describe('people API: dated people, babies and diet (issue 9)', () => {
  let hid: number;
  const at = () => `/api/households/${hid}/people`;
  // The month n months from now, 'YYYY-MM' (UTC: a household in another zone may be a month off at a
  // month's edge, which none of the checks below depend on).
  const monthFromNow = (n: number) => {
    const d = new Date();
    const m = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + n, 1));
    return m.toISOString().slice(0, 7);
  };

  beforeAll(async () => {
    hid = (await createHousehold(t.owner.cookie, { name: 'Dated people plot' })).id;
  });

  it('stores a baby by birth month; under 6 months and not fed from the household, they count no energy', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', at(), { name: 'Mo', sex: 'male', birthMonth: monthFromNow(-2) });
    expect(r.status).toBe(201);
    expect(r.body.person).toMatchObject({ birthMonth: monthFromNow(-2), ageYears: null, birthYear: null, fedFromHousehold: false, diet: 'omnivore' });
    expect(r.body.person.energy.atHomeKcalPerDay).toBe(0);
    const fed = await apiAs(t.owner.cookie, 'PATCH', `${at()}/${r.body.person.id}`, { fedFromHousehold: true });
    expect(fed.status).toBe(200);
    expect(fed.body.person.fedFromHousehold).toBe(true);
    expect(fed.body.person.energy.atHomeKcalPerDay).toBeGreaterThan(0);
  });

  it('stores a dated pregnancy and breastfeeding, and the energy follows the trimester of this month', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', at(), { name: 'Ida', sex: 'female', ageYears: 31, heightCm: 165, weightKg: 60, diet: 'vegetarian' });
    expect(r.status).toBe(201);
    const before = r.body.person.energy.kcalPerDay;
    const due = monthFromNow(1);
    const p = await apiAs(t.owner.cookie, 'PATCH', `${at()}/${r.body.person.id}`, { pregnancyDueMonth: due, lactationFrom: due, lactationTo: monthFromNow(10) });
    expect(p.status).toBe(200);
    expect(p.body.person).toMatchObject({ pregnancyDueMonth: due, lactationFrom: due, lactationTo: monthFromNow(10), diet: 'vegetarian', condition: 'none' });
    // IOM 2005 EER, pregnancy: + 452 kcal/day in the third trimester (the due month and the two before it)
    expect(p.body.person.energy.kcalPerDay - before).toBeCloseTo(452, 6);
    const again = await apiAs(t.owner.cookie, 'GET', `${at()}/${r.body.person.id}`);
    expect(again.body.person.lactationTo).toBe(monthFromNow(10));
  });

  it('refuses two ages, pregnancy for a male person, breastfeeding ending before it begins and unknown diets (400 with the fields)', async () => {
    const two = await apiAs(t.owner.cookie, 'POST', at(), { name: 'X', sex: 'male', birthMonth: '2020-05', ageYears: 6 });
    expect(two.status).toBe(400);
    expect(two.body.error.fields).toHaveProperty('birthMonth');
    const male = await apiAs(t.owner.cookie, 'POST', at(), { name: 'X', sex: 'male', ageYears: 30, pregnancyDueMonth: '2027-01' });
    expect(male.status).toBe(400);
    expect(male.body.error.fields).toHaveProperty('pregnancyDueMonth');
    const order = await apiAs(t.owner.cookie, 'POST', at(), { name: 'X', sex: 'female', ageYears: 30, lactationFrom: '2027-05', lactationTo: '2027-01' });
    expect(order.status).toBe(400);
    expect(order.body.error.fields).toHaveProperty('lactationTo');
    const bad = await apiAs(t.owner.cookie, 'POST', at(), { name: 'X', sex: 'female', diet: 'vegan', birthMonth: '2027-13' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['diet', 'birthMonth']));
    const names = (await apiAs(t.owner.cookie, 'GET', at())).body.people.map((p: { name: string }) => p.name);
    expect(names).toEqual(['Ida', 'Mo']);
  });

  it('checks a patch against the stored person: a birth month beside the age, or the condition flag beside dated months, is 400', async () => {
    const ida = (await apiAs(t.owner.cookie, 'GET', at())).body.people.find((p: { name: string }) => p.name === 'Ida');
    const age = await apiAs(t.owner.cookie, 'PATCH', `${at()}/${ida.id}`, { birthMonth: '1995-04' });
    expect(age.status).toBe(400);
    expect(age.body.error.fields).toHaveProperty('birthMonth');
    const flag = await apiAs(t.owner.cookie, 'PATCH', `${at()}/${ida.id}`, { condition: 'pregnancy' });
    expect(flag.status).toBe(400);
    expect(flag.body.error.fields).toHaveProperty('condition');
    const ok = await apiAs(t.owner.cookie, 'PATCH', `${at()}/${ida.id}`, { ageYears: null, birthMonth: '1995-04', pregnancyDueMonth: null, lactationFrom: null, lactationTo: null });
    expect(ok.status).toBe(200);
    expect(ok.body.person).toMatchObject({ ageYears: null, birthMonth: '1995-04', pregnancyDueMonth: null, lactationFrom: null, lactationTo: null });
  });
});
