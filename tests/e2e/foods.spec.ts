import { expect, test } from './fixtures';

test('a visitor searches the reference foods and opens one', async ({ page }) => {
  await page.goto('/foods');
  await page.getByLabel('Search reference foods').fill('butternut raw');
  await page.getByRole('button', { name: 'Search' }).click();
  const first = page.getByTestId('food-results').getByRole('link').first();
  await expect(first).toContainText('Squash, winter, butternut, raw');
  await first.click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Squash, winter, butternut, raw');
  // USDA SR28, NDB 11485: 16 % refuse, 45 kcal per 100 g
  await expect(page.getByTestId('food-code')).toHaveText('11485');
  await expect(page.getByTestId('refuse')).toHaveText('16 %');
  await expect(page.locator('tr[data-key="energy_kcal"] td')).toHaveText('45 kcal');
  await expect(page.getByText('USDA National Nutrient Database for Standard Reference, Release 28').first()).toBeVisible();
});
