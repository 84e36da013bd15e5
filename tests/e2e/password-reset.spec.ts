/**
 * Forgotten password, from the forms: ask for a link, follow it from the local outbox, choose a new
 * password (the two boxes must agree), and sign in with it to the page asked for.
 */
import { expect, test } from './fixtures';
import { newVerifiedUser } from '../support/users';

const NEW_PASSWORD = 'parsnip-winter-store-9';

test('someone who forgot the password sets a new one from the mailed link and signs in with it', async ({ page }) => {
  const user = await newVerifiedUser({ name: 'Reset Person' });

  await page.goto('/forgot-password');
  await page.getByLabel('E-mail of your account').fill(user.email);
  await page.getByRole('button', { name: 'Send me a link' }).click();
  await expect(page.getByRole('heading', { name: 'Check your mail' })).toBeVisible();
  await expect(page.getByRole('status')).toContainText(user.email);

  await expect(async () => {
    await page.goto(`/dev/mail?to=${encodeURIComponent(user.email)}`);
    await expect(page.getByTestId('outbox').getByRole('link', { name: /new Selfsown password/ }).first()).toBeVisible({ timeout: 1000 });
  }).toPass({ timeout: 10_000 });
  await page.getByTestId('outbox').getByRole('link', { name: /new Selfsown password/ }).first().click();
  await page.getByTestId('mail-body').locator('a[href*="/api/auth/reset-password/"]').first().click();
  await expect(page).toHaveURL(/\/reset-password\?token=/);

  await page.getByLabel('New password').fill(NEW_PASSWORD);
  await page.getByLabel('The same password again').fill(`${NEW_PASSWORD}x`);
  await page.getByRole('button', { name: 'Set the new password' }).click();
  await expect(page.locator('#confirm-error')).toHaveText('The two passwords differ.');
  await expect(page.getByLabel('The same password again')).toBeFocused();

  await page.getByLabel('The same password again').fill(NEW_PASSWORD);
  await page.getByRole('button', { name: 'Set the new password' }).click();
  await expect(page.getByRole('heading', { name: 'Password changed' })).toBeVisible();

  await page.goto('/sign-in?next=%2Fhouseholds');
  await page.getByLabel('E-mail').fill(user.email);
  await page.getByLabel('Password').fill(user.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'do not match an account' })).toBeVisible();
  await page.getByLabel('Password').fill(NEW_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/households$/);
});
