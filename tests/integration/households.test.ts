import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, BASE_URL, testPool } from '../support/env';
import { lastMailId, linkTo, waitForMail } from '../support/mail';
import { addMember, apiAs, createHousehold, householdWithRoles, newVerifiedUser, type RoleFixture, uniqueEmail } from '../support/users';

const pool = testPool();
afterAll(() => pool.end());

function tokenOf(link: string): string {
  return new URL(link).pathname.split('/').pop()!;
}

async function invite(owner: { cookie: string }, householdId: number, email: string, role = 'grower') {
  const before = await lastMailId();
  const r = await apiAs(owner.cookie, 'POST', `/api/households/${householdId}/invitations`, { email, role });
  expect(r.status).toBe(201);
  const mail = await waitForMail(email, { subject: /invites you/, after: before });
  return { invitation: r.body.invitation, mail, token: tokenOf(linkTo(mail, '/invite/')) };
}

describe('households', () => {
  it('creates a household with its creator as owner and lists it with the role', async () => {
    const u = await newVerifiedUser();
    const r = await apiAs(u.cookie, 'POST', '/api/households', { name: 'Quince Row', timezone: 'America/Denver', units: 'us', yearStartMonth: 10 });
    expect(r.status).toBe(201);
    expect(r.body.household).toMatchObject({ name: 'Quince Row', timezone: 'America/Denver', units: 'us', yearStartMonth: 10, role: 'owner' });
    expect(r.body.household.id).toEqual(expect.any(Number));
    const list = await apiAs(u.cookie, 'GET', '/api/households');
    expect(list.status).toBe(200);
    expect(list.body.households).toEqual([expect.objectContaining({ id: r.body.household.id, role: 'owner' })]);
  });

  it('lets one person belong to several households and switch between them', async () => {
    const u = await newVerifiedUser();
    const a = await createHousehold(u.cookie, { name: 'Apple Yard' });
    const b = await createHousehold(u.cookie, { name: 'Bean Field' });
    const list = await apiAs(u.cookie, 'GET', '/api/households');
    expect(list.body.households.map((h: { name: string }) => h.name)).toEqual(['Apple Yard', 'Bean Field']);
    // Opening a household's page remembers it; the header's switcher then names it.
    const page = await api(`/households/${b.id}`, { headers: { cookie: u.cookie } });
    expect(page.status).toBe(200);
    expect(page.headers.getSetCookie().some((c) => c.startsWith(`household=${b.id};`))).toBe(true);
    const home = await api('/households', { headers: { cookie: `${u.cookie}; household=${a.id}` } });
    expect(home.body).toMatch(/Apple Yard<\/span>\s*<span[^>]*>You are owner · current/);
  });

  it('answers bad input with 400 and the error shape, naming each field', async () => {
    const u = await newVerifiedUser();
    const r = await apiAs(u.cookie, 'POST', '/api/households', { name: '', timezone: 'Mars/Olympus_Mons', units: 'imperial', yearStartMonth: 13 });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect(r.body.error.message).toEqual(expect.any(String));
    expect(Object.keys(r.body.error.fields).sort()).toEqual(['name', 'timezone', 'units', 'yearStartMonth']);
    const notJson = await api('/api/households', { method: 'POST', headers: { cookie: u.cookie, origin: BASE_URL, 'content-type': 'application/json' }, body: '{"name":' });
    expect(notJson.status).toBe(400);
    expect(notJson.body.error.code).toBe('invalid_json');
  });

  it('changes only the fields a PATCH names', async () => {
    const u = await newVerifiedUser();
    const h = await createHousehold(u.cookie, { units: 'us', yearStartMonth: 4 });
    const r = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, { name: 'Renamed plot' });
    expect(r.status).toBe(200);
    expect(r.body.household).toMatchObject({ name: 'Renamed plot', units: 'us', yearStartMonth: 4 });
  });

  it('lets the owner set the month records start, not after the current month, and clear it back to the default', async () => {
    const u = await newVerifiedUser();
    const h = await createHousehold(u.cookie, { timezone: 'UTC' });
    expect((await apiAs(u.cookie, 'GET', `/api/households/${h.id}`)).body.household.recordsSince).toBeNull();
    const set = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, { recordsSince: '2026-03' });
    expect(set.status).toBe(200);
    expect(set.body.household.recordsSince).toBe('2026-03');
    for (const bad of ['2026-13', 'March', '1850-01', '2199-12']) {
      const r = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, { recordsSince: bad });
      expect(r.status, bad).toBe(400);
      expect(Object.keys(r.body.error.fields), bad).toContain('recordsSince');
    }
    const cleared = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, { recordsSince: null });
    expect(cleared.body.household.recordsSince).toBeNull();
  });

  it('answers a PATCH with an unknown time zone, a blank name, a bad unit or month with 400 at each field, and changes nothing', async () => {
    const u = await newVerifiedUser();
    const h = await createHousehold(u.cookie, { name: 'Steady plot', timezone: 'Europe/Berlin', units: 'metric', yearStartMonth: 1 });
    const zone = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, { timezone: 'Mars/Olympus_Mons' });
    expect(zone.status).toBe(400);
    expect(zone.body.error.code).toBe('invalid_input');
    expect(zone.body.error.fields).toEqual({ timezone: 'Not a known IANA time zone (e.g. Europe/Berlin).' });
    const several = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, { name: '   ', units: 'imperial', yearStartMonth: 0 });
    expect(several.status).toBe(400);
    expect(Object.keys(several.body.error.fields).sort()).toEqual(['name', 'units', 'yearStartMonth']);
    // A name with a line break would break the header and the CSV exports.
    const twoLines = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, { name: 'Upper\nLower' });
    expect(twoLines.status).toBe(400);
    expect(Object.keys(twoLines.body.error.fields)).toEqual(['name']);
    expect((await apiAs(u.cookie, 'GET', `/api/households/${h.id}`)).body.household).toMatchObject({ name: 'Steady plot', timezone: 'Europe/Berlin', units: 'metric', yearStartMonth: 1 });
  });

  it('answers an empty PATCH, or one naming only unknown fields, with 400 rather than a silent 200', async () => {
    const u = await newVerifiedUser();
    const h = await createHousehold(u.cookie);
    for (const body of [{}, { colour: 'green' }]) {
      const r = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(r.body.error.message).toMatch(/Change at least one field/);
    }
    const notObject = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, ['name']);
    expect(notObject.status).toBe(400);
  });

  it('accepts a zone the browser spells differently from the runtime list and saves all fields of the settings form at once', async () => {
    const u = await newVerifiedUser();
    const h = await createHousehold(u.cookie, { timezone: 'UTC' });
    // Asia/Kolkata is the current IANA name; ICU's own list says Asia/Calcutta (IANA tz database "backward" file).
    const r = await apiAs(u.cookie, 'PATCH', `/api/households/${h.id}`, { name: ' Monsoon garden ', timezone: 'Asia/Kolkata', units: 'us', yearStartMonth: 6 });
    expect(r.status).toBe(200);
    expect(r.body.household).toMatchObject({ name: 'Monsoon garden', timezone: 'Asia/Kolkata', units: 'us', yearStartMonth: 6, role: 'owner' });
  });

  it('answers 401 JSON to a signed-out caller and sends signed-out page views to sign-in', async () => {
    const r = await api('/api/households');
    expect(r.status).toBe(401);
    expect(r.body.error.code).toBe('unauthenticated');
    const page = await api('/households/5/members?tab=x');
    expect(page.status).toBe(303);
    expect(page.headers.get('location')).toBe('/sign-in?next=%2Fhouseholds%2F5%2Fmembers%3Ftab%3Dx');
  });

  it('refuses a state change sent from another site with 403', async () => {
    const u = await newVerifiedUser();
    const r = await apiAs(u.cookie, 'POST', '/api/households', { name: 'Planted by a stranger', timezone: 'UTC' }, { origin: 'https://elsewhere.example' });
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('bad_origin');
    const fetchMeta = await apiAs(u.cookie, 'POST', '/api/households', { name: 'Planted by a stranger', timezone: 'UTC' }, { origin: BASE_URL, 'sec-fetch-site': 'cross-site' });
    expect(fetchMeta.status).toBe(403);
    expect((await apiAs(u.cookie, 'GET', '/api/households')).body.households).toEqual([]);
    // better-auth refuses cross-site sign-in attempts itself.
    const signInElsewhere = await apiAs('', 'POST', '/api/auth/sign-in/email', { email: u.email, password: u.password }, { origin: 'https://elsewhere.example' });
    expect(signInElsewhere.status).toBe(403);
  });
});

