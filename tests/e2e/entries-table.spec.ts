/**
 * The harvest log's table on a wide screen: the column headers sort on the server (newest or
 * heaviest first, then the other way), the pager walks the pages of 25, and a new filter starts
 * again at the first page.
 */
import type { BrowserContext } from '@playwright/test';
import { expect, test } from './fixtures';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { BASE_URL, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

async function signInAs(context: BrowserContext, user: TestUser) {
  await context.addCookies(
    user.cookie.split('; ').map((pair) => {
      const i = pair.indexOf('=');
      return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
    }),
  );
}

test('the harvest log sorts by its headers and pages through 27 weighings', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Tia Tables' });
  const h = await createHousehold(owner.cookie, { name: 'Table plot', timezone: 'Europe/Berlin', units: 'metric' });
  // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
  const crop = await makeCrop(owner.cookie, h.id, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  // Day d of July 2025 weighs 28 − d kg: the newest entry is the lightest.
  for (let d = 1; d <= 27; d++) {
    await logHarvest(owner.cookie, h.id, { cropId: crop.id, date: `2025-07-${String(d).padStart(2, '0')}`, quantity: 28 - d, unit: 'kg', use: 'fresh' });
  }
  await signInAs(context, owner);
  await page.goto(`/households/${h.id}/harvests`);

  const rows = page.getByTestId('harvest-row');
  const weighed = (i: number) => rows.nth(i).locator('td').nth(2);
  const dateHeader = page.getByRole('columnheader', { name: /^Date/ });
  const weighedHeader = page.getByRole('columnheader', { name: /^Weighed/ });

  // Newest first by default, 25 to a page.
  await expect(page.getByTestId('totals')).toContainText('27 entries');
  await expect(rows).toHaveCount(25);
  await expect(dateHeader).toHaveAttribute('aria-sort', 'descending');
  await expect(weighedHeader).toHaveAttribute('aria-sort', 'none');
  await expect(weighed(0)).toHaveText('1 kg');
  await expect(page.getByText('Page 1 of 2')).toBeVisible();
  await expect(page.getByRole('button', { name: '← Newer' })).toBeDisabled();

  // The second page holds the two oldest.
  await page.getByRole('button', { name: 'Older →' }).click();
  await expect(page.getByText('Page 2 of 2')).toBeVisible();
  await expect(rows).toHaveCount(2);
  await expect(weighed(0)).toHaveText('26 kg');
  await expect(page.getByRole('button', { name: 'Older →' })).toBeDisabled();
  await page.getByRole('button', { name: '← Newer' }).click();
  await expect(page.getByText('Page 1 of 2')).toBeVisible();

  // A header sorts heaviest first, then lightest first; the date header lets go.
  await weighedHeader.getByRole('button').click();
  await expect(weighedHeader).toHaveAttribute('aria-sort', 'descending');
  await expect(dateHeader).toHaveAttribute('aria-sort', 'none');
  await expect(weighed(0)).toHaveText('27 kg');
  await weighedHeader.getByRole('button').click();
  await expect(weighedHeader).toHaveAttribute('aria-sort', 'ascending');
  await expect(weighed(0)).toHaveText('1 kg');
  await dateHeader.getByRole('button').click();
  await expect(dateHeader).toHaveAttribute('aria-sort', 'descending');
  await dateHeader.getByRole('button').click();
  await expect(dateHeader).toHaveAttribute('aria-sort', 'ascending');
  await expect(weighed(0)).toHaveText('27 kg');

  // On page 2, a filter goes back to page 1.
  await page.getByRole('button', { name: 'Older →' }).click();
  await expect(page.getByText('Page 2 of 2')).toBeVisible();
  await page.getByLabel('Month', { exact: true }).fill('2025-07');
  await expect(page.getByText('Page 1 of 2')).toBeVisible();
  await expect(rows).toHaveCount(25);
  await page.getByRole('button', { name: 'Clear filters' }).click();
  await expect(page.getByText('Page 1 of 2')).toBeVisible();
});
