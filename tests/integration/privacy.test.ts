/**
 * Privacy by role (issue 12): members' e-mail addresses and people's body data (age, birth dates,
 * height, weight, pregnancy, breastfeeding) reach owners only; growers and viewers get names, roles
 * and the energy people need — from the API and from the pages.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { apiAs, BASE_URL, householdWithRoles, type RoleFixture } from '../support/users';

let t: RoleFixture;
const api = () => `/api/households/${t.household.id}`;
const BODY_FIELDS = ['ageYears', 'birthYear', 'birthMonth', 'heightCm', 'weightKg', 'pregnancyDueMonth', 'lactationFrom', 'lactationTo', 'sex', 'condition'];

async function page(cookie: string, path: string): Promise<string> {
  const r = await fetch(`${BASE_URL}${path}`, { headers: { cookie }, redirect: 'manual' });
  expect(r.status).toBe(200);
  return r.text();
}

beforeAll(async () => {
  t = await householdWithRoles({ name: 'Private plot' });
  const made = await apiAs(t.owner.cookie, 'POST', `${api()}/people`, {
    name: 'Ines', sex: 'female', ageYears: 31, heightCm: 168, weightKg: 61, pregnancyDueMonth: nextMonth(),
  });
  expect(made.status).toBe(201);
});

/** Next month, 'YYYY-MM', so the pregnancy is current. */
function nextMonth(): string {
  const d = new Date();
  const n = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1));
  return n.toISOString().slice(0, 7);
}

describe('people: body data to owners only', () => {
  it('gives the owner every field', async () => {
    const r = await apiAs(t.owner.cookie, 'GET', `${api()}/people`);
    const ines = r.body.people[0];
    expect(ines).toMatchObject({ name: 'Ines', ageYears: 31, heightCm: 168, weightKg: 61, pregnancyDueMonth: nextMonth() });
    expect(ines.energy.ageYears).toBe(31);
  });

  it.each(['grower', 'viewer'] as const)('gives a %s the name and the need, no age, size or pregnancy', async (role) => {
    const list = await apiAs(t[role].cookie, 'GET', `${api()}/people`);
    expect(list.status).toBe(200);
    const ines = list.body.people[0];
    expect(ines.name).toBe('Ines');
    expect(ines.bodyDataHidden).toBe(true);
    expect(ines.energy.kcalPerDay).toBeGreaterThan(1000);
    for (const f of BODY_FIELDS) expect(ines).not.toHaveProperty(f);
    expect(ines.energy).not.toHaveProperty('ageYears');
    expect(ines.energy).not.toHaveProperty('notes');
    const one = await apiAs(t[role].cookie, 'GET', `${api()}/people/${ines.id}`);
    expect(one.status).toBe(200);
    for (const f of BODY_FIELDS) expect(one.body.person).not.toHaveProperty(f);
    // The raw answer does not carry the numbers under any other name either.
    expect(JSON.stringify(one.body)).not.toMatch(/:168[,}]|:61[,}]/);
  });

  it('refuses growers and viewers the people export and the backup (403); harvests stay open to them', async () => {
    for (const role of ['grower', 'viewer'] as const) {
      expect((await apiAs(t[role].cookie, 'GET', `${api()}/exports/people.csv`)).status).toBe(403);
      expect((await apiAs(t[role].cookie, 'GET', `${api()}/exports/backup.json`)).status).toBe(403);
      expect((await apiAs(t[role].cookie, 'GET', `${api()}/exports/harvests.csv`)).status).toBe(200);
    }
    expect((await apiAs(t.owner.cookie, 'GET', `${api()}/exports/people.csv`)).status).toBe(200);
  });
});

describe('members: addresses to owners only', () => {
  it('lists every address to the owner', async () => {
    const r = await apiAs(t.owner.cookie, 'GET', `${api()}/members`);
    expect(r.body.members.map((m: { email: string }) => m.email).sort()).toEqual([t.owner.email, t.grower.email, t.viewer.email].sort());
  });

  it.each(['grower', 'viewer'] as const)('shows a %s names and roles, and only their own address', async (role) => {
    const r = await apiAs(t[role].cookie, 'GET', `${api()}/members`);
    expect(r.status).toBe(200);
    expect(r.body.members).toHaveLength(3);
    for (const m of r.body.members) {
      expect(m.name).toBeTruthy();
      if (m.userId === t[role].id) expect(m.email).toBe(t[role].email);
      else expect(m).not.toHaveProperty('email');
    }
    const others = [t.owner, t.grower, t.viewer].filter((u) => u.id !== t[role].id);
    expect(JSON.stringify(r.body)).not.toContain(others[0]!.email);
  });

  it('keeps other members’ addresses out of the pages a viewer opens', async () => {
    for (const path of ['', '/members', '/people', '/share']) {
      const html = await page(t.viewer.cookie, `/households/${t.household.id}${path}`);
      expect(html).not.toContain(t.owner.email);
      expect(html).not.toContain(t.grower.email);
    }
  });
});
