import type { Page } from '@playwright/test';
import { expect, test, waitForIslands } from './fixtures';
import { randomBytes } from 'node:crypto';

const PASSWORD = 'turnip-harvest-2041';
const email = (tag: string) => `${tag}-${randomBytes(4).toString('hex')}@test.selfsown.invalid`;

/** Opens the newest mail to `to` in the local outbox and follows its first link containing `linkPart`. */
async function followMailLink(page: Page, to: string, subject: RegExp, linkPart: string) {
  await expect(async () => {
    await page.goto(`/dev/mail?to=${encodeURIComponent(to)}`);
    await expect(page.getByTestId('outbox').getByRole('link', { name: subject }).first()).toBeVisible({ timeout: 1000 });
  }).toPass({ timeout: 10_000 });
  await page.getByTestId('outbox').getByRole('link', { name: subject }).first().click();
  await expect(page.getByTestId('mail-to')).toHaveText(to);
  await page.getByTestId('mail-body').locator(`a[href*="${linkPart}"]`).first().click();
}

async function signUp(page: Page, name: string, address: string | null) {
  await page.getByLabel('Your name').fill(name);
  if (address) await page.getByLabel('E-mail').fill(address);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Create my account' }).click();
  await expect(page.getByRole('heading', { name: 'Check your mail' })).toBeVisible();
}

test('an owner signs up, starts a household and invites a second person, who joins from the mailed link', async ({ page, browser }) => {
  const ownerEmail = email('owner');
  const growerEmail = email('grower');

  // The owner signs up and confirms the address from the local outbox.
  await page.goto('/sign-up');
  await signUp(page, 'Rowan Owner', ownerEmail);
  await followMailLink(page, ownerEmail, /Confirm your e-mail/, '/api/auth/verify-email');
  await expect(page.getByRole('heading', { name: 'Your address is confirmed' })).toBeVisible();
  await expect(page.getByTestId('signed-in-as')).toHaveText(ownerEmail);
  await page.getByTestId('verify-continue').click();

  // … starts a household.
  await expect(page).toHaveURL(/\/households$/);
  await page.getByLabel('Name').fill('Larkspur Allotment');
  await page.getByLabel('US (oz, lb)').check();
  await page.getByLabel('The growing year starts in').selectOption('3');
  await page.getByRole('button', { name: 'Create the household' }).click();
  await expect(page).toHaveURL(/\/households\/\d+$/);
  await expect(page.getByTestId('household-name')).toHaveText('Larkspur Allotment');
  await expect(page.getByTestId('overview-role')).toHaveText('owner');
  await expect(page.getByText('March')).toBeVisible();
  const householdUrl = page.url();

  // … and invites a grower.
  await page.getByRole('navigation', { name: 'Household' }).getByRole('link', { name: 'Members' }).click();
  await page.getByLabel('Their e-mail').fill(growerEmail);
  await page.getByLabel('Their role').selectOption('grower');
  await page.getByRole('button', { name: 'Send the invitation' }).click();
  await expect(page.getByText(`Invitation sent to ${growerEmail}.`)).toBeVisible();
  await expect(page.getByTestId('invitation-list')).toContainText(growerEmail);

  // The second person, in a browser of their own, opens the mail and follows the link.
  const other = await browser.newContext();
  const p2 = waitForIslands(await other.newPage());
  await followMailLink(p2, growerEmail, /invites you to Larkspur Allotment/, '/invite/');
  await expect(p2.getByTestId('invite-household')).toHaveText('Larkspur Allotment');
  await expect(p2.getByTestId('invite-role')).toHaveText('grower');
  await p2.getByRole('main').getByRole('link', { name: 'Create an account' }).click();
  // The address comes filled in from the invitation.
  await expect(p2.getByLabel('E-mail')).toHaveValue(growerEmail);
  await signUp(p2, 'Sage Grower', null);
  await followMailLink(p2, growerEmail, /Confirm your e-mail/, '/api/auth/verify-email');
  await p2.getByRole('link', { name: 'Continue to the invitation' }).click();
  await p2.getByRole('button', { name: 'Join Larkspur Allotment' }).click();

  // They see the household, as grower, and it is in their switcher.
  await expect(p2).toHaveURL(householdUrl);
  await expect(p2.getByTestId('household-name')).toHaveText('Larkspur Allotment');
  await expect(p2.getByTestId('overview-role')).toHaveText('grower');
  await p2.getByTestId('household-switcher').locator('summary').click();
  await expect(p2.getByTestId('household-switcher').getByRole('link', { name: /Larkspur Allotment/ })).toBeVisible();

  // The owner sees the new member.
  await page.reload();
  await expect(page.getByTestId('member-list')).toContainText('Sage Grower');
  await expect(page.getByTestId('invitation-list')).not.toContainText(growerEmail);
  await other.close();

  // Signing out ends it: the household's pages ask for sign-in again.
  await page.getByTestId('household-switcher').locator('summary').click();
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/$/);
  await expect(page.getByRole('banner').getByRole('link', { name: 'Sign in' })).toBeVisible();
  await page.goto(householdUrl);
  await expect(page).toHaveURL(/\/sign-in\?next=/);
});

test('forms say what is wrong next to the field, and sign-in failures in an alert', async ({ page }) => {
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Short Password');
  await page.getByLabel('E-mail').fill('not-an-address');
  await page.getByLabel('Password').fill('short');
  await page.getByRole('button', { name: 'Create my account' }).click();
  const emailField = page.getByLabel('E-mail');
  await expect(emailField).toHaveAttribute('aria-invalid', 'true');
  await expect(emailField).toBeFocused();
  await expect(page.locator('#email-error')).toHaveText(/e-mail address/);
  await expect(emailField).toHaveAttribute('aria-describedby', /email-error/);
  await expect(page.getByLabel('Password')).toHaveAttribute('aria-invalid', 'true');
  await expect(page.locator('#password-error')).toHaveText('Use at least 10 characters.');

  await page.goto('/sign-in?next=%2Fhouseholds');
  await page.getByLabel('E-mail').fill(email('nobody'));
  await page.getByLabel('Password').fill('wrong-password-here');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'do not match an account' })).toBeVisible();
});

test('a signed-out visitor of a household page is sent to sign-in and back', async ({ page }) => {
  await page.goto('/households/1/members');
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fhouseholds%2F1%2Fmembers$/);
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
});
