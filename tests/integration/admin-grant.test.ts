import { afterAll, describe, expect, it } from 'vitest';
import { grantAdmin } from '@/cli/admin-grant';
import { TEST_DB_URL, testPool } from '../support/env';
import { newVerifiedUser } from '../support/users';

const pool = testPool();
afterAll(() => pool.end());

async function isAdmin(userId: string): Promise<boolean> {
  const [rows] = await pool.query('SELECT 1 FROM site_admins WHERE user_id = ?', [userId]);
  return (rows as unknown[]).length === 1;
}

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
