/**
 * The site administrator's accounts, outbox and dataset pages against the built server: disabling
 * an account ends its sessions and refuses its sign-in, a confirmation mail can be sent again, and
 * every action lands in the log with who and when.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { grantAdmin } from '@/cli/admin-grant';
import { TEST_DB_URL } from '../support/env';
import { lastMailId, waitForMail } from '../support/mail';
import { apiAs, householdWithRoles, newVerifiedUser, signIn, signUp, TEST_PASSWORD, uniqueEmail, type TestUser } from '../support/users';

let admin: TestUser;
beforeAll(async () => {
  admin = await newVerifiedUser({ name: 'Site Admin' });
  await grantAdmin(TEST_DB_URL, admin.email);
});

const actions = async () => (await apiAs(admin.cookie, 'GET', '/api/admin/actions')).body.actions as { userEmail: string; action: string; subject: string; createdAt: string }[];

describe('accounts', () => {
  it('finds an account by address, disables it (signed out, sign-in refused) and enables it again', async () => {
    const grower = await newVerifiedUser({ name: 'Disabled Later' });
    const found = await apiAs(admin.cookie, 'GET', `/api/admin/accounts?q=${encodeURIComponent(grower.email)}`);
    expect(found.body.accounts).toEqual([expect.objectContaining({ id: grower.id, email: grower.email, emailVerified: true, disabled: false })]);

    expect((await apiAs(admin.cookie, 'PATCH', `/api/admin/accounts/${grower.id}`, { disabled: true })).status).toBe(200);
    // The old session is gone: the households API now says "sign in first".
    expect((await apiAs(grower.cookie, 'GET', '/api/households')).status).toBe(401);
    const refused = await signIn(grower.email, grower.password);
    expect(refused.status).toBe(403);
    expect(refused.cookie).toBe('');
    expect((await apiAs(admin.cookie, 'GET', `/api/admin/accounts?q=${encodeURIComponent(grower.email)}`)).body.accounts[0].disabled).toBe(true);

    expect((await apiAs(admin.cookie, 'PATCH', `/api/admin/accounts/${grower.id}`, { disabled: false })).status).toBe(200);
    expect((await signIn(grower.email, grower.password)).status).toBe(200);

    const log = await actions();
    expect(log.slice(0, 2).map((a) => [a.action, a.subject, a.userEmail])).toEqual([
      ['account.enable', grower.email, admin.email],
      ['account.disable', grower.email, admin.email],
    ]);
    expect(Date.now() - new Date(log[0]!.createdAt).getTime()).toBeLessThan(60_000);
  });

  it('will not let an administrator disable their own account', async () => {
    const r = await apiAs(admin.cookie, 'PATCH', `/api/admin/accounts/${admin.id}`, { disabled: true });
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('own_account');
  });

  it('sends a new confirmation mail to an address not yet confirmed, and only then', async () => {
    const email = uniqueEmail('unconfirmed');
    const up = await signUp({ name: 'Not Yet', email, password: TEST_PASSWORD });
    await waitForMail(email, { subject: /Confirm/ });
    const after = await lastMailId();
    const r = await apiAs(admin.cookie, 'POST', `/api/admin/accounts/${up.body.user.id}/confirmation`);
    expect(r.status).toBe(202);
    const again = await waitForMail(email, { subject: /Confirm/, after });
    expect(again.links.some((l) => l.includes('/api/auth/verify-email'))).toBe(true);
    expect((await apiAs(admin.cookie, 'POST', `/api/admin/accounts/${admin.id}/confirmation`)).status).toBe(409);
    expect((await actions())[0]).toMatchObject({ action: 'account.resend_confirmation', subject: email });
  });
});

describe('datasets, usage and outbox', () => {
  it('lists both datasets, their releases, and which households use them', async () => {
    const t = await householdWithRoles({ name: 'Usage plot' });
    const hid = t.household.id;
    const potato = (await apiAs(t.owner.cookie, 'GET', '/api/foods?code=F006&dataset=ifct2017')).body.foods[0].id;
    expect((await apiAs(t.owner.cookie, 'POST', `/api/households/${hid}/crops`, { name: 'Aloo', foodId: potato, category: 'root_tuber' })).status).toBe(201);
    const r = await apiAs(admin.cookie, 'GET', '/api/admin/datasets');
    expect(r.body.datasets.map((d: { slug: string }) => d.slug)).toEqual(expect.arrayContaining(['usda-sr28', 'ifct2017']));
    expect(r.body.releases).toEqual(expect.arrayContaining([expect.objectContaining({ slug: 'ifct2017', release: 'IFCT 2017', foodCount: 542 })]));
    expect(r.body.usage).toContainEqual({ slug: 'ifct2017', householdId: hid, householdName: 'Usage plot', crops: 1, harvests: 0, purchases: 0 });
    const page = await apiAs(admin.cookie, 'GET', '/admin');
    expect(page.status).toBe(200);
    expect(page.body).toContain('Usage plot');
  });

  it('shows the outbox: the fake server in tests, letters by status', async () => {
    const r = await apiAs(admin.cookie, 'GET', '/api/admin/outbox');
    expect(r.status).toBe(200);
    expect(r.body.transport).toBe('fake');
    expect(r.body.fakeMailCount).toBeGreaterThan(0);
    expect(Object.keys(r.body.letters).sort()).toEqual(['failed', 'sending', 'sent', 'uncertain']);
  });
});