describe('roles and the walls between households', () => {
  let t: RoleFixture;
  beforeAll(async () => {
    t = await householdWithRoles({ name: 'Walled Garden' });
  });

  it('gives each member the role of their invitation', async () => {
    const members = (await apiAs(t.owner.cookie, 'GET', `/api/households/${t.household.id}/members`)).body.members;
    const roles = Object.fromEntries(members.map((m: { userId: string; role: string }) => [m.userId, m.role]));
    expect(roles).toEqual({ [t.owner.id]: 'owner', [t.grower.id]: 'grower', [t.viewer.id]: 'viewer' });
    expect((await apiAs(t.viewer.cookie, 'GET', `/api/households/${t.household.id}`)).body.household.role).toBe('viewer');
  });

  it("answers a grower's change of the household's settings with 403", async () => {
    const r = await apiAs(t.grower.cookie, 'PATCH', `/api/households/${t.household.id}`, { timezone: 'America/Chicago' });
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('forbidden');
    expect((await apiAs(t.owner.cookie, 'GET', `/api/households/${t.household.id}`)).body.household.timezone).toBe(t.household.timezone);
  });

  it("answers a viewer's write with 403", async () => {
    const r = await apiAs(t.viewer.cookie, 'PATCH', `/api/households/${t.household.id}`, { name: 'Viewer was here' });
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('forbidden');
    const inv = await apiAs(t.viewer.cookie, 'POST', `/api/households/${t.household.id}/invitations`, { email: uniqueEmail(), role: 'owner' });
    expect(inv.status).toBe(403);
    const grower = await apiAs(t.grower.cookie, 'PATCH', `/api/households/${t.household.id}/members/${t.viewer.id}`, { role: 'owner' });
    expect(grower.status).toBe(403);
    expect((await apiAs(t.owner.cookie, 'GET', `/api/households/${t.household.id}`)).body.household.name).toBe('Walled Garden');
  });

  it("answers a non-member's read of another household with 404, the same as a household that does not exist", async () => {
    const theirs = await apiAs(t.outsider.cookie, 'GET', `/api/households/${t.household.id}`);
    const none = await apiAs(t.outsider.cookie, 'GET', '/api/households/999999999');
    expect(theirs.status).toBe(404);
    expect(theirs.body).toEqual(none.body);
    expect((await apiAs(t.outsider.cookie, 'GET', `/api/households/${t.household.id}/members`)).status).toBe(404);
    const page = await api(`/households/${t.household.id}`, { headers: { cookie: t.outsider.cookie } });
    expect(page.status).toBe(404);
    expect(page.body).not.toContain('Walled Garden');
  });

  it('cuts off a removed member at once', async () => {
    const h = await createHousehold(t.owner.cookie, { name: 'Short Stay' });
    const guest = await newVerifiedUser({ name: 'Guest' });
    await addMember(t.owner, h.id, guest, 'grower');
    expect((await apiAs(guest.cookie, 'GET', `/api/households/${h.id}`)).status).toBe(200);
    const rm = await apiAs(t.owner.cookie, 'DELETE', `/api/households/${h.id}/members/${guest.id}`);
    expect(rm.status).toBe(204);
    // Same session, next request: gone.
    expect((await apiAs(guest.cookie, 'GET', `/api/households/${h.id}`)).status).toBe(404);
    expect((await apiAs(guest.cookie, 'PATCH', `/api/households/${h.id}`, { name: 'x' })).status).toBe(404);
    expect((await apiAs(guest.cookie, 'GET', '/api/households')).body.households).toEqual([]);
  });

  it('lets any member leave, but not the last owner; the last owner cannot be demoted either', async () => {
    const h = await createHousehold(t.owner.cookie, { name: 'Leaving Test' });
    const v = await newVerifiedUser();
    await addMember(t.owner, h.id, v, 'viewer');
    expect((await apiAs(v.cookie, 'DELETE', `/api/households/${h.id}/members/${v.id}`)).status).toBe(204);

    const leave = await apiAs(t.owner.cookie, 'DELETE', `/api/households/${h.id}/members/${t.owner.id}`);
    expect(leave.status).toBe(409);
    expect(leave.body.error.code).toBe('last_owner');
    const demote = await apiAs(t.owner.cookie, 'PATCH', `/api/households/${h.id}/members/${t.owner.id}`, { role: 'grower' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_owner');

    // With a second owner, the first may step down and then leave.
    const co = await newVerifiedUser();
    await addMember(t.owner, h.id, co, 'owner');
    expect((await apiAs(t.owner.cookie, 'PATCH', `/api/households/${h.id}/members/${t.owner.id}`, { role: 'viewer' })).status).toBe(200);
    expect((await apiAs(t.owner.cookie, 'DELETE', `/api/households/${h.id}/members/${t.owner.id}`)).status).toBe(204);
    const left = (await apiAs(co.cookie, 'GET', `/api/households/${h.id}/members`)).body.members;
    expect(left.map((m: { userId: string; role: string }) => [m.userId, m.role])).toEqual([[co.id, 'owner']]);
  });

  it("does not let an owner remove another household's member through their own household's URL", async () => {
    const other = await householdWithRoles({ name: 'Neighbour' });
    const r = await apiAs(t.owner.cookie, 'DELETE', `/api/households/${t.household.id}/members/${other.grower.id}`);
    expect(r.status).toBe(404);
    expect((await apiAs(other.grower.cookie, 'GET', `/api/households/${other.household.id}`)).status).toBe(200);
  });
});

describe('invitations', () => {
  let t: RoleFixture;
  beforeAll(async () => {
    t = await householdWithRoles({ name: 'Invite Orchard' });
  });

  it('mails a single-use link; accepting adds the membership with the role, and the role applies', async () => {
    const newcomer = await newVerifiedUser({ name: 'Newcomer' });
    const { invitation, mail, token } = await invite(t.owner, t.household.id, newcomer.email, 'viewer');
    expect(invitation).toMatchObject({ email: newcomer.email, role: 'viewer', status: 'pending' });
    expect(mail.subject).toContain('Invite Orchard');
    expect(mail.text).toContain('Olive Owner');
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 random bytes, base64url

    // Only the hash is stored.
    const [rows] = await pool.query('SELECT token_hash FROM invitations WHERE id = ?', [invitation.id]);
    const stored = (rows as { token_hash: string }[])[0]!.token_hash;
    expect(stored).toMatch(/^[0-9a-f]{64}$/);
    expect(stored).not.toContain(token);

    const page = await api(`/invite/${token}`, { headers: { cookie: newcomer.cookie } });
    expect(page.status).toBe(200);
    expect(page.body).toContain('Invite Orchard');
    expect(page.body).toContain('Join Invite Orchard');

    const acc = await apiAs(newcomer.cookie, 'POST', '/api/invitations/accept', { token });
    expect(acc.status).toBe(200);
    expect(acc.body).toEqual({ householdId: t.household.id, role: 'viewer', alreadyMember: false });
    expect((await apiAs(newcomer.cookie, 'GET', `/api/households/${t.household.id}`)).body.household.role).toBe('viewer');
    expect((await apiAs(newcomer.cookie, 'PATCH', `/api/households/${t.household.id}`, { name: 'Mine now' })).status).toBe(403);

    // Single use: a second person with the same link is turned away.
    const late = await apiAs(t.outsider.cookie, 'POST', '/api/invitations/accept', { token });
    expect(late.status).toBe(410);
    expect(late.body.error.code).toBe('invitation_used');
    expect((await api(`/invite/${token}`)).status).toBe(410);
    expect((await apiAs(t.outsider.cookie, 'GET', `/api/households/${t.household.id}`)).status).toBe(404);
  });

  it('lets only the invited address accept, and records who did', async () => {
    const email = uniqueEmail('forwarded');
    const { invitation, token } = await invite(t.owner, t.household.id, email, 'grower');
    const other = await newVerifiedUser({ name: 'Other Address' });
    const refused = await apiAs(other.cookie, 'POST', '/api/invitations/accept', { token });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('invitation_other_address');
    expect((await apiAs(other.cookie, 'GET', `/api/households/${t.household.id}`)).status).toBe(404);

    const invited = await newVerifiedUser({ name: 'Invited Address', email });
    expect((await apiAs(invited.cookie, 'POST', '/api/invitations/accept', { token })).status).toBe(200);
    const [rows] = await pool.query('SELECT accepted_by, accepted_at FROM invitations WHERE id = ?', [invitation.id]);
    const row = (rows as { accepted_by: string; accepted_at: Date | null }[])[0]!;
    expect(row.accepted_by).toBe(invited.id);
    expect(row.accepted_at).not.toBeNull();
  });

  it('reads an invitation id like every route: 0x27, 39.0 or 039 name no invitation, and revoke nothing', async () => {
    const { invitation } = await invite(t.owner, t.household.id, uniqueEmail('hex'), 'viewer');
    const base = `/api/households/${t.household.id}/invitations`;
    for (const lax of [`0x${invitation.id.toString(16)}`, `${invitation.id}.0`, `0${invitation.id}`, `${invitation.id}e0`, `+${invitation.id}`]) {
      const r = await apiAs(t.owner.cookie, 'DELETE', `${base}/${encodeURIComponent(lax)}`);
      expect(r.status).toBe(404);
      expect(r.body.error.code).toBe('not_found');
    }
    const list = await apiAs(t.owner.cookie, 'GET', base);
    expect(list.body.invitations.map((i: { id: number }) => i.id)).toContain(invitation.id);
  });

  it('lists pending invitations to the owner only, and a withdrawn link stops working', async () => {
    const email = uniqueEmail('withdrawn');
    const { invitation, token } = await invite(t.owner, t.household.id, email, 'grower');
    const list = await apiAs(t.owner.cookie, 'GET', `/api/households/${t.household.id}/invitations`);
    expect(list.body.invitations.map((i: { id: number }) => i.id)).toContain(invitation.id);
    expect((await apiAs(t.grower.cookie, 'GET', `/api/households/${t.household.id}/invitations`)).status).toBe(403);

    expect((await apiAs(t.owner.cookie, 'DELETE', `/api/households/${t.household.id}/invitations/${invitation.id}`)).status).toBe(204);
    const after = await apiAs(t.owner.cookie, 'GET', `/api/households/${t.household.id}/invitations`);
    expect(after.body.invitations.map((i: { id: number }) => i.id)).not.toContain(invitation.id);
    const u = await newVerifiedUser();
    const r = await apiAs(u.cookie, 'POST', '/api/invitations/accept', { token });
    expect(r.status).toBe(410);
    expect(r.body.error.code).toBe('invitation_revoked');
  });

  it('refuses an expired invitation with 410', async () => {
    const { invitation, token } = await invite(t.owner, t.household.id, uniqueEmail('late'), 'viewer');
    await pool.query('UPDATE invitations SET expires_at = NOW() - INTERVAL 1 MINUTE WHERE id = ?', [invitation.id]);
    const u = await newVerifiedUser();
    const r = await apiAs(u.cookie, 'POST', '/api/invitations/accept', { token });
    expect(r.status).toBe(410);
    expect(r.body.error.code).toBe('invitation_expired');
    expect(r.body.error.message).toMatch(/expired/);
  });

  it('expires invitations after 7 days', async () => {
    const { invitation } = await invite(t.owner, t.household.id, uniqueEmail('week'), 'viewer');
    const days = (new Date(invitation.expiresAt).getTime() - new Date(invitation.createdAt).getTime()) / 86_400_000;
    expect(days).toBeCloseTo(7, 2);
  });

  it('answers an unknown token with 404 and a signed-out accept with 401', async () => {
    const u = await newVerifiedUser();
    const r = await apiAs(u.cookie, 'POST', '/api/invitations/accept', { token: 'A'.repeat(43) });
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('invitation_not_found');
    expect((await apiAs('', 'POST', '/api/invitations/accept', { token: 'A'.repeat(43) })).status).toBe(401);
    expect((await apiAs(u.cookie, 'POST', '/api/invitations/accept', {})).status).toBe(400);
    expect((await api(`/invite/${'B'.repeat(43)}`)).status).toBe(404);
  });

  it('refuses to invite someone who is already a member, and bad input with 400', async () => {
    const r = await apiAs(t.owner.cookie, 'POST', `/api/households/${t.household.id}/invitations`, { email: t.grower.email.toUpperCase(), role: 'viewer' });
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('already_member');
    const bad = await apiAs(t.owner.cookie, 'POST', `/api/households/${t.household.id}/invitations`, { email: 'not-an-address', role: 'gardener' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['email', 'role']);
  });

  it('keeps only the newest link working when the same address is invited twice', async () => {
    const email = uniqueEmail('twice');
    const first = await invite(t.owner, t.household.id, email, 'viewer');
    const second = await invite(t.owner, t.household.id, email, 'grower');
    const u = await newVerifiedUser({ email });
    expect((await apiAs(u.cookie, 'POST', '/api/invitations/accept', { token: first.token })).status).toBe(410);
    const ok = await apiAs(u.cookie, 'POST', '/api/invitations/accept', { token: second.token });
    expect(ok.body.role).toBe('grower');
  });

  it("does not let an owner withdraw another household's invitation", async () => {
    const other = await createHousehold(t.outsider.cookie, { name: 'Outsider Acre' });
    const { invitation } = await invite(t.outsider, other.id, uniqueEmail('theirs'), 'viewer');
    const r = await apiAs(t.owner.cookie, 'DELETE', `/api/households/${t.household.id}/invitations/${invitation.id}`);
    expect(r.status).toBe(404);
    const still = await apiAs(t.outsider.cookie, 'GET', `/api/households/${other.id}/invitations`);
    expect(still.body.invitations.map((i: { id: number }) => i.id)).toContain(invitation.id);
  });

  it('leads a signed-out visitor of the link to sign-up and back', async () => {
    const email = uniqueEmail('signedout');
    const { token } = await invite(t.owner, t.household.id, email, 'grower');
    const page = await api(`/invite/${token}`);
    expect(page.status).toBe(200);
    expect(page.headers.get('referrer-policy')).toBe('no-referrer');
    const next = encodeURIComponent(`/invite/${token}`);
    expect(page.body.replace(/&(amp|#38);/g, '&')).toContain(`href="/sign-up?next=${next}&email=${encodeURIComponent(email)}"`);
    expect(page.body).toContain(`href="/sign-in?next=${next}"`);
  });
});
