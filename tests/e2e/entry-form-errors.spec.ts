/**
 * The bought-food and crop forms answer bad input next to the field, in the endpoint schema's (or
 * the form's) words, and move the focus there; nothing is sent until the input is fixed.
 */
import type { BrowserContext } from '@playwright/test';
import { expect, test } from './fixtures';
import { allPurchases } from '../support/entries';
import { BASE_URL, createHousehold, newVerifiedUser } from '../support/users';

async function plot(context: BrowserContext) {
  const owner = await newVerifiedUser({ name: 'Eve Errors' });
  const h = await createHousehold(owner.cookie, { name: 'Error plot', timezone: 'Europe/Berlin', units: 'metric' });
  await context.addCookies(
    owner.cookie.split('; ').map((pair) => {
      const i = pair.indexOf('=');
      return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
    }),
  );
  return { owner, h };
}

test('the bought-food form names the missing food and the missing currency', async ({ page, context }) => {
  const { owner, h } = await plot(context);
  await page.goto(`/households/${h.id}/bought`);
  await page.getByRole('button', { name: 'Save bought food' }).click();
  await expect(page.getByText('Choose the food you bought from the reference foods.')).toBeVisible();
  await expect(page.locator('#p-food')).toBeFocused();

  await page.getByLabel('Food bought').fill('wheat flour whole');
  await page.getByRole('listbox').getByRole('option').first().click();
  await page.getByLabel('Weight', { exact: true }).fill('2');
  await page.getByLabel('Price (optional)').fill('3');
  await page.getByLabel('Currency').fill('');
  await page.getByRole('button', { name: 'Save bought food' }).click();
  await expect(page.getByText('Give the currency of the price, e.g. EUR or USD.')).toBeVisible();
  await expect(page.locator('#p-currency')).toBeFocused();
  expect((await allPurchases(owner.cookie, h.id)).total).toBe(0);

  await page.getByLabel('Currency').fill('eur');
  await page.getByRole('button', { name: 'Save bought food' }).click();
  await expect(page.getByTestId('purchase-saved')).toContainText('2 kg');
  expect((await allPurchases(owner.cookie, h.id)).total).toBe(1);
});

test('the crop form asks for a name and refuses an eaten share over 100 %', async ({ page, context }) => {
  const { h } = await plot(context);
  await page.goto(`/households/${h.id}/crops`);
  await page.getByRole('button', { name: 'Add a crop' }).click();
  await page.getByRole('button', { name: 'Add crop' }).click();
  await expect(page.getByText('Give the crop a name.')).toBeVisible();
  await expect(page.locator('#crop-new-name')).toBeFocused();

  await page.getByLabel('Name', { exact: true }).fill('Leek');
  await page.getByLabel(/Share you eat/).fill('150');
  await page.getByRole('button', { name: 'Add crop' }).click();
  await expect(page.getByText('The edible fraction can be at most 1 (all of it eaten).')).toBeVisible();
  await expect(page.locator('#crop-new-eaten')).toBeFocused();

  await page.getByLabel(/Share you eat/).fill('80');
  await page.getByRole('button', { name: 'Add crop' }).click();
  await expect(page.getByText('Leek is added.', { exact: false })).toBeVisible();
  await expect(page.getByTestId('crop-card')).toContainText('80 %');
});
