import { afterAll, describe, expect, it } from 'vitest';
import { grantAdmin } from '@/cli/admin-grant';
import { DEMO_EMAIL, DEMO_HOUSEHOLD, DEMO_PASSWORD, seedDemo } from '@/cli/seed-demo';
import { TEST_DB_URL, testPool } from '../support/env';
import { apiAs, newVerifiedUser, signIn } from '../support/users';

const pool = testPool();
afterAll(() => pool.end());

async function isAdmin(userId: string): Promise<boolean> {
  const [rows] = await pool.query('SELECT 1 FROM site_admins WHERE user_id = ?', [userId]);
  return (rows as unknown[]).length === 1;
}

describe('demo seed (npm start)', () => {
  it('creates a confirmed demo owner, site admin, with an invented household — once', async () => {
    await pool.query('DELETE FROM user WHERE email = ?', [DEMO_EMAIL]);
    const quiet = () => {};
    const first = await seedDemo(TEST_DB_URL, quiet);
    expect(first.created).toBe(true);
    expect((await seedDemo(TEST_DB_URL, quiet)).created).toBe(false);

    const s = await signIn(DEMO_EMAIL, DEMO_PASSWORD);
    expect(s.status).toBe(200);
    expect(s.body.user.emailVerified).toBe(true);
    expect(await isAdmin(s.body.user.id)).toBe(true);
    const list = await apiAs(s.cookie, 'GET', '/api/households');
    expect(list.body.households).toEqual([expect.objectContaining({ id: first.householdId, name: DEMO_HOUSEHOLD.name, role: 'owner', timezone: 'Europe/London' })]);
  });
});

describe('npm run admin:grant <email>', () => {
  it('makes an existing account a site administrator, and says so only the first time', async () => {
    const u = await newVerifiedUser({ name: 'Future Admin' });
    expect(await isAdmin(u.id)).toBe(false);
    expect(await grantAdmin(TEST_DB_URL, u.email.toUpperCase())).toBe(true);
    expect(await isAdmin(u.id)).toBe(true);
    expect(await grantAdmin(TEST_DB_URL, u.email)).toBe(false);
  });

  it('refuses an address without an account', async () => {
    await expect(grantAdmin(TEST_DB_URL, 'nobody-here@test.selfsown.invalid')).rejects.toThrow(/no account has the e-mail/);
  });
});
