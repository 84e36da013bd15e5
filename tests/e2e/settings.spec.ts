/**
 * Household settings: the owner renames the household (the header follows at once and after a
 * reload), then deletes it behind the typed confirmation and lands on the list without it; a
 * grower has no Settings tab and the page refuses them.
 */
import { expect, test } from './fixtures';
import { BASE_URL } from '../support/env';
import { apiAs, householdWithRoles } from '../support/users';

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

test('an owner renames the household, then deletes it after typing its exact name', async ({ page, context }) => {
  const f = await householdWithRoles({ name: 'Old Orchard', timezone: 'Europe/Berlin' });
  const id = f.household.id;
  await context.addCookies(cookiesFor(f.owner.cookie));

  await page.goto(`/households/${id}`);
  await expect(page.getByRole('navigation', { name: 'Household' }).getByRole('link', { name: 'Settings' })).toHaveAttribute('href', `/households/${id}/settings`);
  await page.goto(`/households/${id}/settings`);

  const details = page.getByTestId('household-settings-form');
  await details.getByLabel('Name').fill('New Orchard');
  await details.getByLabel('The growing year starts in').selectOption('10');
  await expect(page.getByTestId('settings-change-notes')).toContainText('The growing year will run October to September');
  await details.getByRole('button', { name: 'Save household' }).click();
  await expect(details.getByText('Saved.')).toBeVisible();
  await expect(page.getByTestId('household-name')).toHaveText('New Orchard');
  expect((await apiAs(f.owner.cookie, 'GET', `/api/households/${id}`)).body.household).toMatchObject({ name: 'New Orchard', yearStartMonth: 10 });
  await page.reload();
  await expect(page.getByTestId('household-name')).toHaveText('New Orchard');

  // The danger zone offers the exports before the delete button.
  const danger = page.getByTestId('danger-zone');
  await expect(danger.getByRole('link', { name: 'Whole household backup (JSON)' })).toHaveAttribute('href', `/api/households/${id}/exports/backup.json`);
  await expect(danger).toContainText('cannot be undone');
  const del = danger.getByRole('button', { name: 'Delete this household for good' });
  await expect(del).toBeDisabled();
  const confirm = danger.getByLabel('Type the household’s name to confirm');
  await confirm.fill('Old Orchard');
  await expect(del).toBeDisabled();
  await confirm.fill('new orchard');
  await expect(del).toBeDisabled();
  await confirm.fill('New Orchard');
  await expect(del).toBeEnabled();
  await del.click();

  await expect(page).toHaveURL(/\/households\?deleted=1$/);
  await expect(page.getByTestId('deleted-notice')).toContainText('was deleted');
  await expect(page.getByText('New Orchard')).toHaveCount(0);
  expect((await apiAs(f.owner.cookie, 'GET', `/api/households/${id}`)).status).toBe(404);
});

test('a grower sees no Settings tab and the settings page refuses them', async ({ page, context }) => {
  const f = await householdWithRoles({ name: 'Shared Plot' });
  await context.addCookies(cookiesFor(f.grower.cookie));
  await page.goto(`/households/${f.household.id}`);
  const tabs = page.getByRole('navigation', { name: 'Household' });
  await expect(tabs.getByRole('link', { name: 'Members' })).toBeVisible();
  await expect(tabs.getByRole('link', { name: 'Settings' })).toHaveCount(0);

  const r = await page.goto(`/households/${f.household.id}/settings`);
  expect(r?.status()).toBe(403);
  await expect(page.getByRole('heading', { name: 'Not with your role' })).toBeVisible();
  await expect(page.getByTestId('danger-zone')).toHaveCount(0);
});
